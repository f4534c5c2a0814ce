// Users and the sign-in failure log. Plain functions taking db or trx.
import type { Kysely } from 'kysely';
import type { Database, User } from '../database';
import { lockKey } from '../dialect';

export async function findUserByEmail(db: Kysely<Database>, email: string): Promise<User | undefined> {
  return db.selectFrom('users').selectAll().where('email', '=', email.toLowerCase()).executeTakeFirst();
}

export async function findUserById(db: Kysely<Database>, id: string): Promise<Pick<User, 'id' | 'email' | 'name'> | undefined> {
  return db.selectFrom('users').select(['id', 'email', 'name']).where('id', '=', id).executeTakeFirst();
}

export async function insertUser(db: Kysely<Database>, user: { id: string; email: string; name: string; passwordHash: string }): Promise<void> {
  await db
    .insertInto('users')
    .values({ ...user, email: user.email.toLowerCase(), createdAt: new Date().toISOString() })
    .execute();
}

export async function countRecentFailures(db: Kysely<Database>, email: string, sinceMs: number): Promise<number> {
  const row = await db
    .selectFrom('signInFailures')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('email', '=', email.toLowerCase())
    .where('at', '>=', sinceMs)
    .executeTakeFirstOrThrow();
  return Number(row.n);
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
