// GET /api/commissionings – predicted against measured delivery of every commissioned ram in the organisation (coordinators).
import { listCommissionings } from '@/lib/server/data/commissioning';
import { withAuth } from '@/lib/server/http/with-auth';

export const GET = withAuth('commissioning:read', async ({ user }) => Response.json({ items: await listCommissionings(user) }));
