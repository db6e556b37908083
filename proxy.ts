// Runs before the app for the paths below. Two jobs:
// - A path whose percent-encoding is malformed (`%E0%A4%A`, `%ZZ`), which Next would answer with a
//   bare 500 when it decodes a dynamic segment, gets a plain 400 instead.
// - Signed-out visitors of the office and farm pages go to /login. A convenience only: every page,
//   route handler and action checks the session, role and ownership itself.
// A photo upload (PUT /api/photos/<uuid>, up to 15 MB) is left out too: a request that passes through
// here has its body copied in memory and cut at 10 MB, and the upload route streams it to disk. Its
// path is a well-formed id, so the encoding check has nothing to do; any other photo path still comes here.
// The field pages are left out on purpose: they are static shells the service worker precaches
// (a redirect here would be cached in their place) and they send a signed-out visitor to /login
// themselves; their data comes only through the sync routes, which check the session.
import { withAuth } from 'next-auth/middleware';
import { NextResponse, type NextFetchEvent, type NextRequest } from 'next/server';

const signInFirst = withAuth({ pages: { signIn: '/login' } });

export default function proxy(req: NextRequest, event: NextFetchEvent) {
  try {
    decodeURIComponent(req.nextUrl.pathname);
  } catch {
    return NextResponse.json(
      { error: { code: 'bad_path', message: 'This address is not valid: part of it is wrongly encoded.' } },
      { status: 400, headers: { 'cache-control': 'no-store' } },
    );
  }
  if (/^\/(office|farm)(\/|$)/.test(req.nextUrl.pathname)) return signInFirst(req as Parameters<typeof signInFirst>[0], event);
  return NextResponse.next();
}

export const config = {
  matcher: ['/office/:path*', '/farm/:path*', '/api/:path((?!photos/[0-9a-fA-F-]{36}$|sync/(?:push|pull)$).*)', '/sheets/:path*', '/welcome/:path*'],
};
