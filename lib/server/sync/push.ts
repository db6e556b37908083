import 'server-only';
import { Op, Transaction, UniqueConstraintError } from 'sequelize';
import {
  Computed,
  SyncOp as SyncOpRow,
  Visit,
  batchInsert,
  getSequelize,
  reservePendingRevs,
  selectRows,
  txConnection,
  writeSyncedRows,
  PENDING_TOP,
  type PendingRevBlock,
  type PlainRow,
} from '@/lib/server/db';
import type { OpResult, SyncEntity, SyncOp } from '@/lib/shared/schemas/sync';
import { recordAudit, recordAudits } from '../audit';
import { SCREENING_INPUTS } from '../data/site-readings';
import type { SessionUser } from '../auth/permissions';
import { screenSoon } from '../services/screening-queue';
import { SyncAccess } from './access';
import { applyCommissioningOp } from './apply-commissioning';
import { planOp, type OpEffect, type OpPlan, type RowState } from './apply-op';
import { ENTITY_SPECS, type EntitySpec, type SyncedRow } from './entities';

const VISIT_CHILDREN = new Set(['waterSource', 'flowMeasurement', 'fallReading', 'point', 'photo', 'pipeRun']);
const MAX_ATTEMPTS = 3;

function replayOf(opId: string, stored: unknown): OpResult {
  return { ...(stored as OpResult), opId, status: 'replayed' };
}

/** The visits a batch's ops name (as the record, or as a new record's parent): read once up front. */
function namedVisits(ops: SyncOp[]): string[] {
  const ids = new Set<string>();
  for (const op of ops) {
    if (op.entity === 'visit') ids.add(op.entityId);
    const visitId = (op.changes as { visitId?: unknown } | undefined)?.visitId;
    if (typeof visitId === 'string') ids.add(visitId);
  }
  return [...ids];
}

const noEffect = (result: OpResult): OpEffect => ({ result, visitId: null, farmId: null });

/**
 * The outcomes stored for the batch's op ids (one SELECT); the other ids are new. Nothing is
 * claimed up front: the applied ops' rows go in at the end with a plain INSERT, so a concurrent push
 * of the same op waits on the first one's uncommitted row, fails on its key once that commits, and
 * its retry answers from the stored outcome (see pushOps).
 */
async function knownOps(ops: SyncOp[], user: SessionUser, transaction: Transaction) {
  const ids = [...new Set(ops.map((op) => op.opId))];
  const rows = await txConnection(transaction).query<{ op_id: string; user_id: string; outcome: unknown }[]>(
    'SELECT op_id, user_id, outcome FROM sync_ops WHERE op_id IN (?)',
    [ids],
  );
  const stored = new Map<string, OpResult>();
  for (const row of rows) {
    if (row.user_id !== user.id)
      stored.set(row.op_id, { opId: row.op_id, status: 'rejected', rev: null, error: { code: 409, message: 'This op id was already used.' } });
    else stored.set(row.op_id, replayOf(row.op_id, typeof row.outcome === 'string' ? JSON.parse(row.outcome) : row.outcome));
  }
  return { fresh: new Set(ids.filter((id) => !stored.has(id))), stored };
}

/**
 * The batch's existing rows, one locking SELECT per entity table, all sent at once (in table order,
 * before any other statement started after this call); keyed "entity:id". Visits become model
 * instances (saved through their hooks), the other tables stay plain rows (bulk written).
 */
async function loadRows(ops: SyncOp[], transaction: Transaction): Promise<Map<string, RowState>> {
  const byEntity = new Map<SyncEntity, Set<string>>();
  // Commissioning checks are create-only records applied on their own (runCommissioning), not planned rows.
  for (const op of ops) if (op.entity !== 'commissioning') byEntity.set(op.entity, (byEntity.get(op.entity) ?? new Set()).add(op.entityId));
  const connection = txConnection(transaction);
  const tables = [...byEntity]
    .sort(([a], [b]) => (a < b ? -1 : 1))
    .map(([entity, ids]) => {
      const spec = ENTITY_SPECS[entity];
      const found = selectRows(connection, spec.model, { where: 'id IN (?)', replacements: [[...ids].sort()], lock: true });
      return { entity, spec, found };
    });
  const rows = new Map<string, RowState>();
  for (const { entity, spec, found } of tables) {
    for (const plain of await found) {
      const row: SyncedRow = entity === 'visit' ? (Visit.build(plain.values as never, { isNewRecord: false, raw: true }) as unknown as SyncedRow) : plain;
      rows.set(`${entity}:${row.id}`, { spec, row, isNew: false, touched: new Set(), dirty: false });
    }
  }
  return rows;
}

