// POST /api/visits/:id/commissioning – records what the installed ram measured, checks it against the screening, marks the visit commissioned.
import { recordCommissioning } from '@/lib/server/data/commissioning';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { commissioningInputSchema } from '@/lib/shared/schemas/commissioning';
import { idParam } from '@/lib/shared/schemas/list-query';

export const POST = withAuth<{ id: string }>('visit:commission', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const input = await parseJsonBody(req, commissioningInputSchema);
  return Response.json({ commissioning: await recordCommissioning(user, id, input) }, { status: 201 });
});
