// POST /api/visits/:id/sheet/send/preview – the e-mail a send would carry (to, subject, text, with
// the sender's note), in the farmer's units; nothing is sent or recorded.
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { previewSheetSend } from '@/lib/server/sheets/send';
import { idParam } from '@/lib/shared/schemas/list-query';
import { sendSheetBody } from '@/lib/shared/schemas/sheet';

export const runtime = 'nodejs';

export const POST = withAuth<{ id: string }>('sheet:send', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const body = await parseJsonBody(req, sendSheetBody);
  return Response.json({ preview: await previewSheetSend(user, id, body) });
});