/**
 * Writes what the plans applied: a block of revisions (one per writing op, in op order, so each
 * result carries its own), visits saved through the model (their hooks), every other table in bulk,
 * then the applied ops' outcomes. The block's numbers are computed by the database (a pending
 * block): its statement, the rows and the outcomes go out together, so the counter's lock is held
 * while the database runs them, not across a round trip to this process (pushes queue on that lock).
 */
async function writePlans(plans: OpPlan[], ops: SyncOp[], fresh: Set<string>, userId: string, transaction: Transaction) {
  const writing = plans.filter((p) => p.writes && p.state && p.state.spec !== ENTITY_SPECS.visit).length;
  const block = writing > 0 ? reservePendingRevs(transaction, writing) : null;
  // A revision as the loop knows it: a number, or a cell of the pending block (numbered at the end).
  type Rev = number | Computed;
  const revOf = (rev: unknown): Rev => (rev instanceof Computed ? rev : Number(rev));
  const resultRevs = new Map<OpPlan, Rev>();
  const states = new Set<RowState>();
  for (const plan of plans) {
    const { conflict } = plan.result;
    // The revision the row had when this op met it (given out earlier in this loop).
    if (plan.conflictOn && conflict) resultRevs.set(plan, revOf(plan.conflictOn.row.get('rev')));
    if (plan.result.status !== 'applied' || !plan.state) continue;
    const { state } = plan;
    if (plan.writes && state.spec === ENTITY_SPECS.visit) await (state.row as unknown as Visit).save({ transaction });
    else if (plan.writes && block) {
      state.row.set('rev', block.take());
      states.add(state);
    }
    resultRevs.set(plan, revOf(state.row.get('rev')));
  }
  const bySpec = new Map<EntitySpec, RowState[]>();
  for (const state of states) bySpec.set(state.spec, [...(bySpec.get(state.spec) ?? []), state]);
  const writes = [...bySpec].map(([spec, list]) => {
    const fields = [...new Set(list.flatMap((s) => [...s.touched]))];
    const rowsOf = (isNew: boolean) => list.filter((s) => s.isNew === isNew).map((s) => s.row as unknown as PlainRow);
    return writeSyncedRows(spec.model, { created: rowsOf(true), updated: rowsOf(false) }, fields, transaction);
  });

  // The first applied op of an id stores the outcome; ops that did not apply leave no row. Its
  // revision goes into the stored JSON as the database computes it.
  const outcomes = new Map<string, { op: SyncOp; plan: OpPlan }>();
  plans.forEach((plan, i) => {
    const op = ops[i];
    if (op && fresh.has(op.opId) && plan.result.status === 'applied' && !outcomes.has(op.opId)) outcomes.set(op.opId, { op, plan });
  });
  const storedOutcome = (plan: OpPlan) => {
    const rev = resultRevs.get(plan) ?? plan.result.rev;
    const offset = rev instanceof Computed ? (block as PendingRevBlock).offsetOf(rev) : null;
    return new Computed(STORED_OUTCOME, [JSON.stringify({ ...plan.result, rev: null }), offset, rev instanceof Computed ? null : rev]);
  };
  const createdAt = new Date();
  // Sent together on the transaction's connection: the database works through them back to back.
  await Promise.all([
    ...writes,
    batchInsert(
      SyncOpRow,
      [...outcomes.values()].map(({ op, plan }) => ({
        opId: op.opId,
        userId,
        entity: op.entity,
        entityId: op.entityId,
        outcome: storedOutcome(plan),
        createdAt,
      })),
      transaction,
    ),
    block?.top,
  ]);
  // Every revision is known now: rows and results take their numbers.
  const numbered = (rev: Rev) => (rev instanceof Computed ? (block as PendingRevBlock).revOf(rev) : rev);
  for (const state of states) state.row.set('rev', numbered(revOf(state.row.get('rev'))));
  for (const [plan, rev] of resultRevs) {
    const n = numbered(rev);
    const { conflict } = plan.result;
    plan.result =
      plan.conflictOn && conflict
        ? { ...plan.result, rev: n, conflict: { ...conflict, server: conflict.server ? { ...conflict.server, rev: n } : null } }
        : { ...plan.result, rev: n };
  }
}

