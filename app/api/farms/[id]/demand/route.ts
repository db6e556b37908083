// GET /api/farms/:id/demand – the farm's water needs and demand lines (farmer, assigned advisor, coordinator).
// PUT /api/farms/:id/demand – the farmer (or advisor/coordinator) enters the needs; writes demand lines.
import { getFarmNeeds, putFarmNeeds } from '@/lib/server/data/farm-needs';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';
import { farmNeedsBody } from '@/lib/shared/schemas/sheet';

export const GET = withAuth<{ id: string }>('farm:read', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  return Response.json({ needs: await getFarmNeeds(user, id) });
});

export const PUT = withAuth<{ id: string }>('demand:edit', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const body = await parseJsonBody(req, farmNeedsBody);
  return Response.json({ needs: await putFarmNeeds(user, id, body) });
});
