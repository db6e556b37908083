// POST /api/visits/:id/jump – a coordinator moves a visit outside the usual order, with a stated reason (audited).
import { jumpVisitStatus } from '@/lib/server/data/visit-planning';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';
import { visitJumpSchema } from '@/lib/shared/schemas/office';

export const POST = withAuth<{ id: string }>('visit:jump', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const { status, reason } = await parseJsonBody(req, visitJumpSchema);
  return Response.json({ visit: await jumpVisitStatus(user, id, status, reason) });
});
