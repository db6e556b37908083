import 'server-only';
import { getServerSession } from 'next-auth';
import { getToken, type JWT } from 'next-auth/jwt';
import type { NextRequest } from 'next/server';
import { getSequelize, withConnection } from '@/lib/server/db';
import type { Role } from '@/lib/shared/domain';
import { unauthorized } from '../errors';
import { servedOverHttps, sessionCookieName } from './cookies';
import { authOptions } from './options';
import { decodeSessionToken } from './session-token';
import type { SessionUser } from './permissions';

interface AccountRow {
  id: string;
  organisationId: string;
  role: Role;
  name: string;
  email: string;
  units: SessionUser['units'] | null;
  active: number | boolean;
  sessionVersion: number;
  ended: number;
}

/**
 * The signed-in user, re-read from the database on every request: a deactivated account or a
 * bumped session version ends the session at once, whatever the JWT says.
 */
async function loadUser(claims: Pick<JWT, 'uid' | 'sessionVersion' | 'sid'> | null | undefined): Promise<SessionUser | null> {
  if (!claims?.uid) return null;
  // Only what a request needs (never the password hash), and whether this session was ended, in one
  // plain statement: this runs on every request.
  const sql = `SELECT u.id, u.organisation_id AS organisationId, u.role, u.name, u.email, u.units, u.active, u.session_version AS sessionVersion,
            EXISTS (SELECT 1 FROM ended_sessions e WHERE e.sid = ?) AS ended
     FROM users u WHERE u.id = ?`;
  // Straight on a pool connection (routed like any read): Sequelize's query pipeline cost about a
  // fifth of this check.
  const [user] = await withConnection(getSequelize(), (on) => on.query<AccountRow[]>(sql, [claims.sid ?? '', claims.uid]), { writer: false });
  if (!user || !user.active || Number(user.sessionVersion) !== claims.sessionVersion || Number(user.ended) === 1) return null;
  return {
    id: user.id,
    organisationId: user.organisationId,
    role: user.role,
    name: user.name,
    email: user.email,
    units: user.units ?? 'metric',
  };
}

/** For route handlers: the user behind the request's session cookie and its token's claims, or null. */
export async function getRequestSession(req: NextRequest): Promise<{ user: SessionUser; claims: JWT } | null> {
  const url = process.env.NEXTAUTH_URL ?? '';
  const claims = await getToken({ req, cookieName: sessionCookieName(url), secureCookie: servedOverHttps(url), decode: decodeSessionToken });
  const user = await loadUser(claims);
  return user && claims ? { user, claims } : null;
}

/** For route handlers: the user behind the request's session cookie, or null. */
export async function getRequestUser(req: NextRequest): Promise<SessionUser | null> {
  return (await getRequestSession(req))?.user ?? null;
}

/** For server components and actions: the user of the current request, or null. */
export async function getCurrentUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  if (!session?.user) return null;
  return loadUser({ uid: session.user.id, sessionVersion: session.user.sessionVersion, sid: session.user.sid });
}

export async function requireRequestUser(req: NextRequest): Promise<SessionUser> {
  return (await requireRequestSession(req)).user;
}

/** The user and claims of the request's session, or a 401. */
export async function requireRequestSession(req: NextRequest): Promise<{ user: SessionUser; claims: JWT }> {
  const session = await getRequestSession(req);
  if (!session) throw unauthorized();
  return session;
}
