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
import { keptQuery } from '../kept-query';
import { whileUnchanged } from '../unchanged';
import { type StampMark, clearReadyStamps, readyStampStands } from './stamps';

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
 * A gag's row with its newest pass and its newest stamp (and the number of the pass it names), in one
 * query: each is a correlated subquery over an index, the same SQL however large the board.
 */
function gagRows(db: Kysely<Database>) {
  return db
    .selectFrom('gags as g')
    .leftJoin('passes as lp', (join) =>
      join
        .onRef('lp.gagId', '=', 'g.id')
        .on((eb) =>
          eb('lp.id', '=', eb.selectFrom('passes as p2').select('p2.id').whereRef('p2.gagId', '=', 'g.id').orderBy('p2.number', 'desc').limit(1)),
        ),
    )
    .leftJoin('stamps as s', (join) =>
      join
        .onRef('s.gagId', '=', 'g.id')
        .on((eb) =>
          eb(
            's.id',
            '=',
            eb
              .selectFrom('stamps as s2')
              .select('s2.id')
              .whereRef('s2.gagId', '=', 'g.id')
              .orderBy('s2.createdAt', 'desc')
              .orderBy('s2.id', 'desc')
              .limit(1),
          ),
        ),
    )
    .leftJoin('passes as sp', 'sp.id', 's.passId')
    .select([
      'g.id',
      'g.seriesId',
      'g.title',
      'g.premise',
      'g.status',
      'g.position',
      'g.createdAt',
      'g.updatedAt',
      'lp.id as latestPassId',
      'lp.number as latestPassNumber',
      'lp.seq as latestPassSeq',
      's.passId as stampPassId',
      'sp.number as stampPassNumber',
      's.decision as stampDecision',
      's.clearedAt as stampClearedAt',
    ]);
}
type GagRow = Awaited<ReturnType<ReturnType<typeof gagRows>['execute']>>[number];
type BeatRow = Pick<Selectable<BeatsTable>, 'gagId' | 'kind' | 'note' | 'updatedAt'>;

const boardGags = keptQuery((db, seriesId: string) => gagRows(db).where('g.seriesId', '=', seriesId).orderBy('g.position'));
const oneGag = keptQuery((db, gagId: string) => gagRows(db).where('g.id', '=', gagId));
const boardBeats = keptQuery((db, seriesId: string) =>
  db
    .selectFrom('beats as b')
    .innerJoin('gags as g', 'g.id', 'b.gagId')
    .select(['b.gagId', 'b.kind', 'b.note', 'b.updatedAt'])
    .where('g.seriesId', '=', seriesId),
);
const gagBeats = keptQuery((db, gagId: string) => db.selectFrom('beats').select(['gagId', 'kind', 'note', 'updatedAt']).where('gagId', '=', gagId));

function toDtos(rows: GagRow[], beats: BeatRow[]): GagDto[] {
  const byGag = new Map<string, BeatDto[]>();
  for (const b of beats) {
    const list = byGag.get(b.gagId) ?? [];
    list.push({ kind: b.kind, note: b.note, updatedAt: b.updatedAt });
    byGag.set(b.gagId, list);
  }
  return rows.map((r) => {
    const list = (byGag.get(r.id) ?? []).sort((a, b) => beatOrder(a.kind) - beatOrder(b.kind));
    return {
      id: r.id,
      seriesId: r.seriesId,
      title: r.title,
      premise: r.premise,
      status: r.status,
      position: r.position,
      createdAt: r.createdAt,
      updatedAt: r.updatedAt,
      beats: list,
      beatsWritten: list.filter((b) => b.note.trim() !== '').length,
      latestPass: r.latestPassId !== null ? { id: r.latestPassId, number: r.latestPassNumber!, seq: r.latestPassSeq! } : null,
      stamp:
        r.stampPassId !== null && r.stampDecision !== null
          ? {
              passId: r.stampPassId,
              passNumber: r.stampPassNumber!,
              decision: r.stampDecision,
              standing: r.stampDecision === 'ready' && r.stampClearedAt === null,
            }
          : null,
    };
  });
}

/** A series' board: its gags in board order, each with its beats, newest pass and newest stamp. Two queries, compiled once. */
export async function listGags(db: Db, seriesId: string): Promise<GagDto[]> {
  const [rows, beats] = [await boardGags(db, seriesId), await boardBeats(db, seriesId)];
  return toDtos(rows, beats);
}

/**
 * The board's answer as JSON bytes, kept while the database is unchanged (db/unchanged.ts): readers of a
 * quiet series get the bytes made for the first of them.
 */
export const boardJson = whileUnchanged(async (db, seriesId) => Buffer.from(JSON.stringify(await listGags(db, seriesId))), { max: 256 });

export async function findGag(db: Db, gagId: string): Promise<GagDto | undefined> {
  const rows = await oneGag(db, gagId);
  if (rows.length === 0) return undefined;
  return toDtos(rows, await gagBeats(db, gagId))[0];
}

const gagSeries = keptQuery((db, gagId: string) => db.selectFrom('gags').select('seriesId').where('id', '=', gagId));

export async function seriesOfGag(db: Db, gagId: string): Promise<string | null> {
  const [row] = await gagSeries(db, gagId);
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
