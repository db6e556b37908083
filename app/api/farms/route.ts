// GET /api/farms – one page of the farms the caller may see; POST adds a farm (coordinators).
import { createFarm } from '@/lib/server/data/farm-editing';
import { listFarms } from '@/lib/server/data/farms';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { pageQuery, searchParamsObject } from '@/lib/shared/schemas/list-query';
import { farmSchema } from '@/lib/shared/schemas/office';

export const GET = withAuth('farm:read', async ({ req, user }) => {
  const page = pageQuery.parse(searchParamsObject(req.nextUrl.searchParams));
  return Response.json(await listFarms(user, page));
});

export const POST = withAuth('farm:edit', async ({ req, user }) => {
  const input = await parseJsonBody(req, farmSchema);
  return Response.json({ farm: await createFarm(user, input) }, { status: 201 });
});
