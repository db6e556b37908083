import 'server-only';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/lib/server/db';
import { csvRow } from '@/lib/shared/csv';
import { isoMinute } from '@/lib/shared/display/dates';
import { VERDICT_WORDS } from '@/lib/shared/sheet/view-model';
import type { VisitFilters } from '@/lib/shared/schemas/list-query';
import { authorize, type SessionUser } from '../auth/permissions';
import { tooLarge } from '../errors';
import { todayIso } from '@/lib/shared/visit-rules';
import { visitSummaries } from './visit-summaries';
import { visitIdsInOrder } from './visits';

// Units in the headers; figures from the latest screening, in litres a day whatever the reader's units.
const HEADER = [
  'Farm',
  'Area',
  'Farmer',
  'Advisor',
  'Planned (date)',
  'State',
  'Overdue',
  'Verdict',
  'Delivery (L/day)',
  'Demand (L/day)',
  'Margin (L/day: delivery minus demand)',
  'Last synced (UTC)',
  'Visit id',
];
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
    const chunk = ids.slice(i, i + CHUNK);
    const [summaries, figures] = await Promise.all([visitSummaries(user, chunk, today), latestFigures(chunk)]);
    const rows = summaries.map((v) => {
      const f = figures.get(v.id);
      const margin = f?.deliveryLpd != null && f.demandLpd != null ? f.deliveryLpd - f.demandLpd : null;
      return csvRow([
        v.farm.name,
        v.farm.area,
        v.farmer?.name,
        v.advisor?.name ?? '',
        v.plannedOn,
        v.statusLabel,
        v.overdue ? 'yes' : 'no',
        v.verdict ? VERDICT_WORDS[v.verdict] : 'not screened',
        litres(f?.deliveryLpd),
        litres(f?.demandLpd),
        litres(margin),
        v.lastSyncedAt ? isoMinute(v.lastSyncedAt) : 'never',
        v.id,
      ]);
    });
    yield rows.join('');
  }
}

const litres = (v: number | null | undefined) => (v == null ? '' : Math.round(v));

/** The latest screening's delivery and demand of each visit (index screenings_visit_created). */
async function latestFigures(visitIds: string[]): Promise<Map<string, { deliveryLpd: number | null; demandLpd: number | null }>> {
  if (visitIds.length === 0) return new Map();
  const rows = await getSequelize().query<{ visitId: string; deliveryLpd: number | null; demandLpd: number | null }>(
    `SELECT s.visit_id AS visitId, s.delivery_lpd AS deliveryLpd, s.demand_lpd AS demandLpd FROM screenings s
      WHERE s.visit_id IN (?) ORDER BY s.visit_id, s.created_at DESC, s.id DESC`,
    { replacements: [visitIds], type: QueryTypes.SELECT },
  );
  const out = new Map<string, { deliveryLpd: number | null; demandLpd: number | null }>();
  for (const r of rows) {
    if (!out.has(r.visitId))
      out.set(r.visitId, { deliveryLpd: r.deliveryLpd === null ? null : Number(r.deliveryLpd), demandLpd: r.demandLpd === null ? null : Number(r.demandLpd) });
  }
  return out;
}
