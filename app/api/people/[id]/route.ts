// PATCH /api/people/:id – switch an account off (its sessions end at once) or back on (coordinators).
import { setPersonActive } from '@/lib/server/data/people-admin';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';
import { personUpdateSchema } from '@/lib/shared/schemas/office';

export const PATCH = withAuth<{ id: string }>('people:manage', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const { active } = await parseJsonBody(req, personUpdateSchema);
  return Response.json({ person: await setPersonActive(user, id, active) });
});
