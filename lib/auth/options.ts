import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import bcrypt from 'bcryptjs';
import { env } from '@/lib/env';
import { db } from '@/models';
import type { User } from '@/models/User';
import { signInSchema } from '@/lib/validation/auth';
import { clearFailedSignIns, recordFailedSignIn, signInBlockedFor } from './limiter';
import type { Role } from './permissions';
import { clientAddress } from './client-address';
import { describeError } from '@/lib/log';

// Without NEXTAUTH_URL (the embedded set-up on any port) next-auth takes its origin from the request's host.
if (!process.env.NEXTAUTH_URL) process.env.AUTH_TRUST_HOST ??= 'true';

// A hash to compare against when no account matches, so both paths take the same time.
const DUMMY_HASH = '$2b$10$CwTycUXWue0Thq9StjUM0uJ8.RZV9Q1l0g9bSg6a8OpQj3oXGZr7e';

export const authOptions: NextAuthOptions = {
  secret: env().NEXTAUTH_SECRET,
  session: { strategy: 'jwt', maxAge: 12 * 60 * 60 },
  pages: { signIn: '/signin', error: '/signin' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(credentials, req) {
        const parsed = signInSchema.safeParse(credentials ?? {});
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const address = clientAddress(req?.headers as Record<string, unknown> | undefined);
        const wait = await signInBlockedFor(email, address);
        if (wait > 0) throw new Error(`TooManyAttempts:${wait}`);
        let user: User | null;
        try {
          user = await db().User.findOne({ where: { email } });
        } catch (err) {
          // next-auth would put the error's message in the redirect URL: log it here, answer as a failed sign-in.
          console.error(`[thawline] sign-in lookup failed: ${describeError(err)}`);
          return null;
        }
        const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
        if (!user || !ok || !user.active) {
          await recordFailedSignIn(email, address);
          return null;
        }
        await clearFailedSignIns(email);
        return { id: String(user.id), email: user.email, name: user.name, role: user.role, orgId: user.organizationId, sv: user.sessionVersion };
      },
    }),
  ],
  events: {
    // Signing out ends this session everywhere it was copied: the cookie is only cleared in this browser,
    // so the version it carries stops being the user's.
    async signOut({ token }) {
      if (!token?.uid) return;
      try {
        await db().User.increment('sessionVersion', { where: { id: token.uid, sessionVersion: token.sv ?? -1 } });
      } catch (err) {
        console.error('[thawline] sign-out could not end the session', err instanceof Error ? err.message : err);
      }
    },
  },
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        const u = user as unknown as { id: string; role: Role; orgId: number; sv: number };
        token.uid = Number(u.id);
        token.role = u.role;
        token.orgId = u.orgId;
        token.sv = u.sv;
      }
      return token;
    },
    async session({ session, token }) {
      session.user = { ...session.user, id: token.uid, role: token.role, orgId: token.orgId, sessionVersion: token.sv };
      return session;
    },
  },
};
