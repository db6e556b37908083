import 'server-only';
import { Op, QueryTypes, Transaction, UniqueConstraintError } from 'sequelize';
import { SyncOp as SyncOpRow, Visit, batchInsert, getSequelize, reserveRevs, writeSyncedRows } from '@/lib/server/db';
import type { OpResult, SyncEntity, SyncOp } from '@/lib/shared/schemas/sync';
import { recordAudit, recordAudits } from '../audit';
import type { SessionUser } from '../auth/permissions';
import { screenVisit } from '../services/screening';
import { SyncAccess } from './access';
import { applyCommissioningOp } from './apply-commissioning';
import { planOp, type OpEffect, type OpPlan, type RowState } from './apply-op';
import { ENTITY_SPECS, type EntitySpec, type SyncedRow } from './entities';

const VISIT_CHILDREN = new Set(['waterSource', 'flowMeasurement', 'fallReading', 'point', 'photo', 'pipeRun']);
const MAX_ATTEMPTS = 3;

function replayOf(opId: string, stored: unknown): OpResult {
  return { ...(stored as OpResult), opId, status: 'replayed' };
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
  const rows = await getSequelize().query<{ op_id: string; user_id: string; outcome: unknown }>(
    'SELECT op_id, user_id, outcome FROM sync_ops WHERE op_id IN (?)', { replacements: [ids], type: QueryTypes.SELECT, transaction },
  );
  const stored = new Map<string, OpResult>();
  for (const row of rows) {
    if (row.user_id !== user.id) stored.set(row.op_id, { opId: row.op_id, status: 'rejected', rev: null, error: { code: 409, message: 'This op id was already used.' } });
    else stored.set(row.op_id, replayOf(row.op_id, typeof row.outcome === 'string' ? JSON.parse(row.outcome) : row.outcome));
  }
  return { fresh: new Set(ids.filter((id) => !stored.has(id))), stored };
}

/** The batch's existing rows, one locking SELECT per entity table; keyed "entity:id". */
async function loadRows(ops: SyncOp[], transaction: Transaction): Promise<Map<string, RowState>> {
  const byEntity = new Map<SyncEntity, Set<string>>();
  // Commissioning checks are create-only records applied on their own (runCommissioning), not planned rows.
  for (const op of ops) if (op.entity !== 'commissioning') byEntity.set(op.entity, (byEntity.get(op.entity) ?? new Set()).add(op.entityId));
  const rows = new Map<string, RowState>();
  for (const [entity, ids] of byEntity) {
    const spec = ENTITY_SPECS[entity];
    const found = (await spec.model.findAll({ where: { id: [...ids].sort() }, transaction, lock: transaction.LOCK.UPDATE })) as SyncedRow[];
    for (const row of found) rows.set(`${entity}:${row.id}`, { spec, row, isNew: false, touched: new Set(), dirty: false });
  }
  return rows;
}

/**
 * Writes what the plans applied: a block of revisions (one per writing op, in op order, so each
 * result carries its own), visits saved through the model (their hooks), every other table in bulk,
 * then the applied ops' outcomes.
 */
