// Sign-up: creates an account. Signing in is next-auth's job afterwards.
import { randomUUID } from 'node:crypto';
import { getDb } from '@/db/client';
import { findUserByEmail, insertUser } from '@/db/queries/users';
import { hashPassword } from '@/lib/auth/password';
import { Refused, jsonError, parseBody } from '@/lib/http/route';
import { signUpSchema } from '@/lib/validation/account';

export async function POST(req: Request) {
  try {
    const input = await parseBody(req, signUpSchema);
    const db = await getDb();
    if (await findUserByEmail(db, input.email)) {
      return jsonError(409, 'An account with this e-mail address already exists. Sign in instead.');
    }
    const id = randomUUID();
    await insertUser(db, { id, email: input.email, name: input.name, passwordHash: await hashPassword(input.password) });
    return Response.json({ id, email: input.email, name: input.name }, { status: 201 });
  } catch (err) {
    if (err instanceof Refused) return jsonError(err.status, err.message, err.issues);
    throw err;
  }
}
