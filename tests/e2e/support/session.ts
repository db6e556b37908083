// A demo account's session cookie made directly (a signed JWT, as next-auth issues it), for tests
// that call a server over HTTP without signing in through a page.
import { encode } from 'next-auth/jwt';
import { query } from './db';

export interface DemoUser {
  id: string;
  role: 'advisor' | 'coordinator' | 'farmer';
  organisation_id: string;
  session_version: number;
  name: string;
  email: string;
}

/** The demo user with this e-mail and a `cookie` header value that signs them in. */
export async function demoSession(email: string): Promise<{ user: DemoUser; cookie: string }> {
  const [user] = await query<DemoUser>('SELECT id, role, organisation_id, session_version, name, email FROM users WHERE email = ?', [email]);
  if (!user) throw new Error(`the demo account ${email} is missing`);
  const token = await encode({
    secret: process.env.NEXTAUTH_SECRET ?? '',
    token: {
      uid: user.id,
      role: user.role,
      organisationId: user.organisation_id,
      sessionVersion: user.session_version,
      email: user.email,
      name: user.name,
    },
  });
  return { user, cookie: `next-auth.session-token=${token}` };
}