async function writePlans(plans: OpPlan[], ops: SyncOp[], fresh: Set<string>, userId: string, transaction: Transaction) {
  const sequelize = getSequelize();
  const writing = plans.filter((p) => p.writes && p.state && p.state.spec !== ENTITY_SPECS.visit).length;
  const block = writing > 0 ? await reserveRevs(sequelize, transaction, writing) : null;
  const states = new Set<RowState>();
  for (const plan of plans) {
    const { conflict } = plan.result;
    if (plan.conflictOn && conflict) {
      // The revision the row had when this op met it (given out earlier in this loop).
      const rev = Number(plan.conflictOn.row.rev);
      plan.result = { ...plan.result, rev, conflict: { ...conflict, server: conflict.server ? { ...conflict.server, rev } : null } };
    }
    if (plan.result.status !== 'applied' || !plan.state) continue;
    const { state } = plan;
    if (plan.writes && state.spec === ENTITY_SPECS.visit) await state.row.save({ transaction });
    else if (plan.writes && block) {
      state.row.set('rev', block.take());
      states.add(state);
    }
    plan.result = { ...plan.result, rev: Number(state.row.rev) };
  }
  const bySpec = new Map<EntitySpec, RowState[]>();
  for (const state of states) bySpec.set(state.spec, [...(bySpec.get(state.spec) ?? []), state]);
  for (const [spec, list] of bySpec) {
    const fields = [...new Set(list.flatMap((s) => [...s.touched]))];
    await writeSyncedRows(spec.model, { created: list.filter((s) => s.isNew).map((s) => s.row), updated: list.filter((s) => !s.isNew).map((s) => s.row) }, fields, transaction);
  }

  // The first applied op of an id stores the outcome; ops that did not apply leave no row.
  const outcomes = new Map<string, [SyncOp, OpResult]>();
  plans.forEach((plan, i) => {
    const op = ops[i];
    if (op && fresh.has(op.opId) && plan.result.status === 'applied' && !outcomes.has(op.opId)) outcomes.set(op.opId, [op, plan.result]);
  });
  const createdAt = new Date();
  await batchInsert(SyncOpRow, [...outcomes.values()].map(([op, outcome]) => (
    { opId: op.opId, userId, entity: op.entity, entityId: op.entityId, outcome, createdAt })), transaction);
}

