import 'server-only';
import { knownDemandFigures } from '@/lib/shared/demand-kinds';
import { DemandLine, Farm, getSequelize, Organisation, selectRows, Visit, withConnection, type PlainRow, type TxConnection } from '@/lib/server/db';
import type { PulledEntity, PullResponse } from '@/lib/shared/schemas/sync';
import type { SessionUser } from '../auth/permissions';
import { ENTITY_SPECS, pulledRecord, type SyncedRow } from '../sync/entities';

type ChildEntity = PulledEntity;
type Kind = ChildEntity | 'farm' | 'visit';
interface Change {
  kind: Kind;
  rev: number;
  row: SyncedRow;
}

const VISIT_CHILDREN = ['waterSource', 'flowMeasurement', 'fallReading', 'point', 'photo', 'pipeRun'] as const;

/**
 * The visits a phone holds. Advisors: every visit assigned to them. Coordinators: their
 * organisation's visits that are in the field (booked or walked), not the whole archive.
 */
function visibleVisits(user: SessionUser, on: TxConnection): Promise<PlainRow[]> {
  const base = 'organisation_id = ? AND deleted_at IS NULL';
  if (user.role === 'advisor') return selectRows(on, Visit, { where: `${base} AND advisor_id = ? ORDER BY rev`, replacements: [user.organisationId, user.id] });
  return selectRows(on, Visit, { where: `${base} AND status IN ('scheduled', 'surveyed') ORDER BY rev`, replacements: [user.organisationId] });
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
async function candidates(cursor: number, limit: number, visible: PlainRow[], on: TxConnection): Promise<Change[]> {
  const exposedAt = (v: PlainRow) => Number(v.get('exposedRev'));
  const exposedVisit = new Map(visible.filter((v) => exposedAt(v) > cursor).map((v) => [v.id, exposedAt(v)]));
  const farmExposure = new Map<string, number>();
  for (const v of visible) {
    const farmId = String(v.get('farmId'));
    farmExposure.set(farmId, Math.min(farmExposure.get(farmId) ?? Infinity, exposedAt(v)));
  }
  const settledVisits = visible.filter((v) => !exposedVisit.has(v.id)).map((v) => v.id);
  const exposedVisits = [...exposedVisit.keys()];
  const settledFarms = [...farmExposure].filter(([, rev]) => rev <= cursor).map(([id]) => id);
  const exposedFarms = [...farmExposure].filter(([, rev]) => rev > cursor).map(([id]) => id);

  // Plain rows (no model instances): a page holds hundreds of records copied straight to JSON. The
  // statements go out together on the one connection (no pool connection per table).
  const none = Promise.resolve([] as PlainRow[]);
  const newer = (model: Parameters<typeof selectRows>[1], key: string, ids: string[]) =>
    ids.length ? selectRows(on, model, { where: `${key} IN (?) AND rev > ? ORDER BY rev LIMIT ?`, replacements: [ids, cursor, limit + 1] }) : none;
  const every = (model: Parameters<typeof selectRows>[1], key: string, ids: string[]) =>
    ids.length ? selectRows(on, model, { where: `${key} IN (?)`, replacements: [ids] }) : none;
  const visitExposure = (row: SyncedRow) => exposedVisit.get(String(row.get('visitId'))) ?? 0;
  const farmExposed = (key: string) => (row: SyncedRow) => farmExposure.get(String(row.get(key))) ?? 0;
  const [farmsNew, farmsAll, demandNew, demandAll, childrenNew, childrenAll] = await Promise.all([
    newer(Farm, 'id', settledFarms),
    every(Farm, 'id', exposedFarms),
    newer(DemandLine, 'farm_id', settledFarms),
    every(DemandLine, 'farm_id', exposedFarms),
    Promise.all(VISIT_CHILDREN.map((entity) => newer(ENTITY_SPECS[entity].model, 'visit_id', settledVisits))),
    Promise.all(VISIT_CHILDREN.map((entity) => every(ENTITY_SPECS[entity].model, 'visit_id', exposedVisits))),
  ]);
  return [
    ...asChanges(
      'visit',
      visible.filter((v) => v.rev > cursor),
    ),
    ...asChanges('farm', farmsNew),
    ...asChanges('farm', farmsAll, farmExposed('id')),
    ...asChanges('demandLine', demandNew),
    ...asChanges('demandLine', demandAll, farmExposed('farmId')),
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
  // One connection for the whole page (its reads pipelined on it), not one pool connection per table.
  // No transaction: revisions commit in order (DEVELOPERS.md, "Server revisions"), so each read
  // seeing what was committed when it ran never skips a change below the page's cursor.
  const { visible, all, owners, organisation } = await withConnection(getSequelize(), async (on) => {
    // The organisation's settings go out with the first read, as a plain row on the same connection.
    const settingsRow = selectRows(on, Organisation, { where: 'id = ?', replacements: [user.organisationId] });
    const visible = await visibleVisits(user, on);
    const all = await candidates(cursor, limit, visible, on);
    const ownerIds = [
      ...new Set(
        all
          .filter((c) => c.kind === 'farm')
          .map((c) => c.row.get('ownerId'))
          .filter((id): id is string => typeof id === 'string'),
      ),
    ];
    const [people, [organisation]] = await Promise.all([
      ownerIds.length > 0 ? on.query<{ id: string; name: string }[]>('SELECT id, name FROM users WHERE id IN (?)', [ownerIds]) : Promise.resolve([]),
      settingsRow,
    ]);
    if (!organisation) throw new Error(`organisation ${user.organisationId} not found`);
    return { visible, all, owners: new Map(people.map((u) => [u.id, u.name])), organisation: organisation.values as unknown as Organisation };
  });
  const visitIds = visible.map((v) => v.id);
  const unique = cutPage(all, limit);
  const hasMore = unique.length < all.length;
  const nextCursor = unique.length > 0 ? (unique[unique.length - 1] as Change).rev : cursor;

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
      ...(organisation.settings.minProbabilityForGo !== undefined ? { minProbabilityForGo: organisation.settings.minProbabilityForGo } : {}),
      demandFigures: knownDemandFigures(organisation.settings.demandFigures),
    },
  };
  for (const { kind, row } of unique) {
    if (kind === 'farm') {
      const farm = (row as PlainRow).values as unknown as Farm;
      response.farms.push({
        id: farm.id,
        rev: Number(farm.rev),
        name: farm.name,
        area: farm.area,
        lat: farm.lat,
        lon: farm.lon,
        notes: farm.notes,
        ownerName: farm.ownerId ? (owners.get(farm.ownerId) ?? null) : null,
      });
    } else if (kind === 'visit') {
      const visit = (row as PlainRow).values as unknown as Visit;
      response.visits.push({
        ...(pulledRecord(ENTITY_SPECS.visit, row) as PullResponse['visits'][number]),
        farmId: visit.farmId,
        plannedOn: visit.plannedOn,
        advisorId: visit.advisorId,
      });
    } else {
      records[kind].push(pulledRecord(ENTITY_SPECS[kind], row));
    }
  }
  return response;
}
