// Refuses sign-in for an e-mail address after repeated failures: at most 10
// password checks in any 15-minute window. Each attempt is counted before its
// password is checked, atomically (one address's attempts queue on a lock), and
// kept in the database, so neither a burst in parallel, nor a restart, nor a
// second app instance gets more than 10 tries through.
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { claimAttemptSlot, clearFailures, countRecentFailures, recordFailure } from '@/db/queries/users';

export const MAX_FAILURES = 10;
export const WINDOW_MS = 15 * 60 * 1000;

export async function isThrottled(db: Kysely<Database>, email: string, now = Date.now()): Promise<boolean> {
  return (await countRecentFailures(db, email, now - WINDOW_MS)) >= MAX_FAILURES;
}

/**
 * Counts one attempt now, as a failure until it succeeds; false when the
 * address has used its attempts for the window (then nothing is counted).
 */
export async function claimAttempt(db: Kysely<Database>, email: string, now = Date.now()): Promise<boolean> {
  return claimAttemptSlot(db, email, now, now - WINDOW_MS, MAX_FAILURES);
}

export async function noteFailure(db: Kysely<Database>, email: string, now = Date.now()): Promise<void> {
  await recordFailure(db, email, now);
}

export async function noteSuccess(db: Kysely<Database>, email: string): Promise<void> {
  await clearFailures(db, email);
}
