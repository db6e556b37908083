import { FIELD_VISIT_STATUSES } from '@/lib/shared/domain';
import { type Model, type ModelStatic, type Sequelize, type Transaction } from 'sequelize';
import { AuditEntry } from './audit-entry';
import { batchInsert, Computed, observeStatements, quote, txConnection, withConnection } from './batch-insert';
import { buildRow, PlainRow, selectRows } from './plain-rows';
import { Commissioning } from './commissioning';
import { DemandLine } from './demand-line';
import { FallReading } from './fall-reading';
import { Farm } from './farm';
import { FarmNeed } from './farm-need';
import { FlowMeasurement } from './flow-measurement';
import { Invitation } from './invitation';
import { Organisation } from './organisation';
import { Photo } from './photo';
import { PipeRun } from './pipe-run';
import { Point } from './point';
import { Screening } from './screening';
import { SheetResponse } from './sheet-response';
import { SheetSend } from './sheet-send';
import { EndedSession } from './ended-session';
import { SignInAttempt } from './sign-in-attempt';
import { SyncOp } from './sync-op';
import { User } from './user';
import { Visit } from './visit';
import { WaterSource } from './water-source';

export {
  AuditEntry,
  DemandLine,
  FallReading,
  Farm,
  FlowMeasurement,
  Invitation,
  Organisation,
  Photo,
  PipeRun,
  Point,
  Screening,
  SignInAttempt,
  SyncOp,
  User,
  Visit,
  WaterSource,
};
export { Commissioning, EndedSession, FarmNeed, SheetResponse, SheetSend };
export { batchInsert, buildRow, Computed, observeStatements, PlainRow, quote, selectRows, txConnection, withConnection };
export type { TxConnection } from './batch-insert';
export type { OrganisationSettings } from './organisation';

/** Models whose rows sync with the phone: each save takes a fresh revision. */
export const syncedModels = [Farm, Visit, WaterSource, FlowMeasurement, FallReading, Point, Photo, DemandLine, PipeRun];

/**
 * Next server revision (the pull cursor). Takes the counter row's lock until the caller's
 * transaction commits, so revisions become visible in order; hence a transaction is required.
 */
export async function nextRev(transaction?: Transaction | null): Promise<number> {
  return (await reserveRevs(transaction, 1)).first;
}

/** A block of revisions reserved by one transaction: first … last, handed out in order by `take`. */
export interface RevBlock {
  first: number;
  last: number;
  /** The next unused revision of the block; throws when the block is used up. */
  take(): number;
}

/**
 * Reserves `count` consecutive revisions with one statement under the counter row's lock (held
 * to the commit, like nextRev). Bulk writers of synced rows (writeSyncedRows) may only store
 * revisions reserved this way by their own transaction.
 */
export async function reserveRevs(transaction: Transaction | null | undefined, count: number): Promise<RevBlock> {
  if (!transaction) throw new Error('Synced records must be saved inside a transaction (see DEVELOPERS.md).');
  if (!Number.isInteger(count) || count < 1) throw new Error(`reserveRevs needs a positive count, not ${count}`);
  // One statement whose own answer carries its block: calls in parallel on one transaction need
  // no ordering of their own (the connection runs them in the order sent).
  const last = await takeRevs(transaction, count);
  const first = last - count + 1;
  let cursor = first;
  return {
    first,
    last,
    take() {
      if (cursor > last) throw new Error('revision block used up');
      return cursor++;
    },
  };
}

const reserved = new WeakMap<Transaction, [number, number][]>();

/** The session variable the counter's statement leaves the block's last revision in (reservePendingRevs). */
export const PENDING_TOP = '@fallbook_rev_top';

// The statement's own answer carries the value LAST_INSERT_ID(expr) set (the OK packet's insert
// id, as mysql_insert_id() reports it): one round trip under the lock instead of two. It also
// leaves that value in PENDING_TOP for statements sent after it on the connection. The block is
// recorded for writeSyncedRows's check.
async function takeRevs(transaction: Transaction, count: number): Promise<number> {
  const ok = await txConnection(transaction).query<{ insertId?: number | bigint }>(
    `UPDATE rev_counter SET value = LAST_INSERT_ID(${PENDING_TOP} := value + ?) WHERE id = 1`,
    [count],
  );
  const last = Number(ok.insertId);
  if (!Number.isSafeInteger(last) || last < count) throw new Error(`rev_counter answered ${String(ok.insertId)}`);
  const blocks = reserved.get(transaction) ?? [];
  blocks.push([last - count + 1, last]);
  reserved.set(transaction, blocks);
  return last;
}

/**
 * A block of revisions whose numbers the database fills in: its statement goes out at once and is
 * not awaited, and the rows written after it on the same connection compute their revision from it
 * (`take()` gives a computed cell: PENDING_TOP minus the cell's offset). The transaction then holds
 * the counter's lock only while the database runs the statements sent together, not across round
 * trips to the app. `revOf` gives a taken cell's number once `top` has settled.
 */
export interface PendingRevBlock {
  count: number;
  top: Promise<number>;
  take(): Computed;
  /** How far below the block's last revision a taken cell's is. */
  offsetOf(cell: Computed): number;
  revOf(cell: Computed): number;
}

const pendingCells = new WeakMap<Transaction, WeakSet<Computed>>();

