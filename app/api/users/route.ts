// Sign-up: creates an account. Signing in is next-auth's job afterwards.
import { randomUUID } from 'node:crypto';
import { isUniqueViolation } from '@/db/dialect';
import { findUserByEmail, insertUser } from '@/db/queries/users';
import { clientAddress } from '@/lib/auth/client-address';
import { refuseCommonPassword } from '@/lib/auth/common-passwords';
import { hashPassword } from '@/lib/auth/password';
import { WINDOW_MS, claimSignUp } from '@/lib/auth/throttle';
import { jsonError, withAnyone } from '@/lib/http/route';
import { invitedAddress } from '@/db/queries/invitation-changes';
import { signUpBodySchema } from '@/lib/validation/account';

const EXISTS = 'An account with this e-mail address already exists. Sign in instead.';

/**
 * `{ name, email, password }`, or `{ name, invitation, password }`: signing up from an invitation tied to one
 * address takes that address from the invitation (the link was sent there, so it stands for the address).
 */
export const POST = withAnyone({ body: signUpBodySchema }, async ({ req, body, db }) => {
  // The schema has checked length and characters (the form does the same); the common-password list is server-side.
  await refuseCommonPassword(body.password);
  let address = body.email;
  if (body.invitation !== undefined) {
    address = (await invitedAddress(db, body.invitation))?.email;
    if (!address) {
      return jsonError(
        422,
        'This invitation cannot fill in an address (it is unknown, used, withdrawn, expired, or a link for anyone): enter your e-mail address.',
        [{ path: ['invitation'], message: 'No address to take from this invitation.', code: 'invalid_invitation' }],
      );
    }
  }
  const mail = address!;
  if (await findUserByEmail(db, mail)) return jsonError(409, EXISTS);
  // Each sign-up costs a password hash: it counts against the client's sign-in limit.
  if (!(await claimSignUp(db, clientAddress(req.headers))).ok) {
    return Response.json(
      { error: 'Too many accounts and sign-ins from your network. Wait 15 minutes and try again.' },
      { status: 429, headers: { 'Retry-After': String(WINDOW_MS / 1000) } },
    );
  }
  const id = randomUUID();
  try {
    await insertUser(db, { id, email: mail, name: body.name, passwordHash: await hashPassword(body.password) });
  } catch (err) {
    // The same address signed up twice at once: one account, and this one is told it exists.
    if (isUniqueViolation(err)) return jsonError(409, EXISTS);
    throw err;
  }
  return Response.json({ id, email: mail, name: body.name }, { status: 201 });
});
