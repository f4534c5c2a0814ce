// Password hashes: scrypt with the OWASP Password Storage Cheat Sheet's parameters, self-describing, and the
// bcrypt hashes made before still verify (and are due for a rehash).
import bcrypt from 'bcryptjs';
import { describe, expect, it } from 'vitest';
import { SCRYPT_PARAMS, dummyHash, hashPassword, needsRehash, parseScryptHash, verifyPassword } from '@/lib/auth/password';

// Hashing runs in the hash pool's worker at a lowered priority (nice 10): on a machine busy with other
// suites it waits its turn, so these tests get more than the default 5 s.
describe('scrypt hashes', { timeout: 30_000 }, () => {
  it('use N=2^15, r=8, p=3 (OWASP Password Storage Cheat Sheet, scrypt) and say so in the hash', async () => {
    expect(SCRYPT_PARAMS).toEqual({ N: 32768, r: 8, p: 3 });
    const h = await hashPassword('kettle-crab-demo');
    expect(h).toMatch(/^scrypt\$32768\$8\$3\$[A-Za-z0-9+/=]{24}\$[A-Za-z0-9+/=]{44}$/);
    expect(await verifyPassword('kettle-crab-demo', h)).toBe(true);
    expect(await verifyPassword('kettle-crab-dem0', h)).toBe(false);
    expect(needsRehash(h)).toBe(false);
    // A new salt each time.
    expect(await hashPassword('kettle-crab-demo')).not.toBe(h);
  });

  it('the whole password counts: no cut at 72 bytes as bcrypt makes', async () => {
    const long = 'k'.repeat(100);
    const h = await hashPassword(long);
    expect(await verifyPassword(long, h)).toBe(true);
    expect(await verifyPassword('k'.repeat(72), h)).toBe(false);
    expect(await verifyPassword('k'.repeat(99) + 'j', h)).toBe(false);
    // bcrypt, for contrast: only the first 72 bytes count (bcryptjs documents the limit).
    const b = await bcrypt.hash(long, 4);
    expect(await bcrypt.compare('k'.repeat(72) + 'anything', b)).toBe(true);
  });

  it('the same password typed in another Unicode form matches (NFKC, NIST SP 800-63B 5.1.1.2)', async () => {
    const h = await hashPassword('café-au-lait-crab'); // é as one code point
    expect(await verifyPassword('cafe\u0301-au-lait-crab', h)).toBe(true); // e + combining acute
  });

  it('an unreadable hash, or parameters no hash of ours has, is a mismatch and never an error', async () => {
    expect(await verifyPassword('x', 'x')).toBe(false);
    expect(await verifyPassword('x', '')).toBe(false);
    expect(parseScryptHash('scrypt$33$8$3$AAAAAAAAAAAAAAAAAAAAAA==$AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA=')).toBeNull(); // N not a power of 2
    expect(parseScryptHash('scrypt$1073741824$8$1$AAAAAAAAAAAAAAAAAAAAAA==$AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA=')).toBeNull(); // a cost bomb
    expect(needsRehash('x')).toBe(true);
  });

  it('the dummy hash for unknown addresses is scrypt with the same parameters', async () => {
    const d = await dummyHash();
    expect(parseScryptHash(d)?.params).toEqual(SCRYPT_PARAMS);
    expect(await dummyHash()).toBe(d);
  });
});

describe('bcrypt hashes from before', { timeout: 30_000 }, () => {
  it('still verify ($2a$ and $2b$), and are due for a rehash', async () => {
    const b = await bcrypt.hash('kettle-crab-demo', 4);
    expect(b.startsWith('$2b$')).toBe(true);
    expect(await verifyPassword('kettle-crab-demo', b)).toBe(true);
    expect(await verifyPassword('kettle-crab-dem0', b)).toBe(false);
    expect(await verifyPassword('kettle-crab-demo', b.replace('$2b$', '$2a$'))).toBe(true);
    expect(needsRehash(b)).toBe(true);
  });
});
