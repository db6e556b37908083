// Redirects signed-out visitors of the office and farm pages to /login. A convenience only: every
// page, route handler and action checks the session, role and ownership itself.
// The field pages are left out on purpose: they are static shells the service worker precaches
// (a redirect here would be cached in their place) and they send a signed-out visitor to /login
// themselves; their data comes only through the sync routes, which check the session.
import { withAuth } from 'next-auth/middleware';

export default withAuth({ pages: { signIn: '/login' } });

export const config = { matcher: ['/office/:path*', '/farm/:path*'] };
