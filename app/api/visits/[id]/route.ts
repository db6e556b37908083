// GET /api/visits/:id – one visit, if the caller may see it; PATCH moves it to a state the table of visit states allows the office (coordinators).
import { setVisitStatus } from '@/lib/server/data/visit-planning';
import { getVisitOrThrow } from '@/lib/server/data/visits';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';
import { visitStatusSchema } from '@/lib/shared/schemas/office';

export const GET = withAuth<{ id: string }>('visit:read', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  return Response.json({ visit: await getVisitOrThrow(user, id) });
});

export const PATCH = withAuth<{ id: string }>('visit:plan', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const { status } = await parseJsonBody(req, visitStatusSchema);
  return Response.json({ visit: await setVisitStatus(user, id, status) });
});
