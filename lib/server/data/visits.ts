import 'server-only';
import { Op, type Order, type WhereOptions } from 'sequelize';
import { Farm, User, Visit, getSequelize } from '@/lib/server/db';
import { VISIT_STATUSES, type VisitStatus } from '@/lib/shared/domain';
import type { VisitFilters, VisitListQuery } from '@/lib/shared/schemas/list-query';
import { todayIso } from '@/lib/shared/visit-rules';
import { authorize, type Permission, type SessionUser } from '../auth/permissions';
import { notFound } from '../errors';
import { latestVerdict, latestVerdictSql, toSummary, visitSummaries, type SummaryRow } from './visit-summaries';

export { visitSummaries, type VisitSummary } from './visit-summaries';

/** The visits a user may see: the organisation's, those assigned to them, or those of their farms. */
function visibleWhere(user: SessionUser): { where: WhereOptions; farmWhere?: WhereOptions } {
  const base = { organisationId: user.organisationId, deletedAt: null };
  if (user.role === 'coordinator') return { where: base };
  if (user.role === 'advisor') return { where: { ...base, advisorId: user.id } };
  return { where: base, farmWhere: { ownerId: user.id } };
}

// The latest screening's verdict of the row's visit.
const LATEST_VERDICT_SQL = latestVerdictSql('`Visit`.`id`');

/** Escapes LIKE wildcards so a search for "50%" finds the text, not everything. */
const likeContains = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/**
 * The where clauses of the filters. Each is served by an index: status, advisor and planned date
 * by the visits_org_live_* indexes (migration 0012, covering: counts read the index alone), area by
 * farms_org_area_name joined to visits_farm_live_status (0013, both read alone), verdict by
 * screenings_visit_created. The text search is a LIKE "contains" on farm and farmer names: it
 * reads the organisation's farms from farms_org_name_owner, acceptable at a few thousand farms per
 * organisation.
 */
function filterWhere(filters: Partial<VisitFilters>, today: string): { visit: WhereOptions[]; farm: WhereOptions[] } {
  const sequelize = getSequelize();
  const visit: WhereOptions[] = [];
  const farm: WhereOptions[] = [];
  if (filters.status) visit.push({ status: filters.status });
  if (filters.advisor) visit.push({ advisorId: filters.advisor === 'none' ? null : filters.advisor });
  if (filters.plannedFrom) visit.push({ plannedOn: { [Op.gte]: filters.plannedFrom } });
  if (filters.plannedTo) visit.push({ plannedOn: { [Op.lte]: filters.plannedTo } });
  if (filters.overdue) visit.push({ status: { [Op.in]: ['requested', 'scheduled'] }, plannedOn: { [Op.lt]: today } });
  if (filters.verdict === 'none') {
    visit.push(sequelize.literal('NOT EXISTS (SELECT 1 FROM screenings s0 WHERE s0.visit_id = `Visit`.`id`)'));
  } else if (filters.verdict) {
    visit.push(sequelize.where(sequelize.literal(LATEST_VERDICT_SQL), filters.verdict));
  }
  if (filters.area) farm.push({ area: filters.area });
  if (filters.q) {
    const pattern = likeContains(filters.q);
    visit.push({ [Op.or]: [{ '$Farm.name$': { [Op.like]: pattern } }, { '$Farm.owner.name$': { [Op.like]: pattern } }] });
  }
  return { visit, farm };
}

function orderOf(filters: Partial<VisitFilters>): Order {
  const dir = (filters.dir ?? 'desc').toUpperCase() as 'ASC' | 'DESC';
  // The tie-break runs the same way as the sort, so an index on (organisation, column) + the primary key gives the order.
  const tie: [string, string] = ['id', dir];
  switch (filters.sort ?? 'planned') {
    case 'farm':
      return [[{ model: Farm, as: 'Farm' }, 'name', dir], tie];
    case 'advisor':
      return [[{ model: User, as: 'advisor' }, 'name', dir], tie];
    case 'status': {
      const list = VISIT_STATUSES.map((s) => `'${s}'`).join(',');
      return [[getSequelize().literal(`FIELD(\`Visit\`.\`status\`, ${list})`), dir], tie];
    }
    case 'synced':
      return [['lastSyncedAt', dir], tie];
    case 'updated':
      return [['updatedAt', dir], tie];
    default:
      return [['plannedOn', dir], tie];
  }
}

