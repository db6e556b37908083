// GET /api/visits/:id/sheet/sends – every e-mailing of the sheet, newest first, with failures.
import { listSheetSends } from '@/lib/server/data/sheet-responses';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';

export const GET = withAuth<{ id: string }>('sheet:send', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  return Response.json({ sends: await listSheetSends(user, id) });
});
