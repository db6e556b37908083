import 'server-only';
import type { NextRequest } from 'next/server';
import { requireRequestUser } from '../auth/current-user';
import { authorize, type Permission, type SessionUser } from '../auth/permissions';
import { forbidden, toHttpResponse } from '../errors';

type RouteContext<P> = { params: Promise<P> };

export interface AuthedContext<P> {
  req: NextRequest;
  user: SessionUser;
  params: P;
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function hostOf(origin: string): string | null {
  try {
    return new URL(origin).host;
  } catch {
    return null;
  }
}

// Route handlers have no CSRF protection of their own: refuse cross-site mutations.
function assertSameOrigin(req: NextRequest) {
  if (SAFE_METHODS.has(req.method)) return;
  const site = req.headers.get('sec-fetch-site');
  if (site && site !== 'same-origin' && site !== 'none') throw forbidden('Cross-site requests are refused.');
  const origin = req.headers.get('origin');
  // NextURL reports 127.0.0.1 as "localhost", so compare hosts with the Host header as well.
  if (origin && origin !== req.nextUrl.origin && hostOf(origin) !== req.headers.get('host')) {
    throw forbidden('Cross-site requests are refused.');
  }
}

/** Wraps a route handler: session (401), permission by role (403), same-origin writes, errors → status. */
export function withAuth<P = Record<string, never>>(
  permission: Permission,
  handler: (ctx: AuthedContext<P>) => Promise<Response>,
) {
  return async (req: NextRequest, context: RouteContext<P>): Promise<Response> => {
    try {
      const user = await requireRequestUser(req);
      authorize(user, permission);
      assertSameOrigin(req);
      return await handler({ req, user, params: await context.params });
    } catch (error) {
      return toHttpResponse(error);
    }
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
