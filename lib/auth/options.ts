// next-auth: e-mail + password (Credentials), JWT sessions carrying the user id.
// Roles are per series and read from the database on every request (lib/auth/guard.ts),
// so a changed role takes effect at once.
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { getDb } from '@/db/client';
import { findUserByEmail } from '@/db/queries/users';
import { signInSchema } from '@/lib/validation/account';
import { dummyHash, verifyPassword } from './password';
import { authSecret } from './secret';
import { claimAttempt, noteSuccess } from './throttle';

export const authOptions: NextAuthOptions = {
  secret: authSecret(),
  session: { strategy: 'jwt', maxAge: 30 * 24 * 60 * 60 },
  pages: { signIn: '/signin', signOut: '/signout', error: '/signin' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: {
        email: { label: 'E-mail', type: 'email' },
        password: { label: 'Password', type: 'password' },
      },
      async authorize(credentials) {
        const parsed = signInSchema.safeParse(credentials ?? {});
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const db = await getDb();
        // The route handler answers 429 before we get here; this is the lock that holds in parallel:
        // the attempt is counted (as a failure until it succeeds) before the password is checked.
        if (!(await claimAttempt(db, email))) throw new Error('TooManyAttempts');
        const user = await findUserByEmail(db, email);
        const ok = await verifyPassword(password, user?.passwordHash ?? (await dummyHash()));
        if (!user || !ok) return null;
        await noteSuccess(db, email);
        return { id: user.id, email: user.email, name: user.name };
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.sub = user.id;
        token.email = user.email;
        token.name = user.name;
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user && token.sub) (session.user as { id?: string }).id = token.sub;
      return session;
    },
  },
};
