import 'server-only';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/lib/server/db';
import { VISIT_STATUS_LABELS, type Verdict, type VisitStatus } from '@/lib/shared/domain';
import { isOverdue, todayIso } from '@/lib/shared/visit-rules';
import { SHEET_RELEASED } from '@/lib/shared/visit-states';
import type { SessionUser } from '../auth/permissions';

/** A row of the office's visits table (and of its CSV export). */
export interface VisitSummary {
  id: string;
  status: VisitStatus;
  statusLabel: string;
  plannedOn: string | null;
  lastSyncedAt: string | null;
  updatedAt: string;
  overdue: boolean;
  farm: { id: string; name: string; area: string };
  farmer: { id: string; name: string } | null;
  advisor: { id: string; name: string } | null;
  verdict: Verdict | null;
}

/** A visit with its farm, farmer and advisor, as one flat row of the summaries' query. */
export interface SummaryRow {
  id: string;
  status: VisitStatus;
  plannedOn: string | null;
  lastSyncedAt: Date | null;
  updatedAt: Date;
  farmId: string;
  farmName: string;
  farmArea: string;
  ownerId: string | null;
  ownerName: string | null;
  advisorId: string | null;
  advisorName: string | null;
  verdict: Verdict | null;
}

export function toSummary(row: SummaryRow, today: string): VisitSummary {
  return {
    id: row.id,
    status: row.status,
    statusLabel: VISIT_STATUS_LABELS[row.status] ?? row.status,
    plannedOn: row.plannedOn,
    lastSyncedAt: row.lastSyncedAt?.toISOString() ?? null,
    updatedAt: row.updatedAt.toISOString(),
    overdue: isOverdue(row, today),
    farm: { id: row.farmId, name: row.farmName, area: row.farmArea },
    farmer: row.ownerId ? { id: row.ownerId, name: row.ownerName ?? '' } : null,
    advisor: row.advisorId ? { id: row.advisorId, name: row.advisorName ?? '' } : null,
    verdict: row.verdict,
  };
}

/** The latest screening's verdict of the visit in `visitColumn`, as a subquery (index screenings_visit_created). */
export const latestVerdictSql = (visitColumn: string) =>
  `(SELECT s.verdict FROM screenings s WHERE s.visit_id = ${visitColumn} ORDER BY s.created_at DESC, s.id DESC LIMIT 1)`;

/** The latest screening's verdict of the visit, or null before its first screening. */
export async function latestVerdict(visitId: string): Promise<Verdict | null> {
  const [row] = await getSequelize().query<{ verdict: Verdict | null }>(`SELECT ${latestVerdictSql('?')} AS verdict`, {
    replacements: [visitId],
    type: QueryTypes.SELECT,
  });
  return row?.verdict ?? null;
}

// The summaries' one query: the visits by primary key with their farm (in the user's organisation,
// and the farmer's own for a farmer), its owner, the advisor and the latest screening's verdict,
// as flat columns.
const SUMMARY_SQL = `SELECT v.id, v.status, v.planned_on AS plannedOn, v.last_synced_at AS lastSyncedAt, v.updated_at AS updatedAt,
  v.farm_id AS farmId, f.name AS farmName, f.area AS farmArea, o.id AS ownerId, o.name AS ownerName, a.id AS advisorId, a.name AS advisorName,
  ${latestVerdictSql('v.id')} AS verdict
  FROM visits v
  JOIN farms f ON f.id = v.farm_id AND f.organisation_id = ?
  LEFT JOIN users o ON o.id = f.owner_id
  LEFT JOIN users a ON a.id = v.advisor_id
  WHERE v.id IN (?)`;

/** The summaries of the given visits (already checked visible), in the order of `ids`. */
export async function visitSummaries(user: SessionUser, ids: string[], today = todayIso()): Promise<VisitSummary[]> {
  if (ids.length === 0) return [];
  // Flat plain rows from one hand-written join: Sequelize's nesting of joined rows and its model
  // instances cost more than the query at export sizes.
  const farmerOnly = user.role === 'farmer';
  const rows = await getSequelize().query<SummaryRow>(farmerOnly ? `${SUMMARY_SQL} AND f.owner_id = ?` : SUMMARY_SQL, {
    replacements: farmerOnly ? [user.organisationId, ids, user.id] : [user.organisationId, ids],
    type: QueryTypes.SELECT,
  });
  const byId = new Map(rows.map((r) => [r.id, r]));
  return ids.flatMap((id) => {
    const row = byId.get(id);
    if (!row) return [];
    // A farmer learns the verdict from the sheet once it is sent, not before.
    return [toSummary(farmerOnly && !SHEET_RELEASED.includes(row.status) ? { ...row, verdict: null } : row, today)];
  });
}
