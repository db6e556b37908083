// GET /api/farms/:id – one farm for editing; PATCH edits it (coordinators of its organisation).
import { getFarmForEdit, updateFarm } from '@/lib/server/data/farm-editing';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';
import { farmSchema } from '@/lib/shared/schemas/office';

export const GET = withAuth<{ id: string }>('farm:edit', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  return Response.json({ farm: await getFarmForEdit(user, id) });
});

export const PATCH = withAuth<{ id: string }>('farm:edit', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const input = await parseJsonBody(req, farmSchema);
  return Response.json({ farm: await updateFarm(user, id, input) });
});
