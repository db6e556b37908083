import 'server-only';
import type { Transaction } from 'sequelize';
import { VISIT_STATUSES } from '@/lib/shared/domain';
import { entityFields, type OpResult, type SyncOp } from '@/lib/shared/schemas/sync';
import { recordAudit, type AuditInput } from '../audit';
import { AppError, zodFieldErrors } from '../errors';
import type { SyncAccess } from './access';
import { applyCommissioningOp } from './apply-commissioning';
import { ENTITY_SPECS, pulledRecord, sameValue, type EntitySpec, type SyncedRow } from './entities';

type Json = Record<string, unknown>;

/** What one op did: its result, and the visit(s) whose readings it touched. */
export interface OpEffect {
  result: OpResult;
  visitId: string | null;
  farmId: string | null;
}

const rejected = (op: SyncOp, code: number, message: string, fieldErrors?: Record<string, string[]>): OpResult =>
  ({ opId: op.opId, status: 'rejected', rev: null, error: { code, message, ...(fieldErrors ? { fieldErrors } : {}) } });

const conflicted = (op: SyncOp, spec: EntitySpec, row: SyncedRow, fields: string[]): OpResult =>
  ({ opId: op.opId, status: 'conflict', rev: Number(row.rev), conflict: { fields, server: pulledRecord(spec, row) } });

const statusRank = (status: unknown) => VISIT_STATUSES.indexOf(status as (typeof VISIT_STATUSES)[number]);

/** Fields changed on the server since the phone's copy, that the op would overwrite differently. */
function conflictingFields(server: Json, changes: Json, base: Json | undefined, skip: string[]): string[] {
  return Object.keys(changes).filter((field) => !skip.includes(field)
    && !sameValue(server[field], changes[field])
    && (!base || !(field in base) || !sameValue(server[field], base[field])));
}

/** The parent (visit or farm) the op belongs to, checked against the caller's access. */
async function checkParent(op: SyncOp, spec: EntitySpec, row: SyncedRow | null, access: SyncAccess) {
  if (op.entity === 'visit') {
    await access.assertCanCapture(op.entityId);
    return { visitId: op.entityId, farmId: null };
  }
  const key = spec.parentKey as 'visitId' | 'farmId';
  const stored = row ? String(row.get(key)) : null;
  const sent = (op.changes as Json | undefined)?.[key];
  if (stored && sent !== undefined && sent !== stored) {
    throw new AppError(422, 'invalid', 'A record cannot move to another visit or farm.', { [`changes.${key}`]: ['Cannot change.'] });
  }
  const parentId = stored ?? (typeof sent === 'string' ? sent : null);
  if (!parentId) throw new AppError(422, 'invalid', `A new ${op.entity} needs its ${key}.`, { [`changes.${key}`]: ['Required.'] });
  if (key === 'farmId') {
    await access.assertCanEditDemand(parentId);
    return { visitId: null, farmId: parentId };
  }
  await access.assertCanCapture(parentId);
  return { visitId: parentId, farmId: null };
}

/**
 * Applies one parsed op inside the caller's (savepoint) transaction: access, create / update /
 * soft delete with the per-field conflict check, audit line. Changes nothing unless it returns
 * 'applied'. Never throws for the op's own faults: they come back as 'rejected'. With `audits`,
 * the audit line is collected there for the caller to write with the batch (only applied ops add one).
 */
export async function applyOp(op: SyncOp, access: SyncAccess, transaction: Transaction, audits?: AuditInput[]): Promise<OpEffect> {
  if (op.entity === 'commissioning') return applyCommissioningOp(op, access, transaction);
  const spec = ENTITY_SPECS[op.entity];
  const row = (await spec.model.findByPk(op.entityId, { transaction, lock: transaction.LOCK.UPDATE })) as SyncedRow | null;
  let parent: { visitId: string | null; farmId: string | null };
  try {
    parent = await checkParent(op, spec, row, access);
  } catch (error) {
    if (error instanceof AppError) return { result: rejected(op, error.status, error.message, error.fieldErrors), visitId: null, farmId: null };
    throw error;
  }
  const effect = (result: OpResult): OpEffect => ({ result, ...parent });
  const audit = async (action: string, changes: Json | null) => {
    const entry: AuditInput = { organisationId: access.user.organisationId, actorId: access.user.id, entity: op.entity,
      entityId: op.entityId, visitId: parent.visitId, action, changes };
    if (audits) audits.push(entry);
    else await recordAudit(entry, transaction);
  };

  if (!row) {
    if (op.action === 'delete' || op.baseRev !== null || op.entity === 'visit') {
      return effect(rejected(op, 404, `No such ${op.entity} on the server.`));
    }
    const parsed = entityFields[op.entity].safeParse(op.changes ?? {});
    if (!parsed.success) {
      const fieldErrors = Object.fromEntries(Object.entries(zodFieldErrors(parsed.error)).map(([k, v]) => [`changes.${k}`, v]));
      return effect(rejected(op, 422, `A new ${op.entity} must carry every field.`, fieldErrors));
    }
    const created = (await spec.model.create(
      { id: op.entityId, ...spec.toRow(parsed.data as Json), createdById: access.user.id },
      { transaction },
    )) as SyncedRow;
    await audit('created', parsed.data as Json);
    return effect({ opId: op.opId, status: 'applied', rev: Number(created.rev) });
  }

  if (op.baseRev === null) return effect(conflicted(op, spec, row, []));
  const stale = Number(row.rev) > op.baseRev;
  const server = spec.toFields(row);

  if (op.action === 'delete') {
    if (row.deletedAt) return effect({ opId: op.opId, status: 'applied', rev: Number(row.rev) });
    if (stale) {
      const base = (op.base ?? {}) as Json;
      const changed = op.base ? Object.keys(base).filter((f) => !sameValue(server[f], base[f])) : [...spec.fields];
      if (changed.length > 0 || !op.base) return effect(conflicted(op, spec, row, changed));
    }
    row.set('deletedAt', new Date());
    await row.save({ transaction });
    await audit('deleted', null);
    return effect({ opId: op.opId, status: 'applied', rev: Number(row.rev) });
  }

  if (row.deletedAt) return effect(conflicted(op, spec, row, ['deletedAt']));
  const changes = (op.changes ?? {}) as Json;
  // A visit's status only moves forward (the office may have moved it on): never a conflict.
  const skip = op.entity === 'visit' ? ['status'] : [];
  if (stale) {
    const fields = conflictingFields(server, changes, op.base as Json | undefined, skip);
    if (fields.length > 0) return effect(conflicted(op, spec, row, fields));
  }
  const merged = { ...server, ...changes };
  if (op.entity === 'visit' && statusRank(server.status) > statusRank(changes.status)) merged.status = server.status;
  if (op.entity === 'photo' && row.get('uploadedAt') && (['sha256', 'bytes'] as const).some((f) => !sameValue(server[f], merged[f]))) {
    return effect(rejected(op, 422, 'This photo is already uploaded; its bytes cannot change. Add it as a new photo.',
      { 'changes.sha256': ['Cannot change after upload.'] }));
  }
  row.set(spec.toRow(merged));
  if (row.changed()) {
    await row.save({ transaction });
    await audit('updated', changes);
  }
  return effect({ opId: op.opId, status: 'applied', rev: Number(row.rev) });
}
