// POST /api/visits/:id/sheet/send – e-mails the sheet (link + PDF) to the farmer; records the send.
import { parseJsonBody } from '@/lib/server/http/json-body';
import { withAuth } from '@/lib/server/http/with-auth';
import { sendSheet } from '@/lib/server/sheets/send';
import { idParam } from '@/lib/shared/schemas/list-query';
import { sendSheetBody } from '@/lib/shared/schemas/sheet';

export const runtime = 'nodejs';

export const POST = withAuth<{ id: string }>('sheet:send', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const body = await parseJsonBody(req, sendSheetBody);
  const send = await sendSheet(user, id, body);
  if (send.status !== 'sent') {
    // Recorded as failed (shown with a Retry button), with a plain reason.
    return Response.json({ error: { code: 'mail_failed', message: send.error ?? 'The message was not sent.' }, send }, { status: 502 });
  }
  return Response.json({ send }, { status: 201 });
});
