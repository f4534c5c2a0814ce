// Password hashing with scrypt (node:crypto), run in the hashing worker threads (lib/workers/pool.ts), so a
// sign-in's hash never holds up the request thread, and a burst of them does not fill libuv's thread pool. Parameters from the OWASP Password Storage Cheat Sheet (scrypt: N=2^15, r=8, p=3, one of
// its equal-strength choices). A hash describes itself — `scrypt$N$r$p$salt$hash` (salt and hash in base64) — so
// the parameters can rise later and old hashes still verify. The whole password counts (no 72-byte cut as in
// bcrypt); it is NFKC-normalised first, so the same password typed on another keyboard or system matches
// (NIST SP 800-63B 5.1.1.2). Hashes made by bcrypt before ($2a$, $2b$, $2y$) still verify, and a sign-in replaces
// them (needsRehash).
import { randomBytes, timingSafeEqual } from 'node:crypto';
import { bcryptInPool, scryptInPool } from '@/lib/workers/pool';

/** OWASP Password Storage Cheat Sheet, scrypt: N=2^15 (CPU/memory cost), r=8 (block size), p=3 (parallelism). */
export const SCRYPT_PARAMS = { N: 2 ** 15, r: 8, p: 3 } as const;
const SALT_BYTES = 16;
const KEY_BYTES = 32;

type Params = { N: number; r: number; p: number };

/** scrypt needs 128·r·(N + p + 2) bytes; Node's default ceiling (32 MiB) is just under what N=2^15, r=8 takes. */
const maxmemFor = ({ N, r, p }: Params) => 128 * r * (N + p + 2) + 1024 * 1024;

function derive(plain: string, salt: Buffer, params: Params, length: number): Promise<Buffer> {
  return scryptInPool({ plain: plain.normalize('NFKC'), salt, ...params, maxmem: maxmemFor(params), length });
}

export async function hashPassword(plain: string): Promise<string> {
  const salt = randomBytes(SALT_BYTES);
  const key = await derive(plain, salt, SCRYPT_PARAMS, KEY_BYTES);
  const { N, r, p } = SCRYPT_PARAMS;
  return `scrypt$${N}$${r}$${p}$${salt.toString('base64')}$${key.toString('base64')}`;
}

type Parsed = { params: Params; salt: Buffer; key: Buffer };

/** Reads `scrypt$N$r$p$salt$hash`; null for anything else, or parameters no hash of ours would have (a cost bomb). */
export function parseScryptHash(stored: string): Parsed | null {
  const parts = stored.split('$');
  if (parts.length !== 6 || parts[0] !== 'scrypt') return null;
  const [N, r, p] = parts.slice(1, 4).map((x) => (/^\d{1,8}$/.test(x) ? Number(x) : NaN)) as [number, number, number];
  const powerOfTwo = N >= 2 && (N & (N - 1)) === 0;
  if (!powerOfTwo || N > 2 ** 20 || !(r >= 1 && r <= 32) || !(p >= 1 && p <= 16) || maxmemFor({ N, r, p }) > 512 * 1024 * 1024) return null;
  const salt = Buffer.from(parts[4]!, 'base64');
  const key = Buffer.from(parts[5]!, 'base64');
  if (salt.length < 8 || key.length < 16 || key.length > 64) return null;
  return { params: { N, r, p }, salt, key };
}

const isBcrypt = (stored: string) => /^\$2[aby]\$\d\d\$/.test(stored);

/** True when `plain` is the password `stored` was made from. Anything unreadable as a hash is a mismatch, never an error. */
export async function verifyPassword(plain: string, stored: string): Promise<boolean> {
  const parsed = parseScryptHash(stored);
  if (parsed) {
    const key = await derive(plain, parsed.salt, parsed.params, parsed.key.length);
    return timingSafeEqual(key, parsed.key);
  }
  if (isBcrypt(stored)) return bcryptInPool(plain, stored);
  return false;
}

/** A hash to replace at the next successful sign-in: bcrypt's, or scrypt with other parameters than today's. */
export function needsRehash(stored: string): boolean {
  const parsed = parseScryptHash(stored);
  if (!parsed) return true;
  const { N, r, p } = parsed.params;
  return N !== SCRYPT_PARAMS.N || r !== SCRYPT_PARAMS.r || p !== SCRYPT_PARAMS.p || parsed.key.length !== KEY_BYTES;
}

let dummy: Promise<string> | undefined;
/** Compared against when the e-mail is unknown: a real scrypt hash with today's parameters, so a miss costs what a hit costs. */
export function dummyHash(): Promise<string> {
  dummy ??= hashPassword(randomBytes(18).toString('base64'));
  return dummy;
}
