// GET /api/visits/deleted – the organisation's deleted visits, newest first, so the office can restore them.
import { listDeletedVisits } from '@/lib/server/data/visit-restore';
import { withAuth } from '@/lib/server/http/with-auth';

export const GET = withAuth('visit:plan', async ({ user }) => Response.json({ items: await listDeletedVisits(user) }));
