// Limits on password checks, both counted in the database before the hash, atomically (each key's attempts
// queue on a lock), so neither a burst in parallel, nor a restart, nor a second app instance gets more through:
// - per e-mail address: at most 10 failed sign-ins in any 15-minute window (a success clears them);
// - per client (lib/auth/client-address.ts): at most 30 password hashes in 15 minutes — failed sign-ins, whatever
//   the addresses tried (known or not), and sign-ups — so a client cannot load the server through them (OWASP ASVS
//   4.0.3 V2.2.1). A successful sign-in gives its slot back; a sign-up keeps it (each one makes a new account).
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import {
  claimAttemptSlot,
  claimSignInSlots,
  clearFailures,
  countRecentClientAttempts,
  countRecentFailures,
  recordFailure,
  releaseClientAttempt,
  type SignInClaim,
} from '@/db/queries/users';

export const MAX_FAILURES = 10;
export const MAX_CLIENT_ATTEMPTS = 30;
export const WINDOW_MS = 15 * 60 * 1000;

export async function isThrottled(db: Kysely<Database>, email: string, now = Date.now()): Promise<boolean> {
  return (await countRecentFailures(db, email, now - WINDOW_MS)) >= MAX_FAILURES;
}

export async function isClientThrottled(db: Kysely<Database>, client: string, now = Date.now()): Promise<boolean> {
  return (await countRecentClientAttempts(db, client, now - WINDOW_MS)) >= MAX_CLIENT_ATTEMPTS;
}

/**
 * Counts one attempt now, as a failure until it succeeds; false when the
 * address has used its attempts for the window (then nothing is counted).
 */
export async function claimAttempt(db: Kysely<Database>, email: string, now = Date.now()): Promise<boolean> {
  return claimAttemptSlot(db, email, now, now - WINDOW_MS, MAX_FAILURES);
}

/** A sign-in's attempt, counted for its client and its address at once (both or neither). */
export function claimSignIn(db: Kysely<Database>, input: { email: string; client: string }, now = Date.now()): Promise<SignInClaim> {
  return claimSignInSlots(db, { ...input, atMs: now, sinceMs: now - WINDOW_MS, maxPerAddress: MAX_FAILURES, maxPerClient: MAX_CLIENT_ATTEMPTS });
}

/** A sign-up's hash, counted for its client. */
export function claimSignUp(db: Kysely<Database>, client: string, now = Date.now()): Promise<SignInClaim> {
  return claimSignInSlots(db, {
    email: null,
    client,
    atMs: now,
    sinceMs: now - WINDOW_MS,
    maxPerAddress: MAX_FAILURES,
    maxPerClient: MAX_CLIENT_ATTEMPTS,
  });
}

export async function noteFailure(db: Kysely<Database>, email: string, now = Date.now()): Promise<void> {
  await recordFailure(db, email, now);
}

/** After the right password: the address's failures are forgiven and the client's slot given back. */
export async function noteSuccess(db: Kysely<Database>, email: string, clientAttemptId?: number): Promise<void> {
  await clearFailures(db, email);
  if (clientAttemptId !== undefined) await releaseClientAttempt(db, clientAttemptId);
}