/** The where, joins and order of the visits the user may see, filtered and sorted as asked. */
function visitQuery(user: SessionUser, query: Partial<VisitFilters>, today: string, withColumns = true) {
  const { where, farmWhere } = visibleWhere(user);
  const filters = filterWhere(query, today);
  // Only these filters read the farm (or its owner); these sorts read a joined name. Without them a
  // count or an id list reads the visits index alone.
  const filtersJoin = !!farmWhere || filters.farm.length > 0 || !!query.q;
  // The farm's organisation is the visit's: saying so lets a join read farms by farms_org_* indexes.
  const farmConditions = [{ organisationId: user.organisationId }, ...(farmWhere ? [farmWhere] : []), ...filters.farm];
  return {
    filtersJoin,
    sortsJoin: query.sort === 'farm' || query.sort === 'advisor',
    where: { [Op.and]: [where, ...filters.visit] },
    include: [
      {
        model: Farm,
        attributes: withColumns ? ['id', 'name', 'area', 'ownerId'] : [],
        required: true,
        where: { [Op.and]: farmConditions },
        include: [{ model: User, as: 'owner', attributes: withColumns ? ['id', 'name'] : [] }],
      },
      { model: User, as: 'advisor', attributes: withColumns ? ['id', 'name'] : [] },
    ],
    order: orderOf(query),
    subQuery: false,
  };
}

/** One page of the visits the user may see, filtered and sorted as asked. */
export async function listVisits(user: SessionUser, query: VisitListQuery, today = todayIso()) {
  const { filtersJoin, where, include } = visitQuery(user, query, today);
  const [ids, count] = await Promise.all([
    visitIdsInOrder(user, query, today, { limit: query.pageSize, offset: (query.page - 1) * query.pageSize }),
    // The count reads the visits index alone unless a filter needs the farm.
    filtersJoin ? Visit.count({ where, include: countInclude(include), distinct: true, col: 'id' }) : Visit.count({ where }),
  ]);
  return {
    items: await visitSummaries(user, ids, today),
    page: query.page,
    pageSize: query.pageSize,
    total: count,
  };
}

/** The joins a count needs: the farm (and its owner, for the name search), no columns. */
function countInclude(include: ReturnType<typeof visitQuery>['include']) {
  const [farm] = include;
  return farm ? [{ ...farm, attributes: [], include: [{ model: User, as: 'owner', attributes: [] }] }] : [];
}

/**
 * The ids of the visits the user may see under the filters, in the list's order (all, or one page).
 * Without a farm filter or a name sort it reads a visits index alone, in order: joined, the optimizer
 * would start from the farms and sort every visit of the organisation to find one page.
 */
export async function visitIdsInOrder(
  user: SessionUser,
  filters: Partial<VisitFilters>,
  today = todayIso(),
  page: { limit?: number; offset?: number } = {},
): Promise<string[]> {
  const { filtersJoin, sortsJoin, ...found } = visitQuery(user, filters, today, false);
  const rows = await Visit.findAll({ ...found, ...(filtersJoin || sortsJoin ? {} : { include: [] }), attributes: ['id'], raw: true, ...page });
  return rows.map((r) => r.id);
}

/** The visit, if it exists and the user holds the permission on it (404, then 403 otherwise). */
export async function getVisitOrThrow(user: SessionUser, id: string, permission: Permission = 'visit:read') {
  const row = (await Visit.findOne({
    where: { id, deletedAt: null },
    include: [
      {
        model: Farm,
        attributes: ['id', 'name', 'area', 'ownerId', 'organisationId'],
        include: [{ model: User, as: 'owner', attributes: ['id', 'name'] }],
      },
      { model: User, as: 'advisor', attributes: ['id', 'name'] },
    ],
  })) as (Visit & { Farm?: Farm & { owner?: User | null }; advisor?: User | null }) | null;
  if (!row) throw notFound('visit');
  authorize(user, permission, {
    organisationId: row.organisationId,
    advisorIds: row.advisorId ? [row.advisorId] : [],
    ownerId: row.Farm?.ownerId ?? null,
  });
  const flat: SummaryRow = {
    id: row.id,
    status: row.status,
    plannedOn: row.plannedOn,
    lastSyncedAt: row.lastSyncedAt,
    updatedAt: row.updatedAt,
    farmId: row.farmId,
    farmName: row.Farm?.name ?? '',
    farmArea: row.Farm?.area ?? '',
    ownerId: row.Farm?.owner?.id ?? null,
    ownerName: row.Farm?.owner?.name ?? null,
    advisorId: row.advisor?.id ?? null,
    advisorName: row.advisor?.name ?? null,
    verdict: await latestVerdict(row.id),
  };
  return { ...toSummary(flat, todayIso()), notes: row.notes };
}

/** Visits per status in the user's view, plus how many are overdue. */
export async function visitCounts(user: SessionUser, today = todayIso()) {
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
