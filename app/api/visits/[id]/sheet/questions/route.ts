// GET /api/visits/:id/sheet/questions – the farmer's questions and acknowledgements on the sheet.
// POST /api/visits/:id/sheet/questions – the farmer asks a question (the advisor and coordinator see it).
import { listSheetResponses, respondToSheet } from '@/lib/server/data/sheet-responses';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';
import { questionBody } from '@/lib/shared/schemas/sheet';

export const GET = withAuth<{ id: string }>('sheet:read', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  return Response.json({ responses: await listSheetResponses(user, id) });
});

export const POST = withAuth<{ id: string }>('sheet:acknowledge', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const { text } = await parseJsonBody(req, questionBody);
  return Response.json({ response: await respondToSheet(user, id, 'question', text) }, { status: 201 });
});
