// GET /api/visits – one page of the visits the caller may see (?page, ?pageSize, ?status).
import { listVisits } from '@/lib/server/data/visits';
import { withAuth } from '@/lib/server/http/with-auth';
import { searchParamsObject, visitListQuery } from '@/lib/shared/schemas/list-query';

export const GET = withAuth('visit:read', async ({ req, user }) => {
  const query = visitListQuery.parse(searchParamsObject(req.nextUrl.searchParams));
  return Response.json(await listVisits(user, query));
});