/** Reserves `count` revisions like reserveRevs, without waiting for their numbers (PendingRevBlock). */
export function reservePendingRevs(transaction: Transaction, count: number): PendingRevBlock {
  if (!Number.isInteger(count) || count < 1) throw new Error(`reservePendingRevs needs a positive count, not ${count}`);
  const top = takeRevs(transaction, count);
  let settled: number | null = null;
  // Also marks a failure as handled: the caller awaits `top` with its writes.
  void top.then(
    (last) => (settled = last),
    () => undefined,
  );
  const cells = pendingCells.get(transaction) ?? new WeakSet<Computed>();
  pendingCells.set(transaction, cells);
  let taken = 0;
  const offsetOf = (cell: Computed) => {
    if (!cells.has(cell)) throw new Error('not a revision of this transaction');
    return cell.values[0] as number;
  };
  return {
    count,
    top,
    take() {
      if (taken >= count) throw new Error('revision block used up');
      taken++;
      const cell = new Computed(`${PENDING_TOP} - ?`, [count - taken]);
      cells.add(cell);
      return cell;
    },
    offsetOf,
    revOf(cell) {
      if (settled === null) throw new Error('the block has no numbers yet');
      return settled - offsetOf(cell);
    },
  };
}

/** A model instance or a plain row: what the bulk writer reads values from. */
type RowValues = { get(key: string): unknown; get(options: { plain: true }): unknown };

/**
 * The bulk path for synced rows (the push): new rows in one multi-row INSERT (a duplicate id
 * fails it), existing rows in one INSERT … ON DUPLICATE KEY UPDATE of `fields`. Hooks are skipped,
 * so it checks what the revision hook guarantees: a transaction, and every row's `rev` taken from a
 * block this transaction reserved (so the counter lock is held until the commit).
 */
export async function writeSyncedRows(
  model: ModelStatic<Model>,
  rows: { created: RowValues[]; updated: RowValues[] },
  fields: string[],
  transaction: Transaction,
): Promise<void> {
  if (!syncedModels.includes(model as never)) throw new Error(`${model.name} is not a synced model`);
  const blocks = reserved.get(transaction) ?? [];
  const cells = pendingCells.get(transaction);
  for (const row of [...rows.created, ...rows.updated]) {
    const given = row.get('rev');
    // A revision the database computes from a block this transaction reserved (reservePendingRevs).
    if (given instanceof Computed && cells?.has(given)) continue;
    const rev = Number(given);
    if (!blocks.some(([first, last]) => rev >= first && rev <= last)) {
      throw new Error(`${model.name} ${String(row.get('id'))}: rev ${rev} was not reserved by this transaction`);
    }
  }
  const now = new Date();
  const values = (list: RowValues[], created: boolean) =>
    list.map((row) => {
      const plain = row.get({ plain: true }) as Record<string, unknown>;
      return { ...plain, ...(created ? { createdAt: now } : {}), updatedAt: now };
    });
  // A duplicate id among the new rows fails the insert (the batch retries into a conflict).
  await Promise.all([
    batchInsert(model, values(rows.created, true), transaction),
    batchInsert(model, values(rows.updated, false), transaction, [...new Set([...fields, 'rev', 'deletedAt', 'updatedAt'])]),
  ]);
}

function addRevisionHooks(sequelize: Sequelize, model: ModelStatic<Model>) {
  model.addHook('beforeSave', async (instance: Model, options: { transaction?: Transaction | null }) => {
    instance.set('rev', await nextRev(options.transaction));
  });
  model.addHook('beforeBulkCreate', async (instances: Model[], options: { transaction?: Transaction | null }) => {
    for (const instance of instances) instance.set('rev', await nextRev(options.transaction));
  });
  model.addHook('beforeBulkUpdate', () => {
    throw new Error(`Update ${model.name} rows one by one (instance.update) so each takes a revision.`);
  });
}

let initialised: Sequelize | undefined;

/** Initialises every model on one Sequelize instance and wires the associations (once). */
export function initModels(sequelize: Sequelize) {
  if (initialised === sequelize) return;
  initialised = sequelize;
  for (const model of [
    Organisation,
    User,
    Farm,
    Visit,
    WaterSource,
    FlowMeasurement,
    FallReading,
    Point,
    Photo,
    DemandLine,
    PipeRun,
    Screening,
    AuditEntry,
    SyncOp,
    SignInAttempt,
    Invitation,
    SheetSend,
    SheetResponse,
    FarmNeed,
    Commissioning,
    EndedSession,
  ])
    model.initModel(sequelize);

  Organisation.hasMany(User, { foreignKey: 'organisationId' });
  User.belongsTo(Organisation, { foreignKey: 'organisationId' });
  Farm.belongsTo(Organisation, { foreignKey: 'organisationId' });
  Farm.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
  Farm.hasMany(Visit, { foreignKey: 'farmId' });
  Farm.hasMany(DemandLine, { foreignKey: 'farmId' });
  Visit.belongsTo(Farm, { foreignKey: 'farmId' });
  Visit.belongsTo(User, { as: 'advisor', foreignKey: 'advisorId' });
  Commissioning.belongsTo(Visit, { foreignKey: 'visitId' });
  const visitChildren = [WaterSource, FlowMeasurement, FallReading, Point, Photo, PipeRun, Screening] as ModelStatic<Model>[];
  for (const child of visitChildren) {
    Visit.hasMany(child, { foreignKey: 'visitId' });
    child.belongsTo(Visit, { foreignKey: 'visitId' });
  }
  for (const model of syncedModels) addRevisionHooks(sequelize, model as ModelStatic<Model>);
  addExposureHook();
}

// After the revision hook: a visit that a phone may newly hold records the revision it appeared at,
// so a pull sends it whole (created, assigned to someone else, restored, or booked into the field).
function addExposureHook() {
  Visit.addHook('beforeSave', (visit: Visit) => {
    const previous = visit.previous('status');
    const intoField = visit.changed('status') && FIELD_VISIT_STATUSES.includes(visit.status) && !(previous && FIELD_VISIT_STATUSES.includes(previous));
    if (visit.isNewRecord || visit.changed('advisorId') || visit.changed('deletedAt') || intoField) visit.exposedRev = visit.rev;
  });
}