// The stored outcome (JSON) with its revision: the pending block's, computed (see writePlans), or a known one.
const STORED_OUTCOME = `JSON_SET(?, '$.rev', CAST(IFNULL(${PENDING_TOP} - ?, ?) AS SIGNED))`;

// Thrown inside a commissioning op's savepoint so a refusal changes nothing.
class Undo extends Error {
  constructor(readonly effect: OpEffect) {
    super('undo');
  }
}

/**
 * A commissioning check writes through commissionVisit (its record, the visit's status, an audit
 * line) rather than the batch writer, in its own savepoint taken before the revision block is
 * reserved, so rolling a refusal back never rolls back revisions handed out to other ops.
 */
async function runCommissioning(op: Extract<SyncOp, { entity: 'commissioning' }>, access: SyncAccess, outer: Transaction): Promise<OpPlan> {
  let effect: OpEffect;
  try {
    effect = await getSequelize().transaction({ transaction: outer }, async (transaction) => {
      const applied = await applyCommissioningOp(op, access, transaction);
      if (applied.result.status !== 'applied') throw new Undo(applied);
      return applied;
    });
  } catch (error) {
    if (!(error instanceof Undo)) throw error;
    effect = error.effect;
  }
  return { ...effect, state: null, writes: false, audit: null };
}

/** Plans every op in order against the batch's rows; a repeated op id replays its earlier applied outcome. */
async function planBatch(
  ops: SyncOp[],
  access: SyncAccess,
  fresh: Set<string>,
  stored: Map<string, OpResult>,
  rows: Map<string, RowState>,
  transaction: Transaction,
) {
  const plans: OpPlan[] = [];
  const appliedAt = new Map<string, OpPlan>();
  for (const op of ops) {
    const earlier = appliedAt.get(op.opId);
    const known = stored.get(op.opId);
    if (earlier)
      plans.push({ ...noEffect({ opId: op.opId, status: 'replayed', rev: null }), state: earlier.state, writes: false, audit: null, replayOf: earlier });
    else if (known || !fresh.has(op.opId))
      plans.push({
        ...noEffect(known ?? { opId: op.opId, status: 'rejected', rev: null, error: { code: 409, message: 'This op id was already used.' } }),
        state: null,
        writes: false,
        audit: null,
      });
    else {
      const plan = op.entity === 'commissioning' ? await runCommissioning(op, access, transaction) : await planOp(op, access, rows);
      if (plan.result.status === 'applied') appliedAt.set(op.opId, plan);
      plans.push(plan);
    }
  }
  return plans;
}

/**
 * Visits whose screening may change: those whose readings the engine reads were touched, and walked
 * visits on farms whose water needs were touched. A batch of points or photos screens nothing.
 */
async function visitsToScreen(effects: OpEffect[], ops: SyncOp[], transaction: Transaction): Promise<string[]> {
  const applied = effects.filter((e, i) => e.result.status === 'applied' && SCREENING_INPUTS.has(ops[i]?.entity as SyncEntity));
  const ids = new Set(applied.map((e) => e.visitId).filter((id): id is string => !!id));
  const farmIds = [...new Set(applied.map((e) => e.farmId).filter((id): id is string => !!id))];
  if (farmIds.length > 0) {
    const onFarms = await Visit.findAll({
      attributes: ['id'],
      where: { farmId: { [Op.in]: farmIds }, deletedAt: null, status: { [Op.in]: ['surveyed', 'screened'] } },
      transaction,
    });
    for (const v of onFarms) ids.add(v.id);
  }
  return [...ids];
}

/**
 * Before the writes (no revision needed): marks the touched visits synced now, and returns those
 * still booked ('scheduled', as read at the start of the batch) that got readings, which move to
 * 'surveyed' after the writes (markSurveyed checks the status again under the row's lock).
 */
