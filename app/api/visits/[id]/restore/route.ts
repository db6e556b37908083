// POST /api/visits/:id/restore – bring a deleted visit back (coordinators); a live visit is left as it is.
import { restoreVisit } from '@/lib/server/data/visit-restore';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';

export const POST = withAuth<{ id: string }>('visit:plan', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  return Response.json({ visit: await restoreVisit(user, id) });
});
