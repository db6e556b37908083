// GET /api/people – the organisation's people (coordinators only).
import { listPeople } from '@/lib/server/data/people';
import { withAuth } from '@/lib/server/http/with-auth';
import { pageQuery, searchParamsObject } from '@/lib/shared/schemas/list-query';

export const GET = withAuth('people:read', async ({ req, user }) => {
  const page = pageQuery.parse(searchParamsObject(req.nextUrl.searchParams));
  return Response.json(await listPeople(user, page));
});
