import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { Farm, Screening, User, Visit, getSequelize } from '@/lib/server/db';
import { VISIT_STATUS_LABELS, type Verdict, type VisitStatus } from '@/lib/shared/domain';
import type { VisitListQuery } from '@/lib/shared/schemas/list-query';
import { authorize, type Permission, type SessionUser } from '../auth/permissions';
import { notFound } from '../errors';

export interface VisitSummary {
  id: string;
  status: VisitStatus;
  statusLabel: string;
  plannedOn: string | null;
  lastSyncedAt: string | null;
  farm: { id: string; name: string; area: string };
  advisor: { id: string; name: string } | null;
  verdict: Verdict | null;
}

type VisitRow = Visit & { Farm?: Farm; advisor?: User | null };

function toSummary(row: VisitRow, verdict: Verdict | null): VisitSummary {
  return {
    id: row.id,
    status: row.status,
    statusLabel: VISIT_STATUS_LABELS[row.status] ?? row.status,
    plannedOn: row.plannedOn,
    lastSyncedAt: row.lastSyncedAt?.toISOString() ?? null,
    farm: { id: row.farmId, name: row.Farm?.name ?? '', area: row.Farm?.area ?? '' },
    advisor: row.advisor ? { id: row.advisor.id, name: row.advisor.name } : null,
    verdict,
  };
}

/** The visits a user may see: the organisation's, those assigned to them, or those of their farms. */
function visibleWhere(user: SessionUser): { where: WhereOptions; farmWhere?: WhereOptions } {
  const base = { organisationId: user.organisationId, deletedAt: null };
  if (user.role === 'coordinator') return { where: base };
  if (user.role === 'advisor') return { where: { ...base, advisorId: user.id } };
  return { where: base, farmWhere: { ownerId: user.id } };
}

async function latestVerdicts(visitIds: string[]): Promise<Map<string, Verdict>> {
  if (visitIds.length === 0) return new Map();
  const rows = await Screening.findAll({
    attributes: ['visitId', 'verdict', 'createdAt'],
    where: { visitId: { [Op.in]: visitIds } },
    order: [['createdAt', 'ASC']],
  });
  return new Map(rows.map((r) => [r.visitId, r.verdict]));
}

/** One page of visits visible to the user, newest planned date first. */
export async function listVisits(user: SessionUser, query: VisitListQuery) {
  const { where, farmWhere } = visibleWhere(user);
  const { rows, count } = await Visit.findAndCountAll({
    where: query.status ? { ...where, status: query.status } : where,
    include: [
      { model: Farm, attributes: ['id', 'name', 'area', 'ownerId'], where: farmWhere, required: true },
      { model: User, as: 'advisor', attributes: ['id', 'name'] },
    ],
    order: [['plannedOn', 'DESC'], ['id', 'ASC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  const verdicts = await latestVerdicts(rows.map((r) => r.id));
  return {
    items: (rows as VisitRow[]).map((r) => toSummary(r, verdicts.get(r.id) ?? null)),
    page: query.page,
    pageSize: query.pageSize,
    total: count,
  };
}

/** The visit, if it exists and the user holds the permission on it (404, then 403 otherwise). */
export async function getVisitOrThrow(user: SessionUser, id: string, permission: Permission = 'visit:read') {
  const row = (await Visit.findOne({
    where: { id, deletedAt: null },
    include: [
      { model: Farm, attributes: ['id', 'name', 'area', 'ownerId', 'organisationId'] },
      { model: User, as: 'advisor', attributes: ['id', 'name'] },
    ],
  })) as VisitRow | null;
  if (!row) throw notFound('visit');
  authorize(user, permission, {
    organisationId: row.organisationId,
    advisorIds: row.advisorId ? [row.advisorId] : [],
    ownerId: row.Farm?.ownerId ?? null,
  });
  const verdicts = await latestVerdicts([row.id]);
  return { ...toSummary(row, verdicts.get(row.id) ?? null), notes: row.notes };
}

/** Visits per status in the user's view, plus how many are overdue. */
export async function visitCounts(user: SessionUser, today = new Date().toISOString().slice(0, 10)) {
  const sequelize = getSequelize();
  const { where, farmWhere } = visibleWhere(user);
  const include = [{ model: Farm, attributes: [], where: farmWhere, required: true }];
  const rows = (await Visit.findAll({
    attributes: ['status', [sequelize.fn('COUNT', sequelize.col('Visit.id')), 'n']],
    where,
    include,
    group: ['status'],
    raw: true,
  })) as unknown as { status: VisitStatus; n: number }[];
  const overdue = await Visit.count({
    where: { ...where, status: { [Op.in]: ['requested', 'scheduled'] }, plannedOn: { [Op.lt]: today } },
    include,
  });
  const byStatus = Object.fromEntries(rows.map((r) => [r.status, Number(r.n)])) as Partial<Record<VisitStatus, number>>;
  return { byStatus, overdue };
}
