// GET /api/visits/:id/sheet/questions – the sheet's thread: the farmer's reading, decisions, questions and the answers.
// POST /api/visits/:id/sheet/questions – the farmer asks a question (the advisor and coordinators are e-mailed).
import { askQuestion, listSheetResponses } from '@/lib/server/data/sheet-responses';
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
  return Response.json({ response: await askQuestion(user, id, text) }, { status: 201 });
});
