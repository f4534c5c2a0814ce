import { findMe, setNotifyEmail } from '@/db/queries/users';
import { withUser } from '@/lib/http/route';
import { meSchema } from '@/lib/validation/members';

/** Who I am, and whether I get e-mail notifications. */
export const GET = withUser(async ({ db, user }) => Response.json(await findMe(db, user.id)));

/** `{ notifyEmail: boolean }` turns mention and stamp e-mails on or off. */
export const PATCH = withUser<Record<string, never>, typeof meSchema>({ body: meSchema }, async ({ body, db, user }) => {
  await setNotifyEmail(db, user.id, body.notifyEmail);
  return Response.json({ id: user.id, notifyEmail: body.notifyEmail });
});
