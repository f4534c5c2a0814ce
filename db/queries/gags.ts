// Gags with their four beats. Every write that touches a beat also bumps the
// gag's updatedAt, so "last change" on the board means any change.
import type { Kysely, Selectable, Transaction } from 'kysely';
import { BEAT_KINDS, type BeatKind, type GagStatus, checkArtMove, checkManualMove } from '@/lib/gags/status';
import { Refused } from '@/lib/refused';
import type { BeatsTable, Database, GagsTable } from '../database';
import { lockPassesOf, lockRow } from '../dialect';
import { recordActivity } from './activity';
import { artFacts } from './art-status';
import { setGagStatus } from './gag-status';
import { type StampMark, clearReadyStamps, readyStampStands, stampMarks } from './stamps';

export type BeatDto = Pick<Selectable<BeatsTable>, 'kind' | 'note' | 'updatedAt'>;
/** A gag as the app shows it: its row (but who started it), its beats, and its newest pass. */
export type GagDto = Omit<Selectable<GagsTable>, 'createdBy'> & {
  beats: BeatDto[];
  beatsWritten: number;
  /** The newest pass, for the board's thumbnail. */
  latestPass: { id: string; number: number; seq: number } | null;
  /** The newest stamp: which pass was approved ("ready", standing or cleared) or sent back ("again"). */
  stamp: StampMark | null;
};

type Db = Kysely<Database> | Transaction<Database>;

function beatOrder(kind: BeatKind): number {
  return BEAT_KINDS.indexOf(kind);
}

/**
 * The gags' beats, newest passes and stamp marks. `seriesId`, when the gags are a whole series' board,
 * selects them by a subquery rather than a list of ids: the SQL is then the same on every request
 * (one compiled statement, kept) however many gags the board holds.
 */
async function attachBeats(db: Db, gags: Omit<GagDto, 'beats' | 'beatsWritten' | 'latestPass' | 'stamp'>[], seriesId?: string): Promise<GagDto[]> {
  if (gags.length === 0) return [];
  const ofGags = seriesId ? (db as Kysely<Database>).selectFrom('gags').select('id').where('seriesId', '=', seriesId) : gags.map((g) => g.id);
  const passes = await db.selectFrom('passes').select(['id', 'gagId', 'number', 'seq']).where('gagId', 'in', ofGags).execute();
  const latest = new Map<string, { id: string; number: number; seq: number }>();
  for (const p of passes) {
    const cur = latest.get(p.gagId);
    if (!cur || p.number > cur.number) latest.set(p.gagId, { id: p.id, number: p.number, seq: p.seq });
  }
  const beats = await db.selectFrom('beats').select(['gagId', 'kind', 'note', 'updatedAt']).where('gagId', 'in', ofGags).execute();
  const marks = await stampMarks(db, ofGags);
  const byGag = new Map<string, BeatDto[]>();
  for (const b of beats) {
    const list = byGag.get(b.gagId) ?? [];
    list.push({ kind: b.kind, note: b.note, updatedAt: b.updatedAt });
    byGag.set(b.gagId, list);
  }
  return gags.map((g) => {
    const list = (byGag.get(g.id) ?? []).sort((a, b) => beatOrder(a.kind) - beatOrder(b.kind));
    return {
      ...g,
      beats: list,
      beatsWritten: list.filter((b) => b.note.trim() !== '').length,
      latestPass: latest.get(g.id) ?? null,
      stamp: marks.get(g.id) ?? null,
    };
  });
}

const GAG_COLUMNS = ['id', 'seriesId', 'title', 'premise', 'status', 'position', 'createdAt', 'updatedAt'] as const;

export async function listGags(db: Db, seriesId: string): Promise<GagDto[]> {
  const rows = await db.selectFrom('gags').select(GAG_COLUMNS).where('seriesId', '=', seriesId).orderBy('position').execute();
  return attachBeats(db, rows, seriesId);
}

export async function findGag(db: Db, gagId: string): Promise<GagDto | undefined> {
  const row = await db.selectFrom('gags').select(GAG_COLUMNS).where('id', '=', gagId).executeTakeFirst();
  if (!row) return undefined;
  const [gag] = await attachBeats(db, [row]);
  return gag;
}

export async function seriesOfGag(db: Db, gagId: string): Promise<string | null> {
  const row = await db.selectFrom('gags').select('seriesId').where('id', '=', gagId).executeTakeFirst();
  return row?.seriesId ?? null;
}

