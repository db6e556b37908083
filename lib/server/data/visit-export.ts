import 'server-only';
import { csvRow } from '@/lib/shared/csv';
import type { VisitFilters } from '@/lib/shared/schemas/list-query';
import { authorize, type SessionUser } from '../auth/permissions';
import { tooLarge } from '../errors';
import { listVisits } from './visits';

const HEADER = ['Farm', 'Area', 'Farmer', 'Advisor', 'Planned', 'State', 'Overdue', 'Screening', 'Last synced', 'Visit id'];
const PAGE = 100;
// Larger exports than this should be narrowed with filters first.
export const EXPORT_LIMIT = 20_000;

/** The filtered visits as CSV, in the table's order, read a page at a time. */
export async function* visitsCsv(user: SessionUser, filters: VisitFilters): AsyncGenerator<string> {
  authorize(user, 'visit:export');
  const first = await listVisits(user, { ...filters, page: 1, pageSize: PAGE });
  if (first.total > EXPORT_LIMIT) throw tooLarge(`That is ${first.total} visits; narrow the filters to at most ${EXPORT_LIMIT}.`);
  yield csvRow(HEADER);
  let page = first;
  for (let n = 1; ; n += 1) {
    for (const v of page.items) {
      yield csvRow([v.farm.name, v.farm.area, v.farmer?.name, v.advisor?.name ?? '', v.plannedOn, v.statusLabel,
        v.overdue ? 'yes' : '', v.verdict ?? '', v.lastSyncedAt, v.id]);
    }
    if (n * PAGE >= first.total) break;
    page = await listVisits(user, { ...filters, page: n + 1, pageSize: PAGE });
  }
}
