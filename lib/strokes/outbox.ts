// The editor's persistent outbox. An operation is written to storage before it
// is sent and leaves only when the server acknowledges its batch, so a reload
// or a lost connection loses nothing. Batch ids are fixed when a batch is
// sealed, so a retry is recognised by the server and applied once.
import type { Op } from './types';

export type Batch = { batchId: string; ops: Op[] };
export type KeyValueStore = { getItem(k: string): string | null; setItem(k: string, v: string): void; removeItem(k: string): void };

type Saved = { v: 1; sealed: Batch[]; open: Op[] };

/** Seal a batch early when it grows past this many characters of JSON. */
const SEAL_AT_CHARS = 400_000;

export class Outbox {
  private sealed: Batch[] = [];
  private open: Op[] = [];
  private openChars = 0;

  constructor(
    private store: KeyValueStore,
    private key: string,
    private makeId: () => string,
  ) {
    const raw = store.getItem(key);
    if (raw) {
      try {
        const saved = JSON.parse(raw) as Saved;
        if (saved.v === 1) {
          this.sealed = saved.sealed ?? [];
          this.open = saved.open ?? [];
        }
      } catch {
        // A damaged entry cannot be read back; keep it aside rather than lose it silently.
        store.setItem(`${key}:damaged:${Date.now()}`, raw);
      }
    }
  }

  private persist() {
    if (this.sealed.length === 0 && this.open.length === 0) this.store.removeItem(this.key);
    else this.store.setItem(this.key, JSON.stringify({ v: 1, sealed: this.sealed, open: this.open } satisfies Saved));
  }

  push(...ops: Op[]) {
    this.open.push(...ops);
    this.openChars += JSON.stringify(ops).length;
    if (this.openChars > SEAL_AT_CHARS) this.seal();
    else this.persist();
  }

  /** Turns the open operations into a batch with a fixed id. */
  seal() {
    if (this.open.length > 0) {
      this.sealed.push({ batchId: this.makeId(), ops: this.open });
      this.open = [];
      this.openChars = 0;
    }
    this.persist();
  }

  /** The next batch to send (the oldest), if any. */
  next(): Batch | undefined {
    return this.sealed[0];
  }

  /** The server has this batch: forget it. */
  ack(batchId: string) {
    this.sealed = this.sealed.filter((b) => b.batchId !== batchId);
    this.persist();
  }

  /** Replaces a sealed batch, in place, by one batch per operation (new ids): to find which one the server refuses. */
  split(batchId: string) {
    const i = this.sealed.findIndex((b) => b.batchId === batchId);
    if (i < 0) return;
    this.sealed.splice(i, 1, ...this.sealed[i]!.ops.map((op) => ({ batchId: this.makeId(), ops: [op] })));
    this.persist();
  }

  /**
   * Sets a refused batch aside on this device instead of dropping it: a drawn stroke
   * is never thrown away. Kept operations stay readable under `<key>:kept`.
   */
  keep(batchId: string, reason: string) {
    const batch = this.sealed.find((b) => b.batchId === batchId);
    if (!batch) return;
    const keptKey = `${this.key}:kept`;
    let kept: { reason: string; ops: Op[] }[] = [];
    try {
      kept = JSON.parse(this.store.getItem(keptKey) ?? '[]') as typeof kept;
    } catch {
      kept = [];
    }
    kept.push({ reason, ops: batch.ops });
    this.store.setItem(keptKey, JSON.stringify(kept));
    this.ack(batchId);
  }

  /** Operations set aside after a refusal, with the reasons. */
  kept(): { reason: string; ops: Op[] }[] {
    try {
      return JSON.parse(this.store.getItem(`${this.key}:kept`) ?? '[]') as { reason: string; ops: Op[] }[];
    } catch {
      return [];
    }
  }

  /** Every operation not yet acknowledged, oldest first. */
  pendingOps(): Op[] {
    return [...this.sealed.flatMap((b) => b.ops), ...this.open];
  }

  get waiting(): number {
    return this.sealed.reduce((n, b) => n + b.ops.length, 0) + this.open.length;
  }
}
