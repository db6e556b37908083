import 'server-only';
import { Op, QueryTypes, Transaction, UniqueConstraintError } from 'sequelize';
import { SyncOp as SyncOpRow, Visit, getSequelize } from '@/lib/server/db';
import type { OpResult, SyncOp } from '@/lib/shared/schemas/sync';
import { recordAudit, recordAudits, type AuditInput } from '../audit';
import type { SessionUser } from '../auth/permissions';
import { screenVisit } from '../services/screening';
import { SyncAccess } from './access';
import { applyOp, type OpEffect } from './apply-op';

// Thrown inside an op's savepoint to undo it (a conflict or refusal changes nothing, not even sync_ops).
class Undo extends Error {
  constructor(readonly effect: OpEffect) { super('undo'); }
}
class Replayed extends Error {}

const VISIT_CHILDREN = new Set(['waterSource', 'flowMeasurement', 'fallReading', 'point', 'photo', 'pipeRun']);
const PENDING = JSON.stringify({ pending: true });
const MAX_ATTEMPTS = 3;

function replayOf(opId: string, stored: unknown): OpResult {
  return { ...(stored as OpResult), opId, status: 'replayed' };
}

/** The stored outcome of an op id; a locking read so a just-committed claim is seen. */
async function storedOutcome(op: SyncOp, user: SessionUser, transaction: Transaction): Promise<OpResult> {
  const row = await SyncOpRow.findByPk(op.opId, { transaction, lock: transaction.LOCK.SHARE });
  if (!row) throw new Error(`sync op ${op.opId} vanished`);
  if (row.userId !== user.id) return { opId: op.opId, status: 'rejected', rev: null, error: { code: 409, message: 'This op id was already used.' } };
  return replayOf(op.opId, row.outcome);
}

/** What a batch writes once at its end: the applied ops' audit lines and stored outcomes. */
interface BatchWrites { audits: AuditInput[]; outcomes: [string, string][] }

/**
 * One op in its own savepoint: claim the op id in sync_ops first (the primary key makes a
 * concurrent push of the same op wait, then see it as a replay), apply. An applied op's outcome
 * and audit line are written with the batch (the claimed row stays locked until the commit).
 */
async function runOp(op: SyncOp, access: SyncAccess, outer: Transaction, user: SessionUser, writes: BatchWrites): Promise<OpEffect> {
  const sequelize = getSequelize();
  try {
    return await sequelize.transaction({ transaction: outer }, async (transaction) => {
      try {
        await sequelize.query(
          'INSERT INTO sync_ops (op_id, user_id, entity, entity_id, outcome, created_at) VALUES (?, ?, ?, ?, ?, NOW())',
          { replacements: [op.opId, user.id, op.entity, op.entityId, PENDING], transaction },
        );
      } catch (error) {
        if (error instanceof UniqueConstraintError) throw new Replayed();
        throw error;
      }
      const audits: AuditInput[] = [];
      const effect = await applyOp(op, access, transaction, audits);
      if (effect.result.status !== 'applied') throw new Undo(effect);
      writes.audits.push(...audits);
      writes.outcomes.push([op.opId, JSON.stringify(effect.result)]);
      return effect;
    });
  } catch (error) {
    if (error instanceof Undo) return error.effect;
    if (error instanceof Replayed) {
      // The same op id earlier in this batch: its outcome is not written yet.
      const earlier = writes.outcomes.find(([id]) => id === op.opId);
      if (earlier) return { result: replayOf(op.opId, JSON.parse(earlier[1])), visitId: null, farmId: null };
      return { result: await storedOutcome(op, user, outer), visitId: null, farmId: null };
    }
    throw error;
  }
}

/** The batch's audit lines in one insert and its ops' outcomes in one statement. */
async function writeBatch(writes: BatchWrites, transaction: Transaction) {
  await recordAudits(writes.audits, transaction);
  if (writes.outcomes.length === 0) return;
  // Every row was claimed (inserted) by this transaction above: this only fills in the outcomes.
  await getSequelize().query(
    `INSERT INTO sync_ops (op_id, user_id, entity, entity_id, outcome, created_at) VALUES ${writes.outcomes.map(() => "(?, '', '', '', ?, NOW())").join(', ')}
     ON DUPLICATE KEY UPDATE outcome = VALUES(outcome)`,
    { replacements: writes.outcomes.flat(), transaction },
  );
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

/** Marks the visits synced now, and moves a booked visit to 'surveyed' once readings arrive. */
async function touchVisits(effects: OpEffect[], ops: SyncOp[], access: SyncAccess, transaction: Transaction) {
  const applied = effects.map((e, i) => ({ e, op: ops[i] })).filter(({ e }) => e.result.status === 'applied' && e.visitId);
  const visitIds = [...new Set(applied.map(({ e }) => e.visitId as string))];
  if (visitIds.length === 0) return;
  // Server bookkeeping the phone never pulls: a plain UPDATE, so the visit keeps its revision.
  await getSequelize().query('UPDATE visits SET last_synced_at = NOW() WHERE id IN (?)', { replacements: [visitIds], transaction, type: QueryTypes.UPDATE });
  const withReadings = new Set(applied.filter(({ op }) => op && VISIT_CHILDREN.has(op.entity) && op.action === 'put').map(({ e }) => e.visitId as string));
  for (const id of withReadings) {
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
 * Applies a push batch in order, in one transaction with a savepoint per op (read committed, so
 * each op sees what other pushes committed). Returns one result per op; screens touched visits after.
 */
export async function pushOps(user: SessionUser, ops: SyncOp[]): Promise<OpResult[]> {
  const sequelize = getSequelize();
  for (let attempt = 1; ; attempt++) {
    try {
      const { effects, screen } = await sequelize.transaction(
        { isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED },
        async (transaction) => {
          const access = new SyncAccess(user, transaction);
          // Ops recorded by an earlier push answer from one query; the rest claim their id one by one.
          const known = new Map((await SyncOpRow.findAll({ where: { opId: { [Op.in]: ops.map((op) => op.opId) } }, transaction }))
            .map((row) => [row.opId, row]));
          const effects: OpEffect[] = [];
          const writes: BatchWrites = { audits: [], outcomes: [] };
          for (const op of ops) {
            const stored = known.get(op.opId);
            effects.push(stored && stored.userId === user.id
              ? { result: replayOf(op.opId, stored.outcome), visitId: null, farmId: null }
              : await runOp(op, access, transaction, user, writes));
          }
          await writeBatch(writes, transaction);
          await touchVisits(effects, ops, access, transaction);
          return { effects, screen: await visitsToScreen(effects, transaction) };
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
