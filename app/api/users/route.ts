// Sign-up: creates an account. Signing in is next-auth's job afterwards.
import { randomUUID } from 'node:crypto';
import { findUserByEmail, insertUser } from '@/db/queries/users';
import { hashPassword } from '@/lib/auth/password';
import { jsonError, withAnyone } from '@/lib/http/route';
import { signUpSchema } from '@/lib/validation/account';

export const POST = withAnyone({ body: signUpSchema }, async ({ body, db }) => {
  if (await findUserByEmail(db, body.email)) {
    return jsonError(409, 'An account with this e-mail address already exists. Sign in instead.');
  }
  const id = randomUUID();
  await insertUser(db, { id, email: body.email, name: body.name, passwordHash: await hashPassword(body.password) });
  return Response.json({ id, email: body.email, name: body.name }, { status: 201 });
});
