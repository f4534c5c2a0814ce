// Several writers at once, as two app instances would be. On PostgreSQL "instance
// B" is a second, independent pool on the same database, so the row locks are
// what keeps order. On SQLite (one instance by design) both are the process's one
// connection: better-sqlite3 is synchronous, so two connections in one thread
// would wait on each other's lock inside one event loop; the tests then check
// that concurrent requests of one instance interleave safely.
import { randomUUID } from 'node:crypto';
import { type Kysely, sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb } from '@/db/client';
import type { Database } from '@/db/database';
import { createGag } from '@/db/queries/gags';
import { acceptInvitation, createInvitation } from '@/db/queries/members';
import { createPass, passDelta, passState } from '@/db/queries/passes';
import { applyBatch } from '@/db/queries/batches';
import { stampPass } from '@/db/queries/stamps';
import { insertUser } from '@/db/queries/users';
import { addEntry, createVolume, listEntries, moveEntry } from '@/db/queries/volumes';
import { DEMO_SERIES_ID } from '@/db/seed/demo-data';
import { MAX_CLIENT_ATTEMPTS, MAX_FAILURES, claimAttempt, claimSignIn } from '@/lib/auth/throttle';
import { DEFAULT_PAGE_SPEC } from '@/lib/print/geometry';
import type { Op, Stroke } from '@/lib/strokes/types';
import { freshDb, testDbKind } from '../support/test-db';
import { Refused } from '@/lib/refused';

let a: Kysely<Database>;
let b: Kysely<Database>;
let extra: Kysely<Database>[] = [];

beforeAll(async () => {
  a = await freshDb();
  // A second, independent connection to the same database: "instance B".
  b = another();
});
afterAll(async () => {
  await Promise.all([b, ...extra].filter((d) => d !== a).map((d) => d.destroy()));
});

const another = () => (testDbKind() === 'postgres' ? createDb(process.env.DATABASE_URL) : a);

/** Opens a few connections in each pool first, so a burst really runs side by side. */
async function warm(dbs: Kysely<Database>[]) {
  await Promise.all(dbs.flatMap((db) => Array.from({ length: 6 }, () => sql`select 1`.execute(db))));
}

const stroke = (id: string, i: number): Stroke => ({
  id,
  panel: i % 4,
  tool: 'pen',
  grey: 80,
  size: 0.6,
  points: [
    [20 + (i % 30), 20, 0.5],
    [30 + (i % 30), 25, 0.6],
  ],
});

async function newPass(db: Kysely<Database>) {
  const gagId = randomUUID();
  await createGag(db, { id: gagId, seriesId: DEMO_SERIES_ID, title: `Race ${gagId.slice(0, 4)}`, premise: '' });
  const pass = await createPass(db, { gagId, userId: 'demo-user-cocreator' });
  return { gagId, passId: pass.id };
}

