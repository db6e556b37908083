// GET /api/visits/:id/sheet/pdf?paper=a4|letter – the sheet as a PDF, in the caller's units.
import { loadSheet } from '@/lib/server/data/sheets';
import { withAuth } from '@/lib/server/http/with-auth';
import { sheetContentDisposition } from '@/lib/server/sheets/file-name';
import { renderSheetPdf } from '@/lib/server/sheets/pdf';
import { idParam, searchParamsObject } from '@/lib/shared/schemas/list-query';
import { paperQuery } from '@/lib/shared/schemas/sheet';
import { buildSheetView } from '@/lib/shared/sheet/view-model';

export const runtime = 'nodejs';

export const GET = withAuth<{ id: string }>('sheet:read', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  const { paper } = paperQuery.parse(searchParamsObject(req.nextUrl.searchParams));
  const sheet = await loadSheet(user, id);
  const view = buildSheetView(sheet.source, user.units);
  const pdf = await renderSheetPdf(view, paper ?? (user.units === 'us' ? 'letter' : 'a4'));
  return new Response(new Uint8Array(pdf), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': sheetContentDisposition(view.farmName),
      'cache-control': 'private, no-store',
    },
  });
});
