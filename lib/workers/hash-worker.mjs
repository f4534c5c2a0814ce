// The password hashing worker (lib/workers/pool.ts, runHash): scrypt and, for
// hashes made before scrypt, bcrypt, run synchronously in this thread so that a
// burst of sign-ins neither holds up the request thread nor fills libuv's small
// thread pool, which file reads, compression and the rest of the server share.
import { setPriority } from 'node:os';
import { scryptSync } from 'node:crypto';
import bcrypt from 'bcryptjs';

// This thread yields the CPU to the request thread: on Linux a nice value belongs to each thread, so
// this lowers password hashing only, and requests keep their answers quick on a small machine (elsewhere, or
// where lowering is not allowed, it runs at the usual priority).
try {
  setPriority(10);
} catch {
  /* the usual priority */
}

export function scryptKey({ plain, salt, N, r, p, maxmem, length }) {
  return scryptSync(plain, Buffer.from(salt), length, { N, r, p, maxmem });
}

export function bcryptCompare({ plain, hash }) {
  return bcrypt.compareSync(plain, hash);
}
