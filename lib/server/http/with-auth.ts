import 'server-only';
import type { NextRequest } from 'next/server';
import { trustedProxyCount } from '../auth/client-address';
import type { JWT } from 'next-auth/jwt';
import { encode } from 'next-auth/jwt';
import { requireRequestSession } from '../auth/current-user';
import { servedOverHttps, sessionCookieName } from '../auth/cookies';
import { SESSION_MAX_AGE_S, SESSION_RENEW_AFTER_S } from '../auth/session-policy';
import { onReplicas, onWriter, WROTE_COOKIE, wroteRecently } from '../db/read-routing';
import { dbEnv } from '../env';
import { authorize, type Permission, type SessionUser } from '../auth/permissions';
import { forbidden, toHttpResponse } from '../errors';

type RouteContext<P> = { params: Promise<P> };

export interface AuthedContext<P> {
  req: NextRequest;
  user: SessionUser;
  params: P;
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * The origins a same-site page of this app can have: the configured public URL (NEXTAUTH_URL), and
 * the scheme and Host the request arrived with (`next start` may be addressed as localhost or
 * 127.0.0.1). X-Forwarded-Host and -Proto are the client's own text unless a proxy is configured.
 */
function expectedOrigins(req: NextRequest): Set<string> {
  const origins = new Set<string>([req.nextUrl.origin]);
  try {
    if (process.env.NEXTAUTH_URL) origins.add(new URL(process.env.NEXTAUTH_URL).origin);
  } catch {
    // A malformed NEXTAUTH_URL adds nothing; env parsing reports it elsewhere.
  }
  const proxied = trustedProxyCount() > 0;
  const host = (proxied ? req.headers.get('x-forwarded-host') : null) ?? req.headers.get('host');
  const proto = (proxied ? req.headers.get('x-forwarded-proto')?.split(',')[0]?.trim() : null) ?? req.nextUrl.protocol.replace(/:$/, '');
  if (host) origins.add(`${proto}://${host}`.toLowerCase());
  return origins;
}

/** Route handlers have no CSRF protection of their own: refuse cross-site mutations. */
export function assertSameOrigin(req: NextRequest) {
  if (SAFE_METHODS.has(req.method)) return;
  const site = req.headers.get('sec-fetch-site');
  if (site && site !== 'same-origin' && site !== 'none') throw forbidden('Cross-site requests are refused.');
  const origin = req.headers.get('origin');
  if (!origin) return;
  let parsed: string;
  try {
    parsed = new URL(origin).origin.toLowerCase();
  } catch {
    throw forbidden('Cross-site requests are refused.');
  }
  if (!expectedOrigins(req).has(parsed)) throw forbidden('Cross-site requests are refused.');
}

/**
 * With read replicas: writes, sync (a pull must see the push just made) and any request from a
 * person who wrote within DB_READ_AFTER_WRITE_SECONDS read from the primary; other reads from a replica.
 */
function readsOnWriter(req: NextRequest, permission: Permission): boolean {
  if (!SAFE_METHODS.has(req.method) || permission === 'sync:use') return true;
  return wroteRecently(req.cookies.get(WROTE_COOKIE)?.value, dbEnv().DB_READ_AFTER_WRITE_SECONDS);
}

/** After a successful write (replicas configured): mark the person so their next reads see it. */
function markWrote(req: NextRequest, res: Response): Response {
  const env = dbEnv();
  if (SAFE_METHODS.has(req.method) || !env.DB_READ_HOSTS.trim() || res.status >= 400) return res;
  try {
    res.headers.append('set-cookie', `${WROTE_COOKIE}=${Date.now()}; Path=/; Max-Age=${env.DB_READ_AFTER_WRITE_SECONDS}; HttpOnly; SameSite=Lax`);
  } catch {
    // A response with immutable headers (a redirect) keeps no mark; reads may lag a moment.
  }
  return res;
}

/**
 * Sliding sessions: a token used a day or more after it was issued is issued again (same claims,
 * a fresh two weeks), so a session ends after two weeks without use, not two weeks after sign-in.
 */
async function renewSession(claims: JWT, res: Response): Promise<Response> {
  const issued = typeof claims.iat === 'number' ? claims.iat : 0;
  const now = Math.floor(Date.now() / 1000);
  if (res.status >= 400 || now - issued < SESSION_RENEW_AFTER_S) return res;
  const url = process.env.NEXTAUTH_URL ?? '';
  const { iat: _iat, exp: _exp, jti: _jti, ...kept } = claims;
  const token = await encode({ token: kept as JWT, secret: process.env.NEXTAUTH_SECRET ?? '', maxAge: SESSION_MAX_AGE_S });
  const secure = servedOverHttps(url) ? '; Secure' : '';
  try {
    res.headers.append('set-cookie', `${sessionCookieName(url)}=${token}; Path=/; Max-Age=${SESSION_MAX_AGE_S}; HttpOnly; SameSite=Lax${secure}`);
  } catch {
    // A response with immutable headers keeps the old token; the next request renews it.
  }
  return res;
}

/**
 * Every answer behind a session is about a person: no browser or shared cache keeps it (a later
 * user of the same profile, after sign-out, finds nothing). A route may say something stricter.
 */
function noStore(res: Response): Response {
  try {
    if (!res.headers.get('cache-control')?.includes('no-store')) res.headers.set('cache-control', 'private, no-store');
  } catch {
    // A response with immutable headers (a redirect built by the platform) is left as it is.
  }
  return res;
}

/** Wraps a route handler: session (401), permission by role (403), same-origin writes, errors → status. */
export function withAuth<P = Record<string, never>>(permission: Permission, handler: (ctx: AuthedContext<P>) => Promise<Response>) {
  return async (req: NextRequest, context: RouteContext<P>): Promise<Response> => {
    const run = readsOnWriter(req, permission) ? onWriter : onReplicas;
    return run(async () => {
      try {
        // The account is read from the primary: a deactivation ends the session at once, lag or not.
        const { user, claims } = await onWriter(() => requireRequestSession(req));
        authorize(user, permission);
        assertSameOrigin(req);
        const res = await handler({ req, user, params: await context.params });
        return noStore(await renewSession(claims, markWrote(req, res)));
      } catch (error) {
        return noStore(toHttpResponse(error));
      }
    });
  };
}

/** Wraps a public route handler: errors → status, nothing else. */
export function withErrors<P = Record<string, never>>(handler: (req: NextRequest, params: P) => Promise<Response>) {
  return async (req: NextRequest, context: RouteContext<P>): Promise<Response> => {
    try {
      return await handler(req, await context.params);
    } catch (error) {
      return toHttpResponse(error);
    }
  };
}
