// Redirects signed-out visitors of the signed-in areas to /login. A convenience only: every
// page, route handler and action checks the session, role and ownership itself.
import { withAuth } from 'next-auth/middleware';

export default withAuth({ pages: { signIn: '/login' } });

export const config = { matcher: ['/office/:path*', '/field/:path*', '/farm/:path*'] };
