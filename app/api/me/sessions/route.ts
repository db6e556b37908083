// POST /api/me/sessions – "sign out everywhere": ends every session of the signed-in person (this one too).
import { endAllSessions } from '@/lib/server/data/sessions';
import { withAuth } from '@/lib/server/http/with-auth';

export const POST = withAuth('profile:read', async ({ user }) => Response.json(await endAllSessions(user)));
