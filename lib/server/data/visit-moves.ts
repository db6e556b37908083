import 'server-only';
import type { Transaction } from 'sequelize';
import type { Visit } from '@/lib/server/db';
import type { VisitStatus } from '@/lib/shared/domain';
import { canMove, moveRefusal, type MoveBy } from '@/lib/shared/visit-states';
import { recordAudit } from '../audit';
import { AppError } from '../errors';

export interface MoveContext {
  by: MoveBy;
  actorId: string | null;
  /** What made the move, in words for the audit trail ("sheet sent", "readings synced"). */
  cause?: string;
  /** A coordinator's stated reason for a move outside the table (a jump). */
  jumpReason?: string;
}

/** A 409 naming the refused move in words, for the person and the phone alike. */
export function refusedMove(from: VisitStatus, to: VisitStatus): AppError {
  return new AppError(409, 'transition', moveRefusal(from, to));
}

/**
 * Moves a visit (loaded and locked in the caller's transaction) to `to`, if the table allows `by`
 * that move, or when a coordinator's jump reason is given; writes the audit line. Staying put is
 * no change and writes nothing. Throws a 409 for a refused move.
 */
export async function moveVisit(visit: Visit, to: VisitStatus, ctx: MoveContext, transaction: Transaction): Promise<boolean> {
  const from = visit.status;
  if (from === to) return false;
  const jump = !canMove(from, to, ctx.by);
  if (jump && !ctx.jumpReason) throw refusedMove(from, to);
  await visit.update({ status: to }, { transaction });
  await recordAudit(
    {
      organisationId: visit.organisationId,
      actorId: ctx.actorId,
      entity: 'visit',
      entityId: visit.id,
      visitId: visit.id,
      action: jump ? 'status_jump' : 'status',
      changes: { from, to, ...(ctx.cause ? { cause: ctx.cause } : {}), ...(jump ? { reason: ctx.jumpReason } : {}) },
    },
    transaction,
  );
  return true;
}
