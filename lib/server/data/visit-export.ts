import 'server-only';
import { csvRow } from '@/lib/shared/csv';
import type { VisitFilters } from '@/lib/shared/schemas/list-query';
import { authorize, type SessionUser } from '../auth/permissions';
import { tooLarge } from '../errors';
import { todayIso } from '@/lib/shared/visit-rules';
import { visitSummaries } from './visit-summaries';
import { visitIdsInOrder } from './visits';

const HEADER = ['Farm', 'Area', 'Farmer', 'Advisor', 'Planned', 'State', 'Overdue', 'Screening', 'Last synced', 'Visit id'];
const CHUNK = 500;
// Larger exports than this should be narrowed with filters first.
export const EXPORT_LIMIT = 20_000;

/**
 * The filtered visits as CSV, in the table's order. Keyset-style: one read of the ordered ids (no
 * OFFSET pages, no count per page), then the rows CHUNK ids at a time by primary key. Yields the
 * header, then one string per chunk: a stream pull per row cost more than the rows themselves.
 */
export async function* visitsCsv(user: SessionUser, filters: VisitFilters): AsyncGenerator<string> {
  authorize(user, 'visit:export');
  const today = todayIso();
  const ids = await visitIdsInOrder(user, filters, today);
  if (ids.length > EXPORT_LIMIT) throw tooLarge(`That is ${ids.length} visits; narrow the filters to at most ${EXPORT_LIMIT}.`);
  yield csvRow(HEADER);
  for (let i = 0; i < ids.length; i += CHUNK) {
    const rows = (await visitSummaries(user, ids.slice(i, i + CHUNK), today)).map((v) => csvRow([v.farm.name, v.farm.area,
      v.farmer?.name, v.advisor?.name ?? '', v.plannedOn, v.statusLabel, v.overdue ? 'yes' : '', v.verdict ?? '', v.lastSyncedAt, v.id]));
    yield rows.join('');
  }
}
