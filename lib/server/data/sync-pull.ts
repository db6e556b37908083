import 'server-only';
import { knownDemandFigures } from '@/lib/shared/demand-kinds';
import {
  DemandLine,
  Farm,
  getSequelize,
  quote,
  selectRows,
  Visit,
  withConnection,
  type OrganisationSettings,
  type PlainRow,
  type TxConnection,
} from '@/lib/server/db';
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

/** A table whose rows a phone may already hold: its rows are read by `key` among `ids`. */
interface SettledTable {
  kind: Kind;
  model: Parameters<typeof selectRows>[1];
  key: string;
  ids: string[];
}

/** The tables that hold a row past the cursor among their keys: one statement, one row of flags. */
async function tablesWithNews(cursor: number, tables: SettledTable[], on: TxConnection): Promise<Set<SettledTable>> {
  const asked = tables.filter((t) => t.ids.length > 0);
  if (asked.length === 0) return new Set();
  const sql = `SELECT ${asked.map((t, i) => `EXISTS (SELECT 1 FROM ${quote(t.model.getTableName() as string)} WHERE ${t.key} IN (?) AND rev > ?) AS f${i}`).join(', ')}`;
  const [flags] = await on.query<Record<string, unknown>[]>(
    sql,
    asked.flatMap((t) => [t.ids, cursor]),
  );
  return new Set(asked.filter((_, i) => Number(flags?.[`f${i}`]) === 1));
}

/**
 * Candidate changes past the cursor, up to the page's top revision. Records of visits (and farms)
 * that a phone may already hold count at their own revision (at most limit + 1 per table: enough
 * for one page in rev order); a first statement asks which tables have any, so a pull reads only
 * those. Records of visits that appeared after the cursor count at the revision the visit appeared
 * at, all of them whatever their own revision, so the phone gets the visit whole, once.
 */
async function candidates(cursor: number, top: number, limit: number, visible: PlainRow[], on: TxConnection): Promise<Change[]> {
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
  const settled: SettledTable[] = [
    { kind: 'farm', model: Farm, key: 'id', ids: settledFarms },
    { kind: 'demandLine', model: DemandLine, key: 'farm_id', ids: settledFarms },
    ...VISIT_CHILDREN.map((entity) => ({ kind: entity, model: ENTITY_SPECS[entity].model, key: 'visit_id', ids: settledVisits })),
  ];
  const every = (model: Parameters<typeof selectRows>[1], key: string, ids: string[]) =>
    ids.length ? selectRows(on, model, { where: `${key} IN (?)`, replacements: [ids] }) : none;
  // Sent before the probe's answer is back: a newly visible visit comes whole whatever the probe says.
  const farmsAll = every(Farm, 'id', exposedFarms);
  const demandAll = every(DemandLine, 'farm_id', exposedFarms);
  const childrenAll = Promise.all(VISIT_CHILDREN.map((entity) => every(ENTITY_SPECS[entity].model, 'visit_id', exposedVisits)));
  const news = await tablesWithNews(cursor, settled, on);
  const newer = await Promise.all(
    settled.map((t) =>
      news.has(t) ? selectRows(on, t.model, { where: `${t.key} IN (?) AND rev > ? ORDER BY rev LIMIT ?`, replacements: [t.ids, cursor, limit + 1] }) : none,
    ),
  );
  const visitExposure = (row: SyncedRow) => exposedVisit.get(String(row.get('visitId'))) ?? 0;
  const farmExposed = (key: string) => (row: SyncedRow) => farmExposure.get(String(row.get(key))) ?? 0;
  return [
    ...asChanges(
      'visit',
      visible.filter((v) => v.rev > cursor),
    ),
    ...settled.flatMap((t, i) => asChanges(t.kind, newer[i] ?? [])),
    ...asChanges('farm', await farmsAll, farmExposed('id')),
    ...asChanges('demandLine', await demandAll, farmExposed('farmId')),
    ...(await childrenAll).flatMap((rows, i) => asChanges(VISIT_CHILDREN[i] as ChildEntity, rows, visitExposure)),
  ]
    .filter((change) => change.rev <= top)
    .sort(byRev);
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
  // No transaction: the page stops at the counter's committed value (below).
  const { visible, all, owners, settings } = await withConnection(getSequelize(), async (on) => {
    // The first statement reads the organisation's settings and the counter's committed value: the
    // page's top. Reads without a transaction each see a later moment, and a push may commit
    // between them, but every revision up to the top was committed before the first one ran
    // (revisions commit in order). So the page keeps only changes up to it: a cursor past the top
    // could skip a row committed between two of the reads. Later ones come with the next pull.
    const first = on.query<{ settings: unknown; top: number | string | null }[]>(
      'SELECT settings, (SELECT value FROM rev_counter WHERE id = 1) AS top FROM organisations WHERE id = ?',
      [user.organisationId],
    );
    const visible = await visibleVisits(user, on);
    const [head] = await first;
    if (!head) throw new Error(`organisation ${user.organisationId} not found`);
    // No counter row would make every page empty and hold every phone at its cursor: fail loudly.
    if (head.top === null || !Number.isSafeInteger(Number(head.top))) throw new Error(`rev_counter answered ${String(head.top)}`);
    const all = await candidates(cursor, Number(head.top), limit, visible, on);
    const ownerIds = [
      ...new Set(
        all
          .filter((c) => c.kind === 'farm')
          .map((c) => c.row.get('ownerId'))
          .filter((id): id is string => typeof id === 'string'),
      ),
    ];
    const people = ownerIds.length > 0 ? await on.query<{ id: string; name: string }[]>('SELECT id, name FROM users WHERE id IN (?)', [ownerIds]) : [];
    const settings = (typeof head.settings === 'string' ? JSON.parse(head.settings) : head.settings) as OrganisationSettings;
    return { visible, all, owners: new Map(people.map((u) => [u.id, u.name])), settings };
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
      unitsDefault: settings.unitsDefault,
      designFractionOfLowest: settings.designFractionOfLowest,
      ...(settings.minProbabilityForGo !== undefined ? { minProbabilityForGo: settings.minProbabilityForGo } : {}),
      demandFigures: knownDemandFigures(settings.demandFigures),
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
