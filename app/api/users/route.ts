// Sign-up: creates an account. Signing in is next-auth's job afterwards.
import { randomUUID } from 'node:crypto';
import { isUniqueViolation } from '@/db/dialect';
import { findUserByEmail, insertUser } from '@/db/queries/users';
import { clientAddress } from '@/lib/auth/client-address';
import { refuseCommonPassword } from '@/lib/auth/common-passwords';
import { hashPassword } from '@/lib/auth/password';
import { WINDOW_MS, claimSignUp } from '@/lib/auth/throttle';
import { jsonError, withAnyone } from '@/lib/http/route';
import { signUpSchema } from '@/lib/validation/account';

const EXISTS = 'An account with this e-mail address already exists. Sign in instead.';

export const POST = withAnyone({ body: signUpSchema }, async ({ req, body, db }) => {
  // The schema has checked length and characters (the form does the same); the common-password list is server-side.
  await refuseCommonPassword(body.password);
  if (await findUserByEmail(db, body.email)) return jsonError(409, EXISTS);
  // Each sign-up costs a password hash: it counts against the client's sign-in limit.
  if (!(await claimSignUp(db, clientAddress(req.headers))).ok) {
    return Response.json(
      { error: 'Too many accounts and sign-ins from your network. Wait 15 minutes and try again.' },
      { status: 429, headers: { 'Retry-After': String(WINDOW_MS / 1000) } },
    );
  }
  const id = randomUUID();
  try {
    await insertUser(db, { id, email: body.email, name: body.name, passwordHash: await hashPassword(body.password) });
  } catch (err) {
    // The same address signed up twice at once: one account, and this one is told it exists.
    if (isUniqueViolation(err)) return jsonError(409, EXISTS);
    throw err;
  }
  return Response.json({ id, email: body.email, name: body.name }, { status: 201 });
});
