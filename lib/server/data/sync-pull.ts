import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { DemandLine, Farm, Organisation, User, Visit } from '@/lib/server/db';
import type { PulledEntity, PullResponse } from '@/lib/shared/schemas/sync';
import type { SessionUser } from '../auth/permissions';
import { ENTITY_SPECS, pulledRecord, type SyncedRow } from '../sync/entities';

type ChildEntity = PulledEntity;
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
/** Rows as changes at their effective revision: their own, or later if their visit appeared later. */
const asChanges = (kind: Kind, rows: unknown[], exposedAt: (row: SyncedRow) => number = () => 0): Change[] =>
  (rows as SyncedRow[]).map((row) => ({ kind, rev: Math.max(Number(row.rev), exposedAt(row)), row }));

/**
 * Candidate changes past the cursor. Records of visits (and farms) that a phone may already hold
 * count at their own revision (at most limit + 1 per table: enough for one page in rev order).
 * Records of visits that appeared after the cursor count at the revision the visit appeared at,
 * all of them whatever their own revision, so the phone gets the visit whole, once.
 */
async function candidates(cursor: number, limit: number, visible: Visit[]): Promise<Change[]> {
  const exposedVisit = new Map(visible.filter((v) => Number(v.exposedRev) > cursor).map((v) => [v.id, Number(v.exposedRev)]));
  const farmExposure = new Map<string, number>();
  for (const v of visible) farmExposure.set(v.farmId, Math.min(farmExposure.get(v.farmId) ?? Infinity, Number(v.exposedRev)));
  const settledVisits = visible.filter((v) => !exposedVisit.has(v.id)).map((v) => v.id);
  const exposedVisits = [...exposedVisit.keys()];
  const settledFarms = [...farmExposure].filter(([, rev]) => rev <= cursor).map(([id]) => id);
  const exposedFarms = [...farmExposure].filter(([, rev]) => rev > cursor).map(([id]) => id);

  const after = { rev: { [Op.gt]: cursor } };
  const page = { order: [['rev', 'ASC']] as [string, string][], limit: limit + 1 };
  const none = Promise.resolve([]);
  const visitExposure = (row: SyncedRow) => exposedVisit.get(String(row.get('visitId'))) ?? 0;
  const farmExposed = (key: string) => (row: SyncedRow) => farmExposure.get(String(row.get(key))) ?? 0;
  const [farmsNew, farmsAll, demandNew, demandAll, childrenNew, childrenAll] = await Promise.all([
    settledFarms.length ? Farm.findAll({ where: { id: { [Op.in]: settledFarms }, ...after }, ...page }) : none,
    exposedFarms.length ? Farm.findAll({ where: { id: { [Op.in]: exposedFarms } } }) : none,
    settledFarms.length ? DemandLine.findAll({ where: { farmId: { [Op.in]: settledFarms }, ...after }, ...page }) : none,
    exposedFarms.length ? DemandLine.findAll({ where: { farmId: { [Op.in]: exposedFarms } } }) : none,
    Promise.all(VISIT_CHILDREN.map((entity) => (settledVisits.length
      ? ENTITY_SPECS[entity].model.findAll({ where: { visitId: { [Op.in]: settledVisits }, ...after }, ...page }) : none))),
    Promise.all(VISIT_CHILDREN.map((entity) => (exposedVisits.length
      ? ENTITY_SPECS[entity].model.findAll({ where: { visitId: { [Op.in]: exposedVisits } } }) : none))),
  ]);
  return [
    ...asChanges('visit', visible.filter((v) => Number(v.rev) > cursor)),
    ...asChanges('farm', farmsNew), ...asChanges('farm', farmsAll, farmExposed('id')),
    ...asChanges('demandLine', demandNew), ...asChanges('demandLine', demandAll, farmExposed('farmId')),
    ...childrenNew.flatMap((rows, i) => asChanges(VISIT_CHILDREN[i] as ChildEntity, rows)),
    ...childrenAll.flatMap((rows, i) => asChanges(VISIT_CHILDREN[i] as ChildEntity, rows, visitExposure)),
  ].sort(byRev);
}

/** The first `limit` changes, never splitting changes that share one revision (a visit appearing whole). */
function cutPage(all: Change[], limit: number): Change[] {
  let end = Math.min(limit, all.length);
  while (end < all.length && all[end]?.rev === all[end - 1]?.rev) end++;
  return all.slice(0, end);
}

/**
 * Changes visible to the caller since `cursor`, in revision order, about `limit` rows a page (a
 * visit that appeared after the cursor comes whole in one page, even past the limit).
 */
export async function pullChanges(user: SessionUser, { cursor, limit }: { cursor: number; limit: number }): Promise<PullResponse> {
  const visible = await Visit.findAll({ where: visibleVisitsWhere(user), order: [['rev', 'ASC']] });
  const visitIds = visible.map((v) => v.id);
  const all = await candidates(cursor, limit, visible);
  const unique = cutPage(all, limit);
  const hasMore = unique.length < all.length;
  const nextCursor = unique.length > 0 ? (unique[unique.length - 1] as Change).rev : cursor;

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
