// POST /api/visits/:id/sheet/acknowledge – the farmer says they have read the sent sheet (not a decision).
import { acknowledgeSheet } from '@/lib/server/data/sheet-responses';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';

export const POST = withAuth<{ id: string }>('sheet:acknowledge', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  return Response.json({ response: await acknowledgeSheet(user, id) }, { status: 201 });
});
