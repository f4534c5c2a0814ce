// Users, the sign-in failure log (per address) and the password checks per client. Plain functions taking db or trx.
import type { Kysely, Transaction } from 'kysely';
import type { Database, User } from '../database';
import { lockKey } from '../dialect';
import { keptQuery } from '../kept-query';

export async function findUserByEmail(db: Kysely<Database>, email: string): Promise<User | undefined> {
  return db.selectFrom('users').selectAll().where('email', '=', email.toLowerCase()).executeTakeFirst();
}

export async function insertUser(db: Kysely<Database>, user: { id: string; email: string; name: string; passwordHash: string }): Promise<void> {
  await db
    .insertInto('users')
    .values({ ...user, email: user.email.toLowerCase(), createdAt: new Date().toISOString() })
    .execute();
}

const recentFailures = keptQuery((db, email: string, sinceMs: number) =>
  db
    .selectFrom('signInFailures')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('email', '=', email)
    .where('at', '>=', sinceMs),
);

export async function countRecentFailures(db: Kysely<Database>, email: string, sinceMs: number): Promise<number> {
  const [row] = await recentFailures(db, email.toLowerCase(), sinceMs);
  return Number(row?.n ?? 0);
}

export async function recordFailure(db: Kysely<Database>, email: string, atMs: number): Promise<void> {
  await db.insertInto('signInFailures').values({ email: email.toLowerCase(), at: atMs }).execute();
}

export async function clearFailures(db: Kysely<Database>, email: string): Promise<void> {
  await db.deleteFrom('signInFailures').where('email', '=', email.toLowerCase()).execute();
}

/** Counts and records one attempt in one step, under a per-address lock; false when `max` are already in the window. */
export async function claimAttemptSlot(db: Kysely<Database>, email: string, atMs: number, sinceMs: number, max: number): Promise<boolean> {
  const address = email.toLowerCase();
  return db.transaction().execute(async (trx) => {
    await lockKey(trx, `sign-in:${address}`);
    const row = await trx
      .selectFrom('signInFailures')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .where('email', '=', address)
      .where('at', '>=', sinceMs)
      .executeTakeFirstOrThrow();
    if (Number(row.n) >= max) return false;
    await trx.insertInto('signInFailures').values({ email: address, at: atMs }).execute();
    return true;
  });
}

export type SignInClaim = { ok: true; clientAttemptId: number } | { ok: false; refusedBy: 'client' | 'address' };

/**
 * One attempt, counted before its password is hashed: a row for the client (`maxPerClient` in the window) and,
 * for a sign-in, one for the address (`maxPerAddress`), both or neither. Each key's attempts queue on a lock (the
 * client's first, then the address's, in every transaction), so a burst in parallel cannot slip past either
 * count. The client's attempts older than the window are dropped on the way. A sign-up passes `email: null`.
 */
export async function claimSignInSlots(
  db: Kysely<Database>,
  input: { email: string | null; client: string; atMs: number; sinceMs: number; maxPerAddress: number; maxPerClient: number },
): Promise<SignInClaim> {
  const address = input.email?.toLowerCase() ?? null;
  return db.transaction().execute(async (trx): Promise<SignInClaim> => {
    await lockKey(trx, `sign-in-client:${input.client}`);
    if (address !== null) await lockKey(trx, `sign-in:${address}`);
    await trx.deleteFrom('signInClientAttempts').where('client', '=', input.client).where('at', '<', input.sinceMs).execute();
    const byClient = await trx
      .selectFrom('signInClientAttempts')
      .select((eb) => eb.fn.countAll<number>().as('n'))
      .where('client', '=', input.client)
      .executeTakeFirstOrThrow();
    if (Number(byClient.n) >= input.maxPerClient) return { ok: false, refusedBy: 'client' };
    if (address !== null) {
      const byAddress = await trx
        .selectFrom('signInFailures')
        .select((eb) => eb.fn.countAll<number>().as('n'))
        .where('email', '=', address)
        .where('at', '>=', input.sinceMs)
        .executeTakeFirstOrThrow();
      if (Number(byAddress.n) >= input.maxPerAddress) return { ok: false, refusedBy: 'address' };
      await trx.insertInto('signInFailures').values({ email: address, at: input.atMs }).execute();
    }
    const row = await trx
      .insertInto('signInClientAttempts')
      .values({ client: input.client, at: input.atMs })
      .returning('id')
      .executeTakeFirstOrThrow();
    return { ok: true, clientAttemptId: Number(row.id) };
  });
}

const recentClientAttempts = keptQuery((db, client: string, sinceMs: number) =>
  db
    .selectFrom('signInClientAttempts')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('client', '=', client)
    .where('at', '>=', sinceMs),
);

export async function countRecentClientAttempts(db: Kysely<Database>, client: string, sinceMs: number): Promise<number> {
  const [row] = await recentClientAttempts(db, client, sinceMs);
  return Number(row?.n ?? 0);
}

/** A successful sign-in gives its client slot back: only failures use up a client's attempts. */
export async function releaseClientAttempt(db: Kysely<Database>, id: number): Promise<void> {
  await db.deleteFrom('signInClientAttempts').where('id', '=', id).execute();
}

export async function setPasswordHash(db: Kysely<Database> | Transaction<Database>, id: string, passwordHash: string): Promise<void> {
  await db.updateTable('users').set({ passwordHash }).where('id', '=', id).execute();
}

export async function findPasswordHash(db: Kysely<Database>, id: string): Promise<string | undefined> {
  const row = await db.selectFrom('users').select('passwordHash').where('id', '=', id).executeTakeFirst();
  return row?.passwordHash;
}

/** My own account as the app shows it: no password hash. */
export async function findMe(db: Kysely<Database>, id: string) {
  const row = await db.selectFrom('users').select(['id', 'name', 'email', 'notifyEmail']).where('id', '=', id).executeTakeFirstOrThrow();
  return { ...row, notifyEmail: row.notifyEmail === 1 };
}

export async function setNotifyEmail(db: Kysely<Database>, id: string, on: boolean): Promise<void> {
  await db
    .updateTable('users')
    .set({ notifyEmail: on ? 1 : 0 })
    .where('id', '=', id)
    .execute();
}
