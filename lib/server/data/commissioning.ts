import 'server-only';
import { randomUUID } from 'node:crypto';
import type { Transaction } from 'sequelize';
import { commissioningCheck, designPointFromFigures, predictionFromFigures, type CommissioningResult, type Screening as EngineScreening } from '@/lib/engine';
import { Commissioning, Farm, Screening, Visit, getSequelize } from '@/lib/server/db';
import { VISIT_STATUS_LABELS } from '@/lib/shared/domain';
import { canMove } from '@/lib/shared/visit-states';
import type { CommissioningInput } from '@/lib/shared/schemas/commissioning';
import { recordAudit } from '../audit';
import { authorize, type SessionUser } from '../auth/permissions';
import { conflict, invalid, notFound } from '../errors';

export interface CommissioningPoint {
  id: string;
  visitId: string;
  farmName: string;
  createdAt: string;
  measuredLpd: number;
  predictedLpd: number | null;
  p10Lpd: number | null;
  p90Lpd: number | null;
  outcome: string | null;
  daubuissonEfficiency: number;
}

/**
 * Records a commissioning check on the visit's latest screening, moves the visit to 'commissioned'
 * and writes the audit line, in one transaction.
 */
export async function recordCommissioning(user: SessionUser, visitId: string, input: CommissioningInput) {
  return getSequelize().transaction((transaction) => commissionVisit(user, visitId, input, transaction));
}

/**
 * The work of recordCommissioning inside the caller's transaction (the sync push runs it in an op's
 * savepoint, with the phone's record id). Throws AppError before writing anything when refused.
 */
export async function commissionVisit(user: SessionUser, visitId: string, input: CommissioningInput, transaction: Transaction, id: string = randomUUID()) {
  const visit = await Visit.findOne({
    where: { id: visitId, deletedAt: null },
    include: [{ model: Farm, attributes: ['ownerId'] }],
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  if (!visit) throw notFound('visit');
  authorize(user, 'visit:commission', { organisationId: visit.organisationId, advisorIds: visit.advisorId ? [visit.advisorId] : [] });
  if (visit.status !== 'commissioned' && !canMove(visit.status, 'commissioned', 'app')) {
    throw conflict(
      `This visit is “${VISIT_STATUS_LABELS[visit.status]}”: a ram is commissioned only after a screening, and not on a visit the farmer said not now to or that was cancelled.`,
    );
  }
  const screening = await Screening.findOne({ where: { visitId }, order: [['createdAt', 'DESC']], transaction });
  if (!screening) throw conflict('This visit has no screening to compare with.');
  const result = screening.result as EngineScreening;
  const fallM = input.fallM ?? result.figures.fallM?.value ?? null;
  if (fallM === null || !(fallM > 0)) throw invalid('fallM: The screening has no fall; enter the measured fall.', { fallM: ['Enter the measured fall.'] });
  if (input.liftM <= fallM) throw invalid('liftM: Lift must be more than the fall.', { liftM: ['Lift must be more than the fall.'] });
  const check: CommissioningResult = commissioningCheck({ ...input, fallM }, predictionFromFigures(result.figures), designPointFromFigures(result.figures));
  const row = await Commissioning.create(
    {
      id,
      organisationId: visit.organisationId,
      visitId,
      screeningId: screening.id,
      recordedById: user.id,
      driveLpm: input.driveLpm,
      deliveredLpm: input.deliveredLpm,
      beatsPerMinute: input.beatsPerMinute,
      liftM: input.liftM,
      fallM,
      drivePipeMaterial: input.drivePipeMaterial ?? null,
      wasteValveStrokeMm: input.wasteValveStrokeMm ?? null,
      notes: input.notes,
      measuredLpd: check.measuredLpd,
      predictedLpd: check.prediction?.deliveryLpd ?? null,
      outcome: check.outcome,
      result: check,
    },
    { transaction },
  );
  const before = visit.status;
  await visit.update({ status: 'commissioned' }, { transaction });
  await recordAudit(
    {
      organisationId: visit.organisationId,
      actorId: user.id,
      entity: 'commissioning',
      entityId: row.id,
      visitId,
      action: 'commission',
      changes: {
        status: { before, after: 'commissioned' },
        measuredLpd: check.measuredLpd,
        predictedLpd: check.prediction?.deliveryLpd ?? null,
        outcome: check.outcome,
      },
    },
    transaction,
  );
  return { id: row.id, visitId, status: 'commissioned' as const, check };
}

/** The latest commissioning of every visit in the caller's organisation: predicted against measured. */
export async function listCommissionings(user: SessionUser): Promise<CommissioningPoint[]> {
  authorize(user, 'commissioning:read');
  const rows = await Commissioning.findAll({
    where: { organisationId: user.organisationId },
    order: [['createdAt', 'DESC']],
    include: [{ model: Visit, attributes: ['id'], include: [{ model: Farm, attributes: ['name'] }] }],
  });
  const seen = new Set<string>();
  const out: CommissioningPoint[] = [];
  for (const r of rows) {
    if (seen.has(r.visitId)) continue;
    seen.add(r.visitId);
    const check = r.result as CommissioningResult;
    const farm = (r as Commissioning & { Visit?: Visit & { Farm?: Farm } }).Visit?.Farm;
    out.push({
      id: r.id,
      visitId: r.visitId,
      farmName: farm?.name ?? '',
      createdAt: r.createdAt.toISOString(),
      measuredLpd: r.measuredLpd,
      predictedLpd: r.predictedLpd,
      p10Lpd: check.prediction?.p10Lpd ?? null,
      p90Lpd: check.prediction?.p90Lpd ?? null,
      outcome: r.outcome,
      daubuissonEfficiency: check.daubuissonEfficiency,
    });
  }
  return out;
}
