// Changing one's password: the current password must be right (checked under the sign-in limit for the address,
// so a borrowed session cannot be used to guess it), the new one must pass the rules and not be a common
// password; then every other session of the person ends (OWASP ASVS 4.0.3 V3.3.3).
import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db/database';
import { endOtherSessions } from '@/db/queries/sessions';
import { findPasswordHash, setPasswordHash } from '@/db/queries/users';
import { Refused } from '@/lib/refused';
import { refuseCommonPassword } from './common-passwords';
import { hashPassword, verifyPassword } from './password';
import type { SessionUser } from './session';
import { claimAttempt, noteSuccess } from './throttle';

const fieldRefusal = (field: string, message: string) => new Refused(422, message, [{ path: [field], message, code: 'custom' }]);

/** Sets the new password and ends the person's other sessions; returns how many ended. */
export async function changePassword(
  db: Kysely<Database>,
  input: { user: SessionUser; sessionId: string | null; currentPassword: string; newPassword: string },
): Promise<number> {
  if (input.newPassword === input.currentPassword) throw fieldRefusal('newPassword', 'The new password is the one you have now: choose another.');
  await refuseCommonPassword(input.newPassword, 'newPassword');
  if (!(await claimAttempt(db, input.user.email))) {
    throw new Refused(429, 'Too many wrong passwords for this account. Wait 15 minutes, then try again.');
  }
  const stored = await findPasswordHash(db, input.user.id);
  if (!stored || !(await verifyPassword(input.currentPassword, stored))) {
    throw fieldRefusal('currentPassword', 'That is not your current password.');
  }
  await noteSuccess(db, input.user.email);
  const hash = await hashPassword(input.newPassword);
  return db.transaction().execute(async (trx) => {
    await setPasswordHash(trx, input.user.id, hash);
    return endOtherSessions(trx, input.user.id, input.sessionId);
  });
}
