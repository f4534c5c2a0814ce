import { beforeAll, describe, expect, it } from 'vitest';
import { migrateToLatest } from '@/db/client';
import { seedDemo } from '@/db/seed/demo';
import { DEMO_GAGS, DEMO_USERS } from '@/db/seed/demo-data';
import { MAX_FAILURES, WINDOW_MS, isThrottled, noteFailure, noteSuccess } from '@/lib/auth/throttle';
import { verifyPassword } from '@/lib/auth/password';
import { GAG_STATUSES } from '@/lib/gags/status';
import { countRows, freshDb } from '../support/test-db';

let db: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  db = await freshDb();
});

const counts = () => countRows(db, ['users', 'series', 'memberships', 'gags', 'beats', 'passes', 'strokes']);

describe('migrations and the demo seed', () => {
  it('migrating again applies nothing', async () => {
    expect(await migrateToLatest(db)).toEqual([]);
  });

  it('loads the Kettle Crab scenario with a gag in every status', async () => {
    const c = await counts();
    expect(c.users).toBe(DEMO_USERS.length);
    expect(c.gags).toBe(DEMO_GAGS.length);
    expect(c.beats).toBe(DEMO_GAGS.length * 4);
    const statuses = await db.selectFrom('gags').select('status').where('seriesId', '=', 'demo-kettle-crab').distinct().execute();
    expect(new Set(statuses.map((s) => s.status))).toEqual(new Set(GAG_STATUSES));
  });

  it('gives drafted gags several passes of strokes, and ideas none', async () => {
    const passes = await db.selectFrom('passes').select(['gagId', 'number']).execute();
    const of = (gagId: string) => passes.filter((p) => p.gagId === gagId).length;
    expect(of('demo-gag-11')).toBe(0); // an idea
    expect(of('demo-gag-05')).toBe(3); // ready to ink after three passes
    expect((await counts()).strokes).toBeGreaterThan(100);
  });

  it('gags past review carry their stamp; some gags have comment threads', async () => {
    const stamps = await db.selectFrom('stamps').select(['gagId', 'decision', 'clearedAt']).execute();
    const stamped = new Set(stamps.map((st) => st.gagId));
    for (const g of DEMO_GAGS.filter((x) => ['ready_to_ink', 'inked', 'scanned', 'placed'].includes(x.status))) expect(stamped.has(g.id)).toBe(true);
    expect(stamps.every((st) => st.decision === 'ready' && st.clearedAt === null)).toBe(true);
    const comments = await db.selectFrom('comments').select(['gagId', 'parentId']).execute();
    expect(comments.filter((c) => c.parentId).length).toBeGreaterThan(0);
  });

  it('is idempotent, and leaves edited rows alone', async () => {
    await db.updateTable('gags').set({ title: 'Renamed by hand' }).where('id', '=', 'demo-gag-01').execute();
    const before = await counts();
    await seedDemo(db);
    expect(await counts()).toEqual(before);
    const g = await db.selectFrom('gags').select('title').where('id', '=', 'demo-gag-01').executeTakeFirstOrThrow();
    expect(g.title).toBe('Renamed by hand');
  });

  it('demo passwords are hashed and verify', async () => {
    const u = await db.selectFrom('users').select('passwordHash').where('email', '=', 'viewer@quadrille.test').executeTakeFirstOrThrow();
    expect(u.passwordHash).not.toContain('kettle-crab-demo');
    expect(await verifyPassword('kettle-crab-demo', u.passwordHash)).toBe(true);
    expect(await verifyPassword('kettle-crab-dem0', u.passwordHash)).toBe(false);
  });

  it('foreign keys are enforced: deleting a gag removes its beats', async () => {
    await db.deleteFrom('gags').where('id', '=', 'demo-gag-12').execute();
    const beats = await db.selectFrom('beats').selectAll().where('gagId', '=', 'demo-gag-12').execute();
    expect(beats).toEqual([]);
  });
});

describe('sign-in throttle', () => {
  const email = 'owner@quadrille.test';
  const now = Date.parse('2026-12-01T12:00:00Z');

  it(`refuses after ${MAX_FAILURES} failures within 15 minutes, per address`, async () => {
    for (let i = 0; i < MAX_FAILURES - 1; i++) await noteFailure(db, email, now - i * 1000);
    expect(await isThrottled(db, email, now)).toBe(false);
    await noteFailure(db, email, now);
    expect(await isThrottled(db, email, now)).toBe(true);
    expect(await isThrottled(db, 'editor@quadrille.test', now)).toBe(false);
  });

  it('forgets failures older than the window', async () => {
    expect(await isThrottled(db, email, now + WINDOW_MS + 1)).toBe(false);
  });

  it('a successful sign-in clears the count', async () => {
    await noteSuccess(db, email);
    expect(await isThrottled(db, email, now)).toBe(false);
  });
});