// Thrown inside a commissioning op's savepoint so a refusal changes nothing.
class Undo extends Error {
  constructor(readonly effect: OpEffect) { super('undo'); }
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
async function planBatch(ops: SyncOp[], access: SyncAccess, fresh: Set<string>, stored: Map<string, OpResult>, rows: Map<string, RowState>, transaction: Transaction) {
  const plans: OpPlan[] = [];
  const appliedAt = new Map<string, OpPlan>();
  for (const op of ops) {
    const earlier = appliedAt.get(op.opId);
    const known = stored.get(op.opId);
    if (earlier) plans.push({ ...noEffect({ opId: op.opId, status: 'replayed', rev: null }), state: earlier.state, writes: false, audit: null, replayOf: earlier });
    else if (known || !fresh.has(op.opId)) plans.push({ ...noEffect(known ?? { opId: op.opId, status: 'rejected', rev: null, error: { code: 409, message: 'This op id was already used.' } }), state: null, writes: false, audit: null });
    else {
      const plan = op.entity === 'commissioning' ? await runCommissioning(op, access, transaction) : await planOp(op, access, rows);
      if (plan.result.status === 'applied') appliedAt.set(op.opId, plan);
      plans.push(plan);
    }
  }
  return plans;
}

/** Visits whose screening may change: those touched directly, and walked visits on touched farms. */
async function visitsToScreen(effects: OpEffect[], transaction: Transaction): Promise<string[]> {
  const applied = effects.filter((e) => e.result.status === 'applied');
  const ids = new Set(applied.map((e) => e.visitId).filter((id): id is string => !!id));
  const farmIds = [...new Set(applied.map((e) => e.farmId).filter((id): id is string => !!id))];
  if (farmIds.length > 0) {
    const onFarms = await Visit.findAll({
      attributes: ['id'], where: { farmId: { [Op.in]: farmIds }, deletedAt: null, status: { [Op.in]: ['surveyed', 'screened'] } }, transaction,
    });
    for (const v of onFarms) ids.add(v.id);
  }
  return [...ids];
}

/**
 * Before the writes (no revision needed): marks the touched visits synced now, and returns those
 * still booked ('scheduled') that got readings, which move to 'surveyed' after the writes.
 */
async function touchVisits(effects: OpEffect[], ops: SyncOp[], transaction: Transaction): Promise<string[]> {
  const applied = effects.map((e, i) => ({ e, op: ops[i] })).filter(({ e }) => e.result.status === 'applied' && e.visitId);
  const visitIds = [...new Set(applied.map(({ e }) => e.visitId as string))];
  if (visitIds.length === 0) return [];
  // Server bookkeeping the phone never pulls: a plain UPDATE, so the visit keeps its revision.
  await getSequelize().query('UPDATE visits SET last_synced_at = NOW() WHERE id IN (?)', { replacements: [visitIds], transaction, type: QueryTypes.UPDATE });
  const withReadings = [...new Set(applied.filter(({ op }) => op && VISIT_CHILDREN.has(op.entity) && op.action === 'put').map(({ e }) => e.visitId as string))];
  if (withReadings.length === 0) return [];
  const booked = await Visit.findAll({ attributes: ['id'], where: { id: { [Op.in]: withReadings }, status: 'scheduled' }, transaction });
  return booked.map((v) => v.id);
}

/** After the writes: booked visits that got readings move to 'surveyed' (a saved change, so a revision). */
async function markSurveyed(visitIds: string[], access: SyncAccess, transaction: Transaction) {
  for (const id of visitIds) {
    const visit = await Visit.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (visit?.status !== 'scheduled') continue;
    await visit.update({ status: 'surveyed' }, { transaction });
    access.noteStatus(id, 'surveyed');
    await recordAudit({ organisationId: visit.organisationId, actorId: access.user.id, entity: 'visit', entityId: id, visitId: id,
      action: 'status', changes: { from: 'scheduled', to: 'surveyed', reason: 'readings synced' } }, transaction);
  }
}

// A duplicate key is a concurrent push that committed the same op (or created the same record) first:
// the retry sees its stored outcome (or its row) and answers as a replay (or a conflict).
// (The bulk writer goes through the connector itself, whose duplicate key is errno 1062.)
const isRetryable = (error: unknown) => error instanceof UniqueConstraintError || (error as { errno?: number })?.errno === 1062
  || /deadlock|lock wait timeout/i.test(String((error as Error)?.message ?? ''));

/**
 * Applies a push batch in order, set-based, in one transaction (read committed, so it sees what
 * other pushes committed): read the stored op ids, load the rows, plan every op in memory, then take the
 * revision counter's lock only for the writes (DEVELOPERS.md, "Server revisions"). Returns one
 * result per op; screens touched visits after the commit.
 */
export async function pushOps(user: SessionUser, ops: SyncOp[]): Promise<OpResult[]> {
  const sequelize = getSequelize();
  if (ops.length === 0) return [];
  for (let attempt = 1; ; attempt++) {
    try {
      const { effects, screen } = await sequelize.transaction(
        { isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED },
        async (transaction) => {
          const access = new SyncAccess(user, transaction);
          // Rows first, then the stored op ids: a push of the same ops that commits in between is then
          // seen in sync_ops (its rows and outcomes commit together), so it is never mistaken for a conflict.
          const rows = await loadRows(ops, transaction);
          const { fresh, stored } = await knownOps(ops, user, transaction);
          const plans = await planBatch(ops, access, fresh, stored, rows, transaction);
          // Everything that needs no revision first, so the counter's lock is held only for the writes.
          await recordAudits(plans.flatMap((p) => (p.result.status === 'applied' && p.audit ? [p.audit] : [])), transaction);
          const booked = await touchVisits(plans, ops, transaction);
          const screen = await visitsToScreen(plans, transaction);
          await writePlans(plans, ops, fresh, user.id, transaction);
          await markSurveyed(booked, access, transaction);
          for (const plan of plans) if (plan.replayOf) plan.result = replayOf(plan.result.opId, plan.replayOf.result);
          const effects: OpEffect[] = plans.map(({ result, visitId, farmId }) => ({ result, visitId, farmId }));
          return { effects, screen };
        },
      );
      for (const visitId of screen) {
        try {
          await sequelize.transaction((transaction) => screenVisit(visitId, user.id, transaction));
        } catch (error) {
          // The ops are committed; a failed screening is logged and retried on the next push.
          console.error('[fallbook] screening after sync failed', visitId, error);
        }
      }
      return effects.map((e) => e.result);
    } catch (error) {
      if (attempt >= MAX_ATTEMPTS || !isRetryable(error)) throw error;
    }
  }
}