function touchVisits(effects: OpEffect[], ops: SyncOp[], access: SyncAccess, transaction: Transaction): { touched: Promise<unknown>; booked: string[] } {
  const applied = effects.map((e, i) => ({ e, op: ops[i] })).filter(({ e }) => e.result.status === 'applied' && e.visitId);
  const visitIds = [...new Set(applied.map(({ e }) => e.visitId as string))];
  if (visitIds.length === 0) return { touched: Promise.resolve(), booked: [] };
  // Server bookkeeping the phone never pulls: a plain UPDATE, so the visit keeps its revision.
  const touched = txConnection(transaction).query('UPDATE visits SET last_synced_at = NOW() WHERE id IN (?)', [visitIds]);
  const withReadings = new Set(applied.filter(({ op }) => op && VISIT_CHILDREN.has(op.entity) && op.action === 'put').map(({ e }) => e.visitId as string));
  return { touched, booked: [...withReadings].filter((id) => access.knownStatus(id) === 'scheduled') };
}

/** After the writes: booked visits that got readings move to 'surveyed' (a saved change, so a revision). */
async function markSurveyed(visitIds: string[], access: SyncAccess, transaction: Transaction) {
  for (const id of visitIds) {
    const visit = await Visit.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (visit?.status !== 'scheduled') continue;
    await visit.update({ status: 'surveyed' }, { transaction });
    access.noteStatus(id, 'surveyed');
    await recordAudit(
      {
        organisationId: visit.organisationId,
        actorId: access.user.id,
        entity: 'visit',
        entityId: id,
        visitId: id,
        action: 'status',
        changes: { from: 'scheduled', to: 'surveyed', reason: 'readings synced' },
      },
      transaction,
    );
  }
}

// A duplicate key is a concurrent push that committed the same op (or created the same record) first:
// the retry sees its stored outcome (or its row) and answers as a replay (or a conflict).
// (The bulk writer goes through the connector itself, whose duplicate key is errno 1062.)
const isRetryable = (error: unknown) =>
  error instanceof UniqueConstraintError ||
  (error as { errno?: number })?.errno === 1062 ||
  /deadlock|lock wait timeout/i.test(String((error as Error)?.message ?? ''));

/**
 * Applies a push batch in order, set-based, in one transaction (read committed, so it sees what
 * other pushes committed): read the stored op ids, load the rows, plan every op in memory, then take the
 * revision counter's lock only for the writes (DEVELOPERS.md, "Server revisions"). Returns one
 * result per op; queues the touched visits for screening after the answer.
 */
export async function pushOps(user: SessionUser, ops: SyncOp[]): Promise<OpResult[]> {
  const sequelize = getSequelize();
  if (ops.length === 0) return [];
  for (let attempt = 1; ; attempt++) {
    try {
      // Read committed: every connection's default (lib/server/db/connection.ts), so no statement here.
      const { effects, screen } = await sequelize.transaction(async (transaction) => {
        const access = new SyncAccess(user, transaction);
        // Sent at once, in this order: rows first, then the stored op ids, so a push of the same ops
        // that commits in between is seen in sync_ops (its rows and outcomes commit together) and is
        // never mistaken for a conflict; then the visits the ops name, for the access checks.
        const [rows, { fresh, stored }] = await Promise.all([
          loadRows(ops, transaction),
          knownOps(ops, user, transaction),
          access.preloadVisits(namedVisits(ops)),
        ]);
        const plans = await planBatch(ops, access, fresh, stored, rows, transaction);
        // Everything that needs no revision goes out first, so the database has done it before it
        // takes the counter's lock for the writes (statements run in the order sent); awaited with them.
        const { touched, booked } = touchVisits(plans, ops, access, transaction);
        const unlocked = Promise.all([
          touched,
          recordAudits(
            plans.flatMap((p) => (p.result.status === 'applied' && p.audit ? [p.audit] : [])),
            transaction,
          ),
        ]);
        unlocked.catch(() => undefined); // its failure is thrown below, not reported as unhandled
        const screen = await visitsToScreen(plans, ops, transaction);
        await writePlans(plans, ops, fresh, user.id, transaction);
        await unlocked;
        await markSurveyed(booked, access, transaction);
        for (const plan of plans) if (plan.replayOf) plan.result = replayOf(plan.result.opId, plan.replayOf.result);
        const effects: OpEffect[] = plans.map(({ result, visitId, farmId }) => ({ result, visitId, farmId }));
        return { effects, screen };
      });
      screenSoon(screen, user.id);
      return effects.map((e) => e.result);
    } catch (error) {
      if (attempt >= MAX_ATTEMPTS || !isRetryable(error)) throw error;
    }
  }
}
