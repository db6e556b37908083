// POST /api/visits/:id/sheet/decision – the farmer's decision on the sent sheet: go ahead, or not now with a reason.
import { decideOnSheet } from '@/lib/server/data/sheet-responses';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';
import { decisionBody } from '@/lib/shared/schemas/sheet';

export const POST = withAuth<{ id: string }>('sheet:decide', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const { decision, reason } = await parseJsonBody(req, decisionBody);
  return Response.json({ response: await decideOnSheet(user, id, decision, reason) }, { status: 201 });
});
