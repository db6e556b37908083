// GET /api/visits – one page of the visits the caller may see, filtered and sorted; POST plans a new visit.
import { createVisit } from '@/lib/server/data/visit-planning';
import { listVisits } from '@/lib/server/data/visits';
import { withAuth } from '@/lib/server/http/with-auth';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { searchParamsObject, visitListQuery } from '@/lib/shared/schemas/list-query';
import { visitCreateSchema } from '@/lib/shared/schemas/office';

export const GET = withAuth('visit:read', async ({ req, user }) => {
  const query = visitListQuery.parse(searchParamsObject(req.nextUrl.searchParams));
  return Response.json(await listVisits(user, query));
});

export const POST = withAuth('visit:plan', async ({ req, user }) => {
  const input = await parseJsonBody(req, visitCreateSchema);
  return Response.json({ visit: await createVisit(user, input) }, { status: 201 });
});