/** Appends a gag at the end of the board with four empty beats. */
export async function createGag(
  db: Kysely<Database>,
  input: {
    id: string;
    seriesId: string;
    title: string;
    premise: string;
    status?: GagStatus;
    notes?: Partial<Record<BeatKind, string>>;
    now?: string;
    createdBy?: string;
  },
): Promise<GagDto> {
  const now = input.now ?? new Date().toISOString();
  await db.transaction().execute(async (trx) => {
    // Two new gags at once must not share a board position.
    await lockRow(trx, 'series', input.seriesId);
    const last = await trx
      .selectFrom('gags')
      .select((eb) => eb.fn.max('position').as('max'))
      .where('seriesId', '=', input.seriesId)
      .executeTakeFirst();
    const position = (Number(last?.max ?? 0) || 0) + 1;
    await trx
      .insertInto('gags')
      .values({
        id: input.id,
        seriesId: input.seriesId,
        title: input.title,
        premise: input.premise,
        status: input.status ?? 'idea',
        position,
        createdBy: input.createdBy ?? null,
        createdAt: now,
        updatedAt: now,
      })
      .execute();
    if (input.createdBy) {
      await recordActivity(trx, {
        seriesId: input.seriesId,
        gagId: input.id,
        userId: input.createdBy,
        kind: 'gag.created',
        summary: `added the gag “${input.title}”`,
      });
    }
    await trx
      .insertInto('beats')
      .values(BEAT_KINDS.map((kind) => ({ gagId: input.id, kind, note: input.notes?.[kind] ?? '', updatedAt: now })))
      .execute();
  });
  const gag = await findGag(db, input.id);
  if (!gag) throw new Error('gag vanished after insert');
  return gag;
}

export async function updateGag(
  trx: Transaction<Database>,
  gagId: string,
  patch: { title?: string; premise?: string; status?: GagStatus; beats?: { kind: BeatKind; note: string }[] },
  userId: string | null,
): Promise<void> {
  const now = new Date().toISOString();
  if (patch.status && ['idea', 'thumbnailing', 'in_review'].includes(patch.status)) {
    // Pulled back to drafting by hand: a standing "ready to ink" stamp no longer holds.
    await clearReadyStamps(trx, gagId, now);
  }
  const { beats, status, ...fields } = patch;
  for (const beat of beats ?? []) {
    await trx.updateTable('beats').set({ note: beat.note, updatedAt: now }).where('gagId', '=', gagId).where('kind', '=', beat.kind).execute();
  }
  // A move by hand is told in the activity, as every status change is (gag-status.ts).
  if (status) await setGagStatus(trx, { gagId, to: status, userId, now });
  await trx
    .updateTable('gags')
    .set({ ...fields, updatedAt: now })
    .where('id', '=', gagId)
    .execute();
}

export type GagPatch = Parameters<typeof updateGag>[2];

/**
 * A person's edit of a gag: a status moved by hand must follow lib/gags/status (422 otherwise), and is
 * told in the activity as theirs. Returns whether the status changed.
 */
export async function patchGag(db: Kysely<Database>, gagId: string, patch: GagPatch, userId: string): Promise<{ moved: boolean }> {
  return db.transaction().execute(async (trx) => {
    // Two edits at once: the second checks its status move against the first's result.
    await lockRow(trx, 'gags', gagId);
    const current = await trx.selectFrom('gags').select('status').where('id', '=', gagId).executeTakeFirst();
    if (!current) throw new Refused(404, 'Not found.');
    const moved = !!patch.status && patch.status !== current.status;
    if (patch.status) {
      let check = checkManualMove(current.status, patch.status, { readyStampStands: await readyStampStands(trx, gagId) });
      if (check.ok && current.status !== patch.status) check = checkArtMove(patch.status, await artFacts(trx, gagId));
      if (!check.ok) throw new Refused(422, check.reason, [{ path: ['status'], message: check.reason, code: 'invalid_move' }]);
    }
    await updateGag(trx, gagId, patch, userId);
    return { moved };
  });
}

export async function deleteGag(db: Db, gagId: string): Promise<void> {
  await db.deleteFrom('gags').where('id', '=', gagId).execute();
}

/** Deletes a gag and tells the series' activity who did. */
export async function removeGag(db: Kysely<Database>, input: { gagId: string; seriesId: string; userId: string }): Promise<void> {
  const gag = await findGag(db, input.gagId);
  await db.transaction().execute(async (trx) => {
    // The delete cascades to the passes: take them before the gag, in the order a batch or a stamp does.
    await lockPassesOf(trx, input.gagId);
    await lockRow(trx, 'gags', input.gagId);
    await deleteGag(trx, input.gagId);
    await recordActivity(trx, {
      seriesId: input.seriesId,
      userId: input.userId,
      kind: 'gag.deleted',
      summary: `deleted the gag “${gag?.title ?? ''}”`,
    });
  });
}
