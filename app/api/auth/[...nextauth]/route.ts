// GET/POST /api/auth/* – next-auth: sign-in with e-mail and password, session, sign-out.
import NextAuth from 'next-auth';
import { authOptions } from '@/lib/server/auth/options';

const handler = NextAuth(authOptions);

export { handler as GET, handler as POST };
