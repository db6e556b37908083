import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { randomUUID } from 'node:crypto';
import { EndedSession, User } from '@/lib/server/db';
import { sameOriginPath } from '@/lib/shared/return-path';
import { signInSchema } from '@/lib/shared/schemas/sign-in';
import { AppError } from '../errors';
import { clientAddress } from './client-address';
import { authCookieOptions } from './cookies';
import { dummyHash, verifyPassword } from './passwords';
import { assertSignInAllowed, recordSignIn } from './rate-limit';
import { SESSION_MAX_AGE_S } from './session-policy';
import { decodeSessionToken } from './session-token';

const WRONG = 'That e-mail and password do not match an active account.';

export const authOptions: NextAuthOptions = {
  session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_S },
  jwt: { decode: decodeSessionToken },
  // Read straight from the env (as next-auth does): importing these options must not need the rest.
  ...authCookieOptions(process.env.NEXTAUTH_URL ?? ''),
  pages: { signIn: '/login', error: '/login' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { type: 'email' }, password: { type: 'password' } },
      // Messages thrown here reach the sign-in form as its error text.
      async authorize(credentials, req) {
        const parsed = signInSchema.safeParse(credentials ?? {});
        if (!parsed.success) throw new Error(parsed.error.issues[0]?.message ?? WRONG);
        const { email, password } = parsed.data;
        const address = clientAddress(req?.headers);
        try {
          await assertSignInAllowed(email, address);
        } catch (error) {
          if (error instanceof AppError) throw new Error(error.message);
          throw error;
        }
        const user = await User.findOne({ where: { email } });
        // bcrypt runs whatever the account: an unknown or switched-off one answers in the same time.
        const matches = await verifyPassword(password, user?.passwordHash ?? (await dummyHash()));
        const ok = !!user?.passwordHash && user.active && matches;
        await recordSignIn(email, address, ok);
        if (!user || !ok) throw new Error(WRONG);
        await user.update({ lastSignInAt: new Date() });
        return {
          id: user.id,
          name: user.name,
          email: user.email,
          role: user.role,
          organisationId: user.organisationId,
          sessionVersion: user.sessionVersion,
        };
      },
    }),
  ],
  events: {
    // The cookie is cleared in the browser; the token itself is listed as ended, so a copy of it
    // (another tab's, a stolen one) is refused too. The person's other sessions go on.
    async signOut({ token }) {
      if (!token?.sid || !token.uid) return;
      const expiresAt = new Date(((typeof token.exp === 'number' ? token.exp : 0) || Date.now() / 1000 + SESSION_MAX_AGE_S) * 1000);
      await EndedSession.upsert({ sid: String(token.sid).slice(0, 64), userId: String(token.uid), expiresAt });
    },
  },
  callbacks: {
    // next-auth's own check lets `/\host` through (it only looks for a leading slash).
    redirect({ url, baseUrl }) {
      const path = sameOriginPath(url, baseUrl);
      return path ? new URL(path, baseUrl).toString() : baseUrl;
    },
    jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        token.role = user.role;
        token.organisationId = user.organisationId;
        token.sessionVersion = user.sessionVersion;
        token.sid = randomUUID();
      }
      return token;
    },
    session({ session, token }) {
      session.user = {
        id: token.uid,
        role: token.role,
        organisationId: token.organisationId,
        name: token.name ?? '',
        email: token.email ?? '',
        sessionVersion: token.sessionVersion,
        sid: token.sid,
      };
      return session;
    },
  },
};
