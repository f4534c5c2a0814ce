// Sessions that end on the server. Each sign-in adds a row whose id travels inside the (encrypted) session
// cookie; a request is signed in only while that row exists and has not expired. Ending a session deletes
// its row, so the cookie stops working at once wherever it is.
import { randomBytes } from 'node:crypto';
import type { Kysely, Transaction } from 'kysely';
import type { Database } from '../database';
import { keptQuery } from '../kept-query';

/** How long a session lasts after its sign-in (next-auth's cookie lives as long). */
export const SESSION_DAYS = 30;

type Db = Kysely<Database> | Transaction<Database>;

/** A new session for a sign-in; also clears the person's expired ones. */
export async function startSession(db: Db, userId: string, now = new Date()): Promise<string> {
  const id = randomBytes(24).toString('base64url');
  const expiresAt = new Date(now.getTime() + SESSION_DAYS * 24 * 3600 * 1000).toISOString();
  await db.deleteFrom('sessions').where('userId', '=', userId).where('expiresAt', '<=', now.toISOString()).execute();
  await db.insertInto('sessions').values({ id, userId, createdAt: now.toISOString(), expiresAt }).execute();
  return id;
}

/** The signed-in person of a session, in one query: the session must be live and belong to `userId`. */
const sessionUser = keptQuery((db, sessionId: string, userId: string, now: string) =>
  db
    .selectFrom('sessions as s')
    .innerJoin('users as u', 'u.id', 's.userId')
    .select(['u.id', 'u.email', 'u.name'])
    .where('s.id', '=', sessionId)
    .where('s.userId', '=', userId)
    .where('s.expiresAt', '>', now),
);

export async function findSessionUser(db: Db, sessionId: string, userId: string, now = new Date()) {
  const [user] = await sessionUser(db, sessionId, userId, now.toISOString());
  return user;
}

export async function endSession(db: Db, sessionId: string): Promise<void> {
  await db.deleteFrom('sessions').where('id', '=', sessionId).execute();
}

/** Ends every session of a person but `keep` (the one changing the password); returns how many ended. */
export async function endOtherSessions(db: Db, userId: string, keep: string | null): Promise<number> {
  let q = db.deleteFrom('sessions').where('userId', '=', userId);
  if (keep) q = q.where('id', '!=', keep);
  const r = await q.executeTakeFirst();
  return Number(r.numDeletedRows);
}

/** Ends every session of a person. */
export function endAllSessions(db: Db, userId: string): Promise<number> {
  return endOtherSessions(db, userId, null);
}
