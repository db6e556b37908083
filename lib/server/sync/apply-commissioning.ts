import 'server-only';
import type { Transaction } from 'sequelize';
import { Commissioning } from '@/lib/server/db';
import { commissioningInputSchema } from '@/lib/shared/schemas/commissioning';
import { entityFields, type OpResult, type SyncOp } from '@/lib/shared/schemas/sync';
import { commissionVisit } from '../data/commissioning';
import { AppError, zodFieldErrors } from '../errors';
import type { SyncAccess } from './access';
import type { OpEffect } from './apply-op';

type CommissioningOp = Extract<SyncOp, { entity: 'commissioning' }>;

const rejected = (op: SyncOp, code: number, message: string, fieldErrors?: Record<string, string[]>): OpResult => ({
  opId: op.opId,
  status: 'rejected',
  rev: null,
  error: { code, message, ...(fieldErrors ? { fieldErrors } : {}) },
});

const prefixed = (errors: Record<string, string[]>) => Object.fromEntries(Object.entries(errors).map(([k, v]) => [`changes.${k}`, v]));

/**
 * A commissioning recorded on the phone: create-only. Checked with the same schema as the online
 * route, then commissionVisit runs the engine's check against the latest screening, stores it under
 * the phone's record id, moves the visit to 'commissioned' and writes the audit line. A record id
 * that is already stored (the same check sent again under a new op id) is acknowledged, not stored twice.
 */
export async function applyCommissioningOp(op: CommissioningOp, access: SyncAccess, transaction: Transaction): Promise<OpEffect> {
  const none: OpEffect = { result: rejected(op, 422, ''), visitId: null, farmId: null };
  if (op.action !== 'put' || op.baseRev !== null) {
    return { ...none, result: rejected(op, 422, 'A commissioning check is recorded once and cannot be changed or deleted: record a new one.') };
  }
  const fields = entityFields.commissioning.safeParse(op.changes ?? {});
  if (!fields.success) {
    return { ...none, result: rejected(op, 422, 'A commissioning check must carry every reading.', prefixed(zodFieldErrors(fields.error))) };
  }
  const { visitId, fallM, drivePipeMaterial, wasteValveStrokeMm, ...readings } = fields.data;
  // Who may commission the visit is checked first: a stored record id says nothing about the sender.
  try {
    await access.assertOnVisit(visitId, 'visit:commission');
  } catch (error) {
    if (error instanceof AppError) return { ...none, result: rejected(op, error.status, error.message) };
    throw error;
  }
  const existing = await Commissioning.findByPk(op.entityId, { transaction });
  if (existing) {
    if (existing.visitId !== visitId || existing.organisationId !== access.user.organisationId) {
      return { ...none, result: rejected(op, 409, 'This record id is already used by another check.') };
    }
    return { result: { opId: op.opId, status: 'applied', rev: null }, visitId, farmId: null };
  }
  const input = commissioningInputSchema.safeParse({
    ...readings,
    ...(fallM === null ? {} : { fallM }),
    ...(drivePipeMaterial === null ? {} : { drivePipeMaterial }),
    ...(wasteValveStrokeMm === null ? {} : { wasteValveStrokeMm }),
  });
  if (!input.success) {
    const errors = zodFieldErrors(input.error);
    const first = Object.values(errors)[0]?.[0] ?? 'These readings cannot be checked.';
    return { ...none, result: rejected(op, 422, first, prefixed(errors)) };
  }
  try {
    await commissionVisit(access.user, visitId, input.data, transaction, op.entityId);
  } catch (error) {
    if (error instanceof AppError)
      return { ...none, result: rejected(op, error.status, error.message, error.fieldErrors ? prefixed(error.fieldErrors) : undefined) };
    throw error;
  }
  access.noteStatus(visitId, 'commissioned');
  return { result: { opId: op.opId, status: 'applied', rev: null }, visitId, farmId: null };
}
