// The password rules of OWASP ASVS 4.0.3 V2.1, for sign-up and a password change.
import { describe, expect, it } from 'vitest';
import { PASSWORD_MAX, PASSWORD_MIN, newPassword, passwordLength, passwordProblem, signUpSchema } from '@/lib/validation/account';
import { meSchema } from '@/lib/validation/members';

const ok = (p: string) => newPassword.safeParse(p).success;
const messageFor = (p: string) => newPassword.safeParse(p).error?.issues[0]?.message;

describe('password length (ASVS 4.0.3 V2.1.1, V2.1.2)', () => {
  it('asks for at least 12 characters and refuses more than 128', () => {
    // ASVS 2.1.1: "at least 12 characters in length"; 2.1.2: "at least 64 … permitted, and … more than 128 … denied".
    expect(PASSWORD_MIN).toBe(12);
    expect(PASSWORD_MAX).toBe(128);
    expect(ok('a'.repeat(11))).toBe(false);
    expect(messageFor('a'.repeat(11) + '')).toMatch(/at least 12 characters/);
    expect(ok('tide-pool-42')).toBe(true); // 12
    expect(ok('x'.repeat(64))).toBe(true);
    expect(ok('x'.repeat(128))).toBe(true);
    expect(ok('x'.repeat(129))).toBe(false);
    expect(messageFor('x'.repeat(129))).toMatch(/at most 128/);
  });

  it('counts a run of spaces as one character (ASVS 2.1.1 "after multiple spaces are combined")', () => {
    expect(passwordLength('a     b')).toBe(3);
    // 11 characters once the run is combined, though 15 were typed.
    expect(ok('kettle     crab')).toBe(false);
    expect(ok('kettle crab pot')).toBe(true);
  });

  it('counts characters, not UTF-16 units: an emoji is one (ASVS 2.1.4 allows any printable Unicode)', () => {
    expect(passwordLength('🦀🦀🦀')).toBe(3);
    expect(ok('🦀'.repeat(11))).toBe(false);
    expect(ok('🦀'.repeat(12))).toBe(true);
    expect(ok('🦀'.repeat(128))).toBe(true); // 256 UTF-16 units
    expect(ok('🦀'.repeat(129))).toBe(false);
  });

  it('keeps the demo password working', () => {
    expect(passwordProblem('kettle-crab-demo')).toBeNull();
  });
});

describe('password characters', () => {
  it('refuses a password of only whitespace', () => {
    expect(messageFor(' '.repeat(12))).toBe('A password needs more than spaces.');
    expect(ok(' '.repeat(40))).toBe(false);
    expect(ok('\u00a0'.repeat(14))).toBe(false); // no-break spaces are whitespace too
  });

  it('refuses NUL and other control characters, and lone surrogates', () => {
    expect(ok('\u0000'.repeat(12))).toBe(false);
    expect(messageFor('\u0000'.repeat(12))).toMatch(/control character \(U\+0000\)/);
    expect(ok('kettle-crab-\u0007demo')).toBe(false);
    expect(ok('kettle-crab\ndemo')).toBe(false);
    expect(ok('kettle-crab-\u009bdemo')).toBe(false); // a C1 control
    expect(ok('kettle-crab-demo\ud83e')).toBe(false);
    expect(messageFor('kettle-crab-demo\ud83e')).toMatch(/unpaired UTF-16 surrogate/);
  });

  it('keeps spaces inside and at the ends: nothing is trimmed (ASVS 2.1.3, no truncation)', () => {
    const parsed = signUpSchema.parse({ name: 'Kettle', email: 'k@pier.test', password: '  kettle crab pot  ' });
    expect(parsed.password).toBe('  kettle crab pot  ');
  });
});

describe('a password change', () => {
  it('needs the current password with the new one, and the new one follows the rules', () => {
    expect(meSchema.safeParse({ currentPassword: 'old-password', newPassword: 'a-new-long-password' }).success).toBe(true);
    expect(meSchema.safeParse({ newPassword: 'a-new-long-password' }).success).toBe(false);
    expect(meSchema.safeParse({ currentPassword: 'old-password' }).success).toBe(false);
    const short = meSchema.safeParse({ currentPassword: 'old-password', newPassword: 'short' });
    expect(short.error?.issues[0]).toMatchObject({ path: ['newPassword'] });
    expect(meSchema.safeParse({}).success).toBe(false);
    expect(meSchema.safeParse({ notifyEmail: false }).success).toBe(true);
  });
});
