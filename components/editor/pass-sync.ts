// Keeps one pass in step with the server: applies local operations at once
// (optimistic), saves them through the persistent outbox, sends batches one at
// a time, and reads everyone else's changes (?since=seq) when the page's live
// stream announces a new seq or (re)opens. Without a stream it polls every second.
import { nanoid } from 'nanoid';
import { Outbox } from '@/lib/strokes/outbox';
import { type PassDoc, applyDelta, applyOp, docFrom } from '@/lib/strokes/pass-model';
import type { Lightbox, Op, Room, Stroke } from '@/lib/strokes/types';
import { PassReader } from '@/lib/strokes/wire';
import { passRequest, takePrefetched } from './pass-prefetch';

export type SyncState = 'saved' | 'saving' | 'offline' | 'refused';
export type SyncStatus = { state: SyncState; waiting: number; message: string | null };
/**
 * `items`: balloon rooms or lightboxes changed (they are not in the panel bitmaps).
 * `added`: strokes that only need drawing on top of what the panels show (the pass arriving).
 */
export type DocChange = { panels: Set<number>; full: boolean; items: boolean; added?: Stroke[] };

type ServerState = { seq: number; strokes: Stroke[]; rooms: Room[]; lightboxes: Lightbox[] };
type ServerDelta = ServerState & { removedStrokes: string[]; removedRooms: string[]; removedLightboxes: string[] };

/** Polling while there is no live stream… */
const POLL_MS = 1000;
/** …and a slow safety net while there is one. */
const LIVE_SAFETY_POLL_MS = 30_000;
const SEAL_AFTER_MS = 150;

export class PassSync {
  doc: PassDoc;
  seq: number;
  private outbox: Outbox;
  private unsynced: { seq: number; ops: Op[] }[] = [];
  private sending = false;
  /** Bumped whenever a send starts: a poll that overlapped a send is thrown away. */
  private sendEpoch = 0;
  private failures = 0;
  private status: SyncStatus = { state: 'saved', waiting: 0, message: null };
  private docListeners = new Set<(c: DocChange) => void>();
  private statusListeners = new Set<(s: SyncStatus) => void>();
  private timers: ReturnType<typeof setTimeout>[] = [];
  private sealTimer: ReturnType<typeof setTimeout> | null = null;
  private retryTimer: ReturnType<typeof setTimeout> | null = null;
  private pollTimer: ReturnType<typeof setInterval> | null = null;
  private live = false;
  /** A poll was asked for while a batch was in flight: run it when the send ends. */
  private pollWanted = false;
  private stopped = false;
  private readonly onOnline = () => void this.kick();

  /** The pass has been read from the server (at construction, or by the first load). */
  loaded: boolean;
  private loading = false;

  /** With `initial` null, `start` reads the pass from the server (packed), drawing it as it arrives. */
  constructor(
    private passId: string,
    initial: ServerState | null,
    storage: Storage,
    private readOnly = false,
  ) {
    this.doc = docFrom(initial?.strokes ?? [], initial?.rooms ?? [], initial?.lightboxes ?? []);
    this.seq = initial?.seq ?? 0;
    this.loaded = initial !== null;
    this.outbox = new Outbox(storage, `quadrille.outbox.${passId}`, () => nanoid());
  }

  start() {
    // Work that was drawn but not acknowledged before a reload: show it, then send it. Strokes the
    // server refused stay on screen too (kept on this device), and the problem is said.
    for (const op of this.localOnly()) applyOp(this.doc, op);
    const kept = this.outbox.kept();
    if (kept.length)
      this.status = {
        ...this.status,
        message: `${kept.length} stroke${kept.length === 1 ? '' : 's'} could not be saved (${kept[0]!.reason}); kept on this device.`,
      };
    this.emitDoc({ panels: new Set([0, 1, 2, 3]), full: true, items: true });
    if (!this.readOnly) {
      this.outbox.seal();
      window.addEventListener('online', this.onOnline);
      void this.kick();
    }
    this.schedulePolling();
    // Read the pass now; or, given with the page, catch up once: the page was rendered a moment ago,
    // and the stream's first hello may have come before we listened.
    if (!this.loaded) void this.resync({ progressive: true });
    else void this.poll();
    this.updateStatus();
  }

  private schedulePolling() {
    if (this.pollTimer) clearInterval(this.pollTimer);
    if (this.stopped) return;
    this.pollTimer = setInterval(() => void this.poll(), this.live ? LIVE_SAFETY_POLL_MS : POLL_MS);
  }

