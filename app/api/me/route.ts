import { findMe, setNotifyEmail } from '@/db/queries/users';
import { changePassword } from '@/lib/auth/password-change';
import { sessionIdOf } from '@/lib/auth/session';
import { withUser } from '@/lib/http/route';
import { meSchema } from '@/lib/validation/members';

/** Who I am, and whether I get e-mail notifications. */
export const GET = withUser(async ({ db, user }) => Response.json(await findMe(db, user.id)));

/**
 * `{ notifyEmail: boolean }` turns mention and stamp e-mails on or off; `{ currentPassword, newPassword }` changes
 * the password and signs out every other session (this one stays). The password goes first: if it is refused,
 * nothing changes.
 */
export const PATCH = withUser<Record<string, never>, typeof meSchema>({ body: meSchema }, async ({ req, body, db, user }) => {
  const answer: { id: string; notifyEmail?: boolean; passwordChanged?: true; otherSessionsEnded?: number } = { id: user.id };
  if (body.newPassword !== undefined && body.currentPassword !== undefined) {
    answer.otherSessionsEnded = await changePassword(db, {
      user,
      sessionId: await sessionIdOf(req),
      currentPassword: body.currentPassword,
      newPassword: body.newPassword,
    });
    answer.passwordChanged = true;
  }
  if (body.notifyEmail !== undefined) {
    await setNotifyEmail(db, user.id, body.notifyEmail);
    answer.notifyEmail = body.notifyEmail;
  }
  return Response.json(answer);
});
