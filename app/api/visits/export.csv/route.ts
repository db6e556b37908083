// GET /api/visits/export.csv – the filtered visits (same filters as GET /api/visits) as a CSV download.
import { visitsCsv } from '@/lib/server/data/visit-export';
import { withAuth } from '@/lib/server/http/with-auth';
import { isoDay } from '@/lib/shared/display/dates';
import { searchParamsObject, visitFilters } from '@/lib/shared/schemas/list-query';

export const GET = withAuth('visit:export', async ({ req, user }) => {
  const filters = visitFilters.parse(searchParamsObject(req.nextUrl.searchParams));
  const rows = visitsCsv(user, filters);
  // The first chunk is read here so that a refusal (403, 413) is a status, not a broken download.
  const first = await rows.next();
  const encoder = new TextEncoder();
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      if (!first.done) controller.enqueue(encoder.encode(`\uFEFF${first.value}`));
    },
    async pull(controller) {
      const next = await rows.next();
      if (next.done) controller.close();
      else controller.enqueue(encoder.encode(next.value));
    },
  });
  const day = isoDay(new Date());
  return new Response(body, {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="fallbook-visits-${day}.csv"`,
      'cache-control': 'no-store',
    },
  });
});