describe('batches on one pass from two instances at once', () => {
  it('every batch gets its own seq with no gap, every stroke is kept once, and since=seq reads miss nothing', async () => {
    const { passId } = await newPass(a);
    const WRITERS = 8;
    const PER_WRITER = 12;
    const seen = new Set<string>();
    let lastSeq = 0;
    let writing = true;
    // A reader catching up with since=seq while the writers run, as a client does after each event.
    const reader = (async () => {
      while (writing) {
        const d = (await passDelta(b, passId, lastSeq))!;
        for (const s of d.strokes) seen.add(s.id);
        lastSeq = d.seq;
        await new Promise((r) => setTimeout(r, 2));
      }
    })();
    const results = await Promise.all(
      Array.from({ length: WRITERS }, async (_, w) => {
        const db = w % 2 === 0 ? a : b;
        const seqs: number[] = [];
        for (let k = 0; k < PER_WRITER; k++) {
          const id = `w${w}-s${k}`;
          const ops: Op[] = [{ op: 'add', stroke: stroke(id, w * PER_WRITER + k) }];
          const r = await applyBatch(db, { passId, batchId: `batch-${w}-${k}`, ops, userId: 'demo-user-cocreator', spec: DEFAULT_PAGE_SPEC });
          seqs.push(r.seq);
        }
        return seqs;
      }),
    );
    writing = false;
    await reader;
    const all = results.flat().sort((x, y) => x - y);
    expect(all).toEqual(Array.from({ length: WRITERS * PER_WRITER }, (_, i) => i + 1));
    const state = (await passState(a, passId))!;
    expect(state.seq).toBe(WRITERS * PER_WRITER);
    expect(state.strokes).toHaveLength(WRITERS * PER_WRITER);
    expect(new Set(state.strokes.map((s) => s.id)).size).toBe(WRITERS * PER_WRITER);
    // One last catch-up, then the reader holds exactly what was written.
    for (const s of (await passDelta(b, passId, lastSeq))!.strokes) seen.add(s.id);
    expect(seen).toEqual(new Set(state.strokes.map((s) => s.id)));
  });

  it('a retry racing its original is applied once and both get the same seq', async () => {
    const { passId } = await newPass(a);
    for (let round = 0; round < 6; round++) {
      const batch = {
        passId,
        batchId: `same-${round}`,
        ops: [{ op: 'add', stroke: stroke(`dup-${round}`, round) }] as Op[],
        userId: 'demo-user-cocreator',
        spec: DEFAULT_PAGE_SPEC,
      };
      const [r1, r2, r3] = await Promise.all([applyBatch(a, batch), applyBatch(b, batch), applyBatch(a, batch)]);
      expect(r2.seq).toBe(r1.seq);
      expect(r3.seq).toBe(r1.seq);
      expect([r1, r2, r3].filter((r) => !r.replayed)).toHaveLength(1);
    }
    const state = (await passState(a, passId))!;
    expect(state.seq).toBe(6);
    expect(state.strokes.map((s) => s.id).sort()).toEqual(['dup-0', 'dup-1', 'dup-2', 'dup-3', 'dup-4', 'dup-5']);
  });

  it('new passes started at once get distinct numbers', async () => {
    const { gagId } = await newPass(a);
    const made = await Promise.all(Array.from({ length: 6 }, (_, i) => createPass(i % 2 ? a : b, { gagId, userId: 'demo-user-cocreator' })));
    expect(made.map((p) => p.number).sort((x, y) => x - y)).toEqual([2, 3, 4, 5, 6, 7]);
  });
});

describe('running order', () => {
  it('moves at once into the same gap never produce equal order keys', async () => {
    const vol = await createVolume(a, { seriesId: DEMO_SERIES_ID, title: 'Race volume', deadline: '2027-03-13' });
    const entries = [];
    for (let i = 0; i < 10; i++) entries.push(await addEntry(a, vol.id, DEMO_SERIES_ID, { kind: 'blank' }));
    const anchor = entries[0]!.id;
    // Nine entries all moved "after the first" at the same moment, from both instances.
    await Promise.all(entries.slice(1).map((e, i) => moveEntry(i % 2 ? a : b, vol.id, e.id, { after: anchor })));
    const after = await listEntries(a, vol.id);
    const keys = after.map((e) => e.position);
    expect(new Set(keys).size).toBe(keys.length);
    expect(after[0]!.id).toBe(anchor);
  });

  it('appends at once get distinct keys, and one gag placed twice at once is placed once', async () => {
    const vol = await createVolume(a, { seriesId: DEMO_SERIES_ID, title: 'Append race', deadline: '2027-03-13' });
    const added = await Promise.all(Array.from({ length: 8 }, (_, i) => addEntry(i % 2 ? a : b, vol.id, DEMO_SERIES_ID, { kind: 'blank' })));
    expect(new Set(added.map((e) => e.position)).size).toBe(8);
    const gagId = randomUUID();
    await createGag(a, { id: gagId, seriesId: DEMO_SERIES_ID, title: 'Placed once', premise: '' });
    const tries = await Promise.allSettled([addEntry(a, vol.id, DEMO_SERIES_ID, { gagId }), addEntry(b, vol.id, DEMO_SERIES_ID, { gagId })]);
    expect(tries.filter((t) => t.status === 'fulfilled')).toHaveLength(1);
    const refused = tries.find((t) => t.status === 'rejected') as PromiseRejectedResult;
    expect((refused.reason as { status?: number }).status).toBe(409);
  });
});

describe('stamps', () => {
  it('two "ready" stamps on two passes of one gag at once leave exactly one standing', async () => {
    const { gagId, passId } = await newPass(a);
    const second = await createPass(a, { gagId, userId: 'demo-user-cocreator' });
    await Promise.all([
      stampPass(a, { passId, userId: 'demo-user-editor', decision: 'ready', note: '' }),
      stampPass(b, { passId: second.id, userId: 'demo-user-editor', decision: 'ready', note: '' }),
    ]);
    const standing = await a
      .selectFrom('stamps')
      .select('id')
      .where('gagId', '=', gagId)
      .where('decision', '=', 'ready')
      .where('clearedAt', 'is', null)
      .execute();
    expect(standing).toHaveLength(1);
  });
});

