// GET /api/sync/pull – records visible to the caller changed since ?cursor=, in revision order (?limit= per page).
import { pullChanges } from '@/lib/server/data/sync-pull';
import { withAuth } from '@/lib/server/http/with-auth';
import { searchParamsObject } from '@/lib/shared/schemas/list-query';
import { pullQuerySchema } from '@/lib/shared/schemas/sync';

export const runtime = 'nodejs';

export const GET = withAuth('sync:use', async ({ req, user }) => {
  const query = pullQuerySchema.parse(searchParamsObject(req.nextUrl.searchParams));
  return Response.json(await pullChanges(user, query));
});
