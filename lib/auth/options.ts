// next-auth: e-mail + password (Credentials), JWT session cookies carrying the user id and a session id.
// Each sign-in records a session row (db/queries/sessions.ts) that every request checks (lib/auth/session.ts),
// so signing out ends the session on the server, not only in the browser. Roles are per series and read from
// the database on every request (lib/auth/guard.ts), so a changed role takes effect at once.
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { getDb } from '@/db/client';
import { SESSION_DAYS, endSession, startSession } from '@/db/queries/sessions';
import { findUserByEmail, setPasswordHash } from '@/db/queries/users';
import { signInSchema } from '@/lib/validation/account';
import { clientAddress } from './client-address';
import { dummyHash, hashPassword, needsRehash, verifyPassword } from './password';
import { authSecret } from './secret';
import { claimSignIn, noteSuccess } from './throttle';

/** The codes the sign-in form explains (next-auth passes a thrown message on as `?error=`). */
export const SIGN_IN_REFUSALS = { address: 'TooManyAttempts', client: 'TooManyFromClient' } as const;

export const authOptions: NextAuthOptions = {
  secret: authSecret(),
  session: { strategy: 'jwt', maxAge: SESSION_DAYS * 24 * 60 * 60 },
  pages: { signIn: '/signin', signOut: '/signout', error: '/signin' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: {
        email: { label: 'E-mail', type: 'email' },
        password: { label: 'Password', type: 'password' },
      },
      async authorize(credentials, req) {
        const parsed = signInSchema.safeParse(credentials ?? {});
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const db = await getDb();
        // The route handler answers 429 before we get here; this is the count that holds in parallel: the
        // attempt is counted for its client and its address (as a failure until it succeeds) before any hash.
        const claim = await claimSignIn(db, { email, client: clientAddress(req?.headers ?? {}) });
        if (!claim.ok) throw new Error(SIGN_IN_REFUSALS[claim.refusedBy]);
        const user = await findUserByEmail(db, email);
        // An unknown address is checked against a scrypt hash too: a miss costs what a hit costs.
        const ok = await verifyPassword(password, user?.passwordHash ?? (await dummyHash()));
        if (!user || !ok) return null;
        await noteSuccess(db, email, claim.clientAttemptId);
        // A hash from before (bcrypt, or older scrypt parameters) is replaced now that the password is known.
        if (needsRehash(user.passwordHash)) await setPasswordHash(db, user.id, await hashPassword(password));
        return { id: user.id, email: user.email, name: user.name };
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      // `user` is there only at sign-in: that is when a session begins.
      if (user) {
        token.sub = user.id;
        token.email = user.email;
        token.name = user.name;
        token.sid = await startSession(await getDb(), user.id);
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user && token.sub) (session.user as { id?: string }).id = token.sub;
      return session;
    },
  },
  events: {
    // POST /api/auth/signout: the cookie is cleared in the browser, and its session ended here, so a copy of
    // the cookie kept elsewhere no longer works.
    async signOut({ token }) {
      if (typeof token?.sid === 'string') await endSession(await getDb(), token.sid);
    },
  },
};
