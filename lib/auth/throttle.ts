// Refuses sign-in for an e-mail address after repeated failures:
// at most 10 failed attempts in any 15-minute window, kept in the database so
// a restart or a second server process does not reset the count.
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { clearFailures, countRecentFailures, recordFailure } from '@/db/queries/users';

export const MAX_FAILURES = 10;
export const WINDOW_MS = 15 * 60 * 1000;

export async function isThrottled(db: Kysely<Database>, email: string, now = Date.now()): Promise<boolean> {
  return (await countRecentFailures(db, email, now - WINDOW_MS)) >= MAX_FAILURES;
}

export async function noteFailure(db: Kysely<Database>, email: string, now = Date.now()): Promise<void> {
  await recordFailure(db, email, now);
}

export async function noteSuccess(db: Kysely<Database>, email: string): Promise<void> {
  await clearFailures(db, email);
}
