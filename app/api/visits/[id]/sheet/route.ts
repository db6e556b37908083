// GET /api/visits/:id/sheet – the visit's sheet as display strings, in the caller's units.
import { loadSheet } from '@/lib/server/data/sheets';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';
import { buildSheetView } from '@/lib/shared/sheet/view-model';

export const GET = withAuth<{ id: string }>('sheet:read', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  const sheet = await loadSheet(user, id);
  return Response.json({ sheet: buildSheetView(sheet.source, user.units), status: sheet.visit.status });
});
