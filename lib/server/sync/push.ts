import 'server-only';
import { randomUUID } from 'node:crypto';
import { Op, QueryTypes, Transaction } from 'sequelize';
import { Visit, getSequelize, reserveRevs, writeSyncedRows } from '@/lib/server/db';
import type { OpResult, SyncEntity, SyncOp } from '@/lib/shared/schemas/sync';
import { recordAudit, recordAudits } from '../audit';
import type { SessionUser } from '../auth/permissions';
import { screenVisit } from '../services/screening';
import { SyncAccess } from './access';
import { planOp, type OpEffect, type OpPlan, type RowState } from './apply-op';
import { ENTITY_SPECS, type EntitySpec, type SyncedRow } from './entities';

const VISIT_CHILDREN = new Set(['waterSource', 'flowMeasurement', 'fallReading', 'point', 'photo', 'pipeRun']);
const MAX_ATTEMPTS = 3;

function replayOf(opId: string, stored: unknown): OpResult {
  return { ...(stored as OpResult), opId, status: 'replayed' };
}

const noEffect = (result: OpResult): OpEffect => ({ result, visitId: null, farmId: null });

/**
 * Claims the batch's op ids in sync_ops with one INSERT IGNORE (in key order, so two pushes of
 * overlapping batches lock alike): an id claimed by a concurrent push waits for its commit and is
 * then ignored. Returns the ids this transaction claimed, and the stored outcome of the others.
 */
async function claimOps(ops: SyncOp[], user: SessionUser, transaction: Transaction) {
  const token = JSON.stringify({ pending: randomUUID() });
  const first = new Map<string, SyncOp>();
  for (const op of ops) if (!first.has(op.opId)) first.set(op.opId, op);
  const ids = [...first.keys()].sort();
  const sequelize = getSequelize();
  await sequelize.query(
    `INSERT IGNORE INTO sync_ops (op_id, user_id, entity, entity_id, outcome, created_at) VALUES ${ids.map(() => '(?, ?, ?, ?, ?, NOW())').join(', ')}`,
    { replacements: ids.flatMap((id) => { const op = first.get(id) as SyncOp; return [id, user.id, op.entity, op.entityId, token]; }), transaction },
  );
  const rows = await sequelize.query<{ op_id: string; user_id: string; outcome: unknown }>(
    'SELECT op_id, user_id, outcome FROM sync_ops WHERE op_id IN (?)', { replacements: [ids], type: QueryTypes.SELECT, transaction },
  );
  const claimed = new Set<string>();
  const stored = new Map<string, OpResult>();
  for (const row of rows) {
    const outcome = typeof row.outcome === 'string' ? row.outcome : JSON.stringify(row.outcome);
    if (outcome === token) claimed.add(row.op_id);
    else if (row.user_id !== user.id) stored.set(row.op_id, { opId: row.op_id, status: 'rejected', rev: null, error: { code: 409, message: 'This op id was already used.' } });
    else stored.set(row.op_id, replayOf(row.op_id, typeof row.outcome === 'string' ? JSON.parse(row.outcome) : row.outcome));
  }
  return { claimed, stored };
}

/** The batch's existing rows, one locking SELECT per entity table; keyed "entity:id". */
async function loadRows(ops: SyncOp[], transaction: Transaction): Promise<Map<string, RowState>> {
  const byEntity = new Map<SyncEntity, Set<string>>();
  for (const op of ops) byEntity.set(op.entity, (byEntity.get(op.entity) ?? new Set()).add(op.entityId));
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
 * then the applied ops' outcomes, and the claims of ops that did not apply removed.
 */
async function writePlans(plans: OpPlan[], ops: SyncOp[], claimed: Set<string>, transaction: Transaction) {
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

  // The first applied op of an id stores the outcome; ids whose ops all failed give their claim back.
  const outcomes = new Map<string, string>();
  plans.forEach((plan, i) => {
    const id = ops[i]?.opId;
    if (id && claimed.has(id) && plan.result.status === 'applied' && !outcomes.has(id)) outcomes.set(id, JSON.stringify(plan.result));
  });
  if (outcomes.size > 0) {
    await sequelize.query(
      `INSERT INTO sync_ops (op_id, user_id, entity, entity_id, outcome, created_at) VALUES ${[...outcomes].map(() => "(?, '', '', '', ?, NOW())").join(', ')}
       ON DUPLICATE KEY UPDATE outcome = VALUES(outcome)`,
      { replacements: [...outcomes].flat(), transaction },
    );
  }
  const unused = [...claimed].filter((id) => !outcomes.has(id));
  if (unused.length > 0) await sequelize.query('DELETE FROM sync_ops WHERE op_id IN (?)', { replacements: [unused], transaction });
}

/** Plans every op in order against the batch's rows; a repeated op id replays its earlier applied outcome. */
async function planBatch(ops: SyncOp[], access: SyncAccess, claimed: Set<string>, stored: Map<string, OpResult>, rows: Map<string, RowState>) {
  const plans: OpPlan[] = [];
  const appliedAt = new Map<string, OpPlan>();
  for (const op of ops) {
    const earlier = appliedAt.get(op.opId);
    const known = stored.get(op.opId);
    if (earlier) plans.push({ ...noEffect({ opId: op.opId, status: 'replayed', rev: null }), state: earlier.state, writes: false, audit: null, replayOf: earlier });
    else if (known || !claimed.has(op.opId)) plans.push({ ...noEffect(known ?? { opId: op.opId, status: 'rejected', rev: null, error: { code: 409, message: 'This op id was already used.' } }), state: null, writes: false, audit: null });
    else {
      const plan = await planOp(op, access, rows);
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

const isRetryable = (error: unknown) => /deadlock|lock wait timeout/i.test(String((error as Error)?.message ?? ''));

/**
 * Applies a push batch in order, set-based, in one transaction (read committed, so it sees what
 * other pushes committed): claim the op ids, load the rows, plan every op in memory, then take the
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
          const { claimed, stored } = await claimOps(ops, user, transaction);
          const rows = await loadRows(ops.filter((op) => claimed.has(op.opId)), transaction);
          const plans = await planBatch(ops, access, claimed, stored, rows);
          // Everything that needs no revision first, so the counter's lock is held only for the writes.
          await recordAudits(plans.flatMap((p) => (p.result.status === 'applied' && p.audit ? [p.audit] : [])), transaction);
          const booked = await touchVisits(plans, ops, transaction);
          const screen = await visitsToScreen(plans, transaction);
          await writePlans(plans, ops, claimed, transaction);
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
