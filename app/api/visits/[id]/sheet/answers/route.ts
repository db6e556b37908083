// POST /api/visits/:id/sheet/answers – the assigned advisor or a coordinator answers a farmer's question (the farmer is e-mailed).
import { answerQuestion } from '@/lib/server/data/sheet-responses';
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';
import { answerBody } from '@/lib/shared/schemas/sheet';

export const POST = withAuth<{ id: string }>('sheet:answer', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const { questionId, text } = await parseJsonBody(req, answerBody);
  return Response.json({ response: await answerQuestion(user, id, questionId, text) }, { status: 201 });
});
