// GET /api/farms – one page of the farms the caller may see.
import { listFarms } from '@/lib/server/data/farms';
import { withAuth } from '@/lib/server/http/with-auth';
import { pageQuery, searchParamsObject } from '@/lib/shared/schemas/list-query';

export const GET = withAuth('farm:read', async ({ req, user }) => {
  const page = pageQuery.parse(searchParamsObject(req.nextUrl.searchParams));
  return Response.json(await listFarms(user, page));
});
