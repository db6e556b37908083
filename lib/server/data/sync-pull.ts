import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { DemandLine, Farm, Organisation, User, Visit } from '@/lib/server/db';
import type { PullResponse, SyncEntity } from '@/lib/shared/schemas/sync';
import type { SessionUser } from '../auth/permissions';
import { ENTITY_SPECS, pulledRecord, type SyncedRow } from '../sync/entities';

type ChildEntity = Exclude<SyncEntity, 'visit'>;
type Kind = ChildEntity | 'farm' | 'visit';
interface Change { kind: Kind; rev: number; row: SyncedRow }

const VISIT_CHILDREN = ['waterSource', 'flowMeasurement', 'fallReading', 'point', 'photo', 'pipeRun'] as const;

/**
 * The visits a phone holds. Advisors: every visit assigned to them. Coordinators: their
 * organisation's visits that are in the field (booked or walked), not the whole archive.
 */
function visibleVisitsWhere(user: SessionUser): WhereOptions {
  const base = { organisationId: user.organisationId, deletedAt: null };
  if (user.role === 'advisor') return { ...base, advisorId: user.id };
  return { ...base, status: { [Op.in]: ['scheduled', 'surveyed'] } };
}

const byRev = (a: Change, b: Change) => a.rev - b.rev;
const asChanges = (kind: Kind, rows: unknown[]): Change[] => (rows as SyncedRow[]).map((row) => ({ kind, rev: Number(row.rev), row }));

/** Rows of each table past the cursor (at most limit + 1 each: enough to fill one page in rev order). */
async function changedSince(cursor: number, limit: number, visitIds: string[], farmIds: string[]): Promise<Change[]> {
  if (visitIds.length === 0) return [];
  const after = { rev: { [Op.gt]: cursor } };
  const page = { order: [['rev', 'ASC']] as [string, string][], limit: limit + 1 };
  const [farms, demand, ...children] = await Promise.all([
    Farm.findAll({ where: { id: { [Op.in]: farmIds }, ...after }, ...page }),
    DemandLine.findAll({ where: { farmId: { [Op.in]: farmIds }, ...after }, ...page }),
    ...VISIT_CHILDREN.map((entity) => ENTITY_SPECS[entity].model.findAll({ where: { visitId: { [Op.in]: visitIds }, ...after }, ...page })),
  ]);
  return [
    ...asChanges('farm', farms), ...asChanges('demandLine', demand),
    ...children.flatMap((rows, i) => asChanges(VISIT_CHILDREN[i] as ChildEntity, rows)),
  ];
}

/** Everything of newly visible visits that an older cursor would skip: children, farm, demand lines. */
async function wholeVisits(cursor: number, visits: Visit[]): Promise<Change[]> {
  if (visits.length === 0) return [];
  const visitIds = visits.map((v) => v.id);
  const farmIds = [...new Set(visits.map((v) => v.farmId))];
  const upTo = { rev: { [Op.lte]: cursor } };
  const [farms, demand, ...children] = await Promise.all([
    Farm.findAll({ where: { id: { [Op.in]: farmIds }, ...upTo } }),
    DemandLine.findAll({ where: { farmId: { [Op.in]: farmIds }, ...upTo } }),
    ...VISIT_CHILDREN.map((entity) => ENTITY_SPECS[entity].model.findAll({ where: { visitId: { [Op.in]: visitIds }, ...upTo } })),
  ]);
  return [
    ...asChanges('farm', farms), ...asChanges('demandLine', demand),
    ...children.flatMap((rows, i) => asChanges(VISIT_CHILDREN[i] as ChildEntity, rows)),
  ];
}

/**
 * Changes visible to the caller since `cursor`, in revision order, at most `limit` changed rows a
 * page. A visit whose own revision is past the cursor (new, newly assigned, or changed) comes with
 * all its records, so a phone that just gained it holds it whole; those extras ride on top of limit.
 */
export async function pullChanges(user: SessionUser, { cursor, limit }: { cursor: number; limit: number }): Promise<PullResponse> {
  const visible = await Visit.findAll({ where: visibleVisitsWhere(user), order: [['rev', 'ASC']] });
  const visitIds = visible.map((v) => v.id);
  const farmIds = [...new Set(visible.map((v) => v.farmId))];

  const candidates = [
    ...asChanges('visit', visible.filter((v) => Number(v.rev) > cursor)),
    ...(await changedSince(cursor, limit, visitIds, farmIds)),
  ].sort(byRev);
  const page = candidates.slice(0, limit);
  const hasMore = candidates.length > limit;
  const nextCursor = page.length > 0 ? (page[page.length - 1] as Change).rev : cursor;

  const pagedVisits = page.filter((c) => c.kind === 'visit').map((c) => c.row as unknown as Visit);
  const all = [...page, ...(await wholeVisits(cursor, pagedVisits))];
  const seen = new Set<string>();
  const unique = all.filter((c) => (seen.has(`${c.kind}:${c.row.id}`) ? false : (seen.add(`${c.kind}:${c.row.id}`), true))).sort(byRev);

  const owners = new Map<string, string>();
  const ownerIds = [...new Set(unique.filter((c) => c.kind === 'farm').map((c) => (c.row as unknown as Farm).ownerId).filter((id): id is string => !!id))];
  if (ownerIds.length > 0) {
    for (const u of await User.findAll({ attributes: ['id', 'name'], where: { id: { [Op.in]: ownerIds } } })) owners.set(u.id, u.name);
  }
  const organisation = await Organisation.findByPk(user.organisationId, { rejectOnEmpty: true });

  const records = Object.fromEntries([...VISIT_CHILDREN, 'demandLine'].map((k) => [k, [] as unknown[]])) as Record<ChildEntity, unknown[]>;
  const response: PullResponse = {
    cursor: nextCursor,
    hasMore,
    visibleVisitIds: visitIds,
    farms: [],
    visits: [],
    records: records as PullResponse['records'],
    settings: {
      unitsDefault: organisation.settings.unitsDefault,
      designFractionOfLowest: organisation.settings.designFractionOfLowest,
      demandFigures: organisation.settings.demandFigures,
    },
  };
  for (const { kind, row } of unique) {
    if (kind === 'farm') {
      const farm = row as unknown as Farm;
      response.farms.push({ id: farm.id, rev: Number(farm.rev), name: farm.name, area: farm.area, lat: farm.lat, lon: farm.lon,
        notes: farm.notes, ownerName: farm.ownerId ? owners.get(farm.ownerId) ?? null : null });
    } else if (kind === 'visit') {
      const visit = row as unknown as Visit;
      response.visits.push({ ...(pulledRecord(ENTITY_SPECS.visit, row) as PullResponse['visits'][number]),
        farmId: visit.farmId, plannedOn: visit.plannedOn, advisorId: visit.advisorId });
    } else {
      records[kind].push(pulledRecord(ENTITY_SPECS[kind], row));
    }
  }
  return response;
}
