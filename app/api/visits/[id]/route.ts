// GET /api/visits/:id – one visit, if the caller may see it.
import { getVisitOrThrow } from '@/lib/server/data/visits';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';

export const GET = withAuth<{ id: string }>('visit:read', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  return Response.json({ visit: await getVisitOrThrow(user, id) });
});