  /** The page's stream opened (true) or dropped (false): poll only while it is down. */
  setLive(connected: boolean) {
    if (connected === this.live) return;
    this.live = connected;
    this.schedulePolling();
  }

  /** An event of the page's stream: a new seq of this pass, or a (re)opening to catch up from. */
  onLive(e: { topic: string; type: string; seq?: number }) {
    if (e.type === 'open' || e.type === 'resync' || (e.type === 'seq' && e.topic === `pass:${this.passId}` && (e.seq ?? Infinity) > this.seq)) {
      if (this.sending) this.pollWanted = true;
      else void this.poll();
    }
  }

  stop() {
    this.stopped = true;
    if (this.pollTimer) clearInterval(this.pollTimer);
    if (this.sealTimer) clearTimeout(this.sealTimer);
    if (this.retryTimer) clearTimeout(this.retryTimer);
    this.timers.forEach(clearTimeout);
    window.removeEventListener('online', this.onOnline);
  }

  onDoc(fn: (c: DocChange) => void) {
    this.docListeners.add(fn);
    return () => this.docListeners.delete(fn);
  }

  onStatus(fn: (s: SyncStatus) => void) {
    this.statusListeners.add(fn);
    fn(this.status);
    return () => this.statusListeners.delete(fn);
  }

  /** Applies local operations now and queues them for the server. Returns the panels touched. */
  commit(ops: Op[], opts: { emit?: boolean } = {}): Set<number> {
    if (this.readOnly || ops.length === 0) return new Set();
    const touched = new Set<number>();
    let items = false;
    for (const op of ops) {
      applyOp(this.doc, op, touched);
      if (op.op !== 'add' && op.op !== 'remove' && op.op !== 'move') items = true;
    }
    this.outbox.push(...ops);
    if (opts.emit !== false) this.emitDoc({ panels: touched, full: false, items });
    if (this.sealTimer) clearTimeout(this.sealTimer);
    this.sealTimer = setTimeout(() => this.flush(), SEAL_AFTER_MS);
    this.updateStatus();
    return touched;
  }

  /** Seals what is open and starts sending. */
  flush() {
    if (this.sealTimer) clearTimeout(this.sealTimer);
    this.sealTimer = null;
    this.outbox.seal();
    void this.kick();
  }

  private emitDoc(c: DocChange) {
    for (const fn of this.docListeners) fn(c);
  }

  private updateStatus(patch: Partial<SyncStatus> = {}) {
    const waiting = this.outbox.waiting;
    let state: SyncState = this.status.state === 'refused' ? 'refused' : waiting > 0 ? (this.failures > 0 ? 'offline' : 'saving') : 'saved';
    if (patch.state) state = patch.state;
    this.status = { state, waiting, message: patch.message !== undefined ? patch.message : this.status.message };
    for (const fn of this.statusListeners) fn(this.status);
  }

  private async kick() {
    if (this.sending || this.stopped || this.readOnly) return;
    this.sending = true;
    try {
      for (let batch = this.outbox.next(); batch && !this.stopped; batch = this.outbox.next()) {
        let res: Response;
        this.sendEpoch += 1;
        try {
          res = await fetch(`/api/passes/${this.passId}/ops`, {
            method: 'POST',
            headers: { 'content-type': 'application/json' },
            body: JSON.stringify(batch),
          });
        } catch {
          this.scheduleRetry();
          return;
        }
        if (res.ok) {
          const { seq } = (await res.json()) as { seq: number };
          this.outbox.ack(batch.batchId);
          this.unsynced.push({ seq, ops: batch.ops });
          this.failures = 0;
          this.updateStatus({ message: null });
          continue;
        }
        const body = (await res.json().catch(() => ({}))) as { error?: string };
        if (res.status === 422 || res.status === 413) {
          // Refused every time. Several operations: send them one by one, so the valid ones land.
          if (batch.ops.length > 1) {
            this.outbox.split(batch.batchId);
            continue;
          }
          const reason = body.error ?? String(res.status);
          if (batch.ops[0]?.op === 'add') {
            // A drawn stroke is never thrown away: it stays on this device, on screen, and the problem is said.
            this.outbox.keep(batch.batchId, reason);
            this.updateStatus({ message: `A stroke could not be saved (${reason}); it is kept on this device.` });
            continue;
          }
          this.outbox.ack(batch.batchId);
          this.updateStatus({ message: `A change was refused: ${reason}` });
          await this.resync();
          continue;
        }
        if (res.status === 401 || res.status === 403 || res.status === 404) {
          this.updateStatus({ state: 'refused', message: body.error ?? 'You can no longer save to this pass.' });
          return;
        }
        this.scheduleRetry();
        return;
      }
    } finally {
      this.sending = false;
      if (this.pollWanted && !this.stopped) {
        this.pollWanted = false;
        void this.poll();
      }
    }
  }

