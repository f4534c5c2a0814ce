// The check against common passwords (OWASP ASVS 4.0.3 V2.1.7), on the list shipped with the app: the
// "passwords-common" dictionary of @zxcvbn-ts/language-common (about 49,000 passwords seen most often in
// breaches). Loaded once, on first use, on the server only; compared case-insensitively.
import 'server-only';
import { Refused } from '@/lib/refused';

let common: Promise<Set<string>> | undefined;

const fold = (s: string) => s.normalize('NFKC').toLowerCase();

function load(): Promise<Set<string>> {
  common ??= import('@zxcvbn-ts/language-common').then(({ dictionary }) => new Set(dictionary['passwords-common'].map(fold)));
  return common;
}

export async function isCommonPassword(password: string): Promise<boolean> {
  return (await load()).has(fold(password));
}

/** 422 on `field` when the password is on the list. */
export async function refuseCommonPassword(password: string, field = 'password'): Promise<void> {
  if (await isCommonPassword(password)) {
    const message = 'This password is on a list of common passwords that attackers try first. Choose another: a few unrelated words work well.';
    throw new Refused(422, message, [{ path: [field], message, code: 'custom' }]);
  }
}
