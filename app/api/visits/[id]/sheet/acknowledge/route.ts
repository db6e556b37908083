// POST /api/visits/:id/sheet/acknowledge – the farmer says they have read the sheet.
import { respondToSheet } from '@/lib/server/data/sheet-responses';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';

export const POST = withAuth<{ id: string }>('sheet:acknowledge', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  const response = await respondToSheet(user, id, 'acknowledged', 'I have read the sheet.');
  return Response.json({ response }, { status: 201 });
});
