import 'server-only';
import { getServerSession } from 'next-auth';
import { getToken, type JWT } from 'next-auth/jwt';
import type { NextRequest } from 'next/server';
import { User } from '@/lib/server/db';
import { unauthorized } from '../errors';
import { servedOverHttps, sessionCookieName } from './cookies';
import { authOptions } from './options';
import type { SessionUser } from './permissions';

/**
 * The signed-in user, re-read from the database on every request: a deactivated account or a
 * bumped session version ends the session at once, whatever the JWT says.
 */
async function loadUser(claims: Pick<JWT, 'uid' | 'sessionVersion'> | null | undefined): Promise<SessionUser | null> {
  if (!claims?.uid) return null;
  // Only what a request needs (never the password hash), as a plain row: this runs on every request.
  const user = await User.findByPk(claims.uid, {
    attributes: ['id', 'organisationId', 'role', 'name', 'email', 'units', 'active', 'sessionVersion'], raw: true,
  });
  if (!user || !user.active || user.sessionVersion !== claims.sessionVersion) return null;
  return {
    id: user.id,
    organisationId: user.organisationId,
    role: user.role,
    name: user.name,
    email: user.email,
    units: user.units ?? 'metric',
  };
}

/** For route handlers: the user behind the request's session cookie, or null. */
export async function getRequestUser(req: NextRequest): Promise<SessionUser | null> {
  const url = process.env.NEXTAUTH_URL ?? '';
  return loadUser(await getToken({ req, cookieName: sessionCookieName(url), secureCookie: servedOverHttps(url) }));
}

/** For server components and actions: the user of the current request, or null. */
export async function getCurrentUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  if (!session?.user) return null;
  return loadUser({ uid: session.user.id, sessionVersion: session.user.sessionVersion });
}

export async function requireRequestUser(req: NextRequest): Promise<SessionUser> {
  const user = await getRequestUser(req);
  if (!user) throw unauthorized();
  return user;
}