  private scheduleRetry() {
    this.failures += 1;
    this.updateStatus();
    const wait = Math.min(10_000, 500 * 2 ** Math.min(this.failures, 5));
    if (this.retryTimer) clearTimeout(this.retryTimer);
    this.retryTimer = setTimeout(() => void this.kick(), wait);
  }

  private unseenOps(serverSeq: number): Op[] {
    return [...this.unsynced.filter((u) => u.seq > serverSeq).flatMap((u) => u.ops), ...this.localOnly()];
  }

  async poll() {
    // Until the pass is read there is nothing to catch up from; while it is being read, read again after.
    if (this.loading || !this.loaded) {
      if (this.loading) this.pollWanted = true;
      return;
    }
    // While a batch is in flight we cannot tell whether a delta includes it; wait.
    if (this.stopped || this.sending) return;
    const epoch = this.sendEpoch;
    let delta: ServerDelta;
    try {
      const res = await fetch(`/api/passes/${this.passId}?since=${this.seq}`, { cache: 'no-store' });
      if (!res.ok) return;
      delta = (await res.json()) as ServerDelta;
    } catch {
      return;
    }
    if (delta.seq <= this.seq) return;
    if (this.sending || epoch !== this.sendEpoch) {
      // A send overlapped this read: it cannot be applied safely; read again when the send ends.
      this.pollWanted = true;
      return;
    }
    const touched = applyDelta(this.doc, delta, this.unseenOps(delta.seq));
    this.seq = delta.seq;
    this.unsynced = this.unsynced.filter((u) => u.seq > delta.seq);
    const items = delta.rooms.length + delta.removedRooms.length + delta.lightboxes.length + delta.removedLightboxes.length > 0;
    if (touched.size || items) this.emitDoc({ panels: touched, full: false, items });
  }

  /**
   * Reads the whole pass, packed (lib/strokes/wire.ts), and re-applies local work: at the start, and
   * after a refusal or a restore. `progressive` draws strokes as they arrive (the first read).
   * A read that fails keeps what is shown; the polls try again.
   */
  async resync(opts: { progressive?: boolean } = {}): Promise<boolean> {
    if (this.loading) return false;
    this.loading = true;
    try {
      const res = await ((opts.progressive && takePrefetched(this.passId)) || passRequest(this.passId));
      if (!res.ok || !res.body) return false;
      const reader = new PassReader();
      const strokes: Stroke[] = [];
      const body = res.body.getReader();
      for (;;) {
        const { done, value } = await body.read();
        if (done) break;
        const got = reader.push(value);
        strokes.push(...got);
        if (opts.progressive && got.length && !this.stopped) {
          // Shown (and erasable) as they come; the document is rebuilt from the whole read at the end.
          const shown = got.filter((st) => !this.doc.gone.has(st.id));
          for (const st of shown) this.doc.strokes.set(st.id, st);
          this.emitDoc({ panels: new Set(), full: false, items: false, added: shown });
        }
      }
      const header = reader.finish();
      performance.mark?.('quadrille:pass-read');
      if (this.stopped) return false;
      this.doc = docFrom(strokes, header.rooms, header.lightboxes);
      this.seq = header.seq;
      this.unsynced = [];
      const local = this.localOnly();
      for (const op of local) applyOp(this.doc, op);
      this.loaded = true;
      // Drawn as they came, the panels are already right unless local work changes them.
      const redraw = !opts.progressive || local.length > 0;
      this.emitDoc({ panels: redraw ? new Set([0, 1, 2, 3]) : new Set(), full: redraw, items: true });
      performance.mark?.('quadrille:pass-drawn');
      return true;
    } catch {
      return false;
    } finally {
      this.loading = false;
      if (this.pollWanted && !this.stopped && this.loaded) {
        this.pollWanted = false;
        void this.poll();
      }
    }
  }

  /** What this device has that the server does not: kept (refused) strokes, then the outbox. */
  private localOnly(): Op[] {
    return [...this.outbox.kept().flatMap((k) => k.ops), ...this.outbox.pendingOps()];
  }
}