describe('invitations', () => {
  it('one link accepted twice at once makes one member; the other is told it was used', async () => {
    const users = Array.from({ length: 6 }, (_, i) => `race-${i}`);
    for (const id of users) await insertUser(a, { id, email: `${id}@quadrille.test`, name: id, passwordHash: 'x' });
    const { token } = await createInvitation(a, {
      seriesId: DEMO_SERIES_ID,
      email: 'race@quadrille.test',
      role: 'viewer',
      invitedBy: 'demo-user-owner',
      // Six different accounts: a link anyone may use (an addressed one refuses five of them before the race).
      anyoneWithLink: true,
    });
    await warm([a, b]);
    const tries = await Promise.allSettled(users.map((u, i) => acceptInvitation(i % 2 ? a : b, token, u)));
    expect(tries.filter((t) => t.status === 'fulfilled')).toHaveLength(1);
    for (const t of tries.filter((t) => t.status === 'rejected') as PromiseRejectedResult[]) {
      expect(t.reason).toBeInstanceOf(Refused);
      expect((t.reason as Refused).status).toBe(410);
    }
    const members = await a.selectFrom('memberships').select('userId').where('seriesId', '=', DEMO_SERIES_ID).where('userId', 'in', users).execute();
    expect(members).toHaveLength(1);
  });
});

describe('sign-in throttle', () => {
  it(`lets at most ${MAX_FAILURES} attempts per address through to the password check, however many arrive at once`, async () => {
    // Four instances' worth of connections, 40 attempts in one burst.
    extra = [another(), another()];
    const dbs = [a, b, ...extra];
    await warm(dbs);
    const now = Date.now();
    const granted = await Promise.all(Array.from({ length: 40 }, (_, i) => claimAttempt(dbs[i % dbs.length]!, 'burst@quadrille.test', now)));
    expect(granted.filter(Boolean)).toHaveLength(MAX_FAILURES);
    // The count is shared: every instance now refuses.
    for (const db of dbs) expect(await claimAttempt(db, 'Burst@Quadrille.test', now + 1)).toBe(false);
    expect(await claimAttempt(a, 'someone-else@quadrille.test', now)).toBe(true);
  });

  it(`lets at most ${MAX_CLIENT_ATTEMPTS} attempts per client through, over many unknown addresses, however many arrive at once`, async () => {
    const dbs = [a, b, ...extra];
    await warm(dbs);
    const now = Date.now();
    // 60 attempts from one client over 12 addresses nobody has (5 each: the address limit never bites).
    const claims = await Promise.all(
      Array.from({ length: 60 }, (_, i) => claimSignIn(dbs[i % dbs.length]!, { email: `ghost-${i % 12}@pier.test`, client: '192.0.2.10' }, now)),
    );
    expect(claims.filter((c) => c.ok)).toHaveLength(MAX_CLIENT_ATTEMPTS);
    expect(claims.filter((c) => !c.ok && c.refusedBy === 'client')).toHaveLength(60 - MAX_CLIENT_ATTEMPTS);
    const rows = await a.selectFrom('signInClientAttempts').select('id').where('client', '=', '192.0.2.10').execute();
    expect(rows).toHaveLength(MAX_CLIENT_ATTEMPTS);
    // A refused claim counts nowhere: the addresses hold exactly the granted attempts.
    const failures = await a.selectFrom('signInFailures').select('id').where('email', 'like', 'ghost-%').execute();
    expect(failures).toHaveLength(MAX_CLIENT_ATTEMPTS);
    expect((await claimSignIn(b, { email: 'ghost-0@pier.test', client: '192.0.2.11' }, now)).ok).toBe(true);
  });

  it('both limits at once: one address from one client stops at the address limit, and the client keeps the rest', async () => {
    const dbs = [a, b, ...extra];
    const now = Date.now();
    const claims = await Promise.all(
      Array.from({ length: 24 }, (_, i) => claimSignIn(dbs[i % dbs.length]!, { email: 'target@quadrille.test', client: '192.0.2.20' }, now)),
    );
    expect(claims.filter((c) => c.ok)).toHaveLength(MAX_FAILURES);
    expect(claims.filter((c) => !c.ok && c.refusedBy === 'address')).toHaveLength(24 - MAX_FAILURES);
    expect(await a.selectFrom('signInClientAttempts').select('id').where('client', '=', '192.0.2.20').execute()).toHaveLength(MAX_FAILURES);
  });
});
