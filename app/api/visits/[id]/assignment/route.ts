// PUT /api/visits/:id/assignment – assign or reassign the visit's advisor and planned date; mails the advisor.
import { assignVisit } from '@/lib/server/data/visit-planning';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';
import { visitAssignSchema } from '@/lib/shared/schemas/office';

export const PUT = withAuth<{ id: string }>('visit:plan', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const input = await parseJsonBody(req, visitAssignSchema);
  return Response.json({ visit: await assignVisit(user, id, input) });
});
