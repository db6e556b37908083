// GET /api/visits/:id/audit – who changed what on the visit, and when (coordinators).
import { visitAuditTrail } from '@/lib/server/data/audit-trail';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';

export const GET = withAuth<{ id: string }>('visit:audit', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  return Response.json({ items: await visitAuditTrail(user, id) });
});
