import { parseBody, withUser } from '@/lib/http/route';
import { meSchema } from '@/lib/validation/members';

/** Who I am, and whether I get e-mail notifications. */
export const GET = withUser(async ({ db, user }) => {
  const row = await db.selectFrom('users').select(['id', 'name', 'email', 'notifyEmail']).where('id', '=', user.id).executeTakeFirstOrThrow();
  return Response.json({ ...row, notifyEmail: row.notifyEmail === 1 });
});

/** `{ notifyEmail: boolean }` turns mention and stamp e-mails on or off. */
export const PATCH = withUser(async ({ req, db, user }) => {
  const { notifyEmail } = await parseBody(req, meSchema);
  await db
    .updateTable('users')
    .set({ notifyEmail: notifyEmail ? 1 : 0 })
    .where('id', '=', user.id)
    .execute();
  return Response.json({ id: user.id, notifyEmail });
});
