// Password hashing with bcrypt (bcryptjs: pure JS, no native build).
import bcrypt from 'bcryptjs';

const COST = 10;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}

let dummy: Promise<string> | undefined;
/** Compared against when the e-mail is unknown, so a miss costs as long as a hit. */
export function dummyHash(): Promise<string> {
  dummy ??= bcrypt.hash('no account has this password', COST);
  return dummy;
}
