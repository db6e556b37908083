// GET /api/me – the signed-in user's own account.
import { withAuth } from '@/lib/server/http/with-auth';
import { HOME_BY_ROLE } from '@/lib/shared/domain';

export const GET = withAuth('profile:read', async ({ user }) => Response.json({ user, home: HOME_BY_ROLE[user.role] }));
