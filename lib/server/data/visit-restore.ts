import 'server-only';
import { Op } from 'sequelize';
import { Farm, User, Visit, getSequelize } from '@/lib/server/db';
import { recordAudit } from '../audit';
import { authorize, type SessionUser } from '../auth/permissions';
import { notFound } from '../errors';

/** The organisation's deleted visits, newest deletion first (at most 100), for the office to restore. */
export async function listDeletedVisits(user: SessionUser) {
  authorize(user, 'visit:plan');
  const rows = await Visit.findAll({
    where: { organisationId: user.organisationId, deletedAt: { [Op.ne]: null } },
    include: [
      { model: Farm, attributes: ['name'] },
      { model: User, as: 'advisor', attributes: ['name'] },
    ],
    order: [['deletedAt', 'DESC']],
    limit: 100,
  });
  return rows.map((v) => {
    const row = v as Visit & { Farm?: Farm | null; advisor?: User | null };
    return {
      id: v.id,
      farmName: row.Farm?.name ?? '',
      advisorName: row.advisor?.name ?? null,
      status: v.status,
      plannedOn: v.plannedOn,
      deletedAt: (v.deletedAt as Date).toISOString(),
    };
  });
}

/**
 * Brings a deleted visit back with its readings (they were never removed). The save gives the visit a
 * new revision, so the assigned advisor's phone pulls it again. A live visit is answered as it is.
 */
export async function restoreVisit(user: SessionUser, id: string) {
  authorize(user, 'visit:plan');
  return getSequelize().transaction(async (transaction) => {
    const visit = await Visit.findOne({ where: { id }, transaction, lock: transaction.LOCK.UPDATE });
    if (!visit) throw notFound('visit');
    authorize(user, 'visit:plan', { organisationId: visit.organisationId });
    const restored = visit.deletedAt !== null;
    if (restored) {
      await visit.update({ deletedAt: null }, { transaction });
      await recordAudit(
        {
          organisationId: user.organisationId,
          actorId: user.id,
          entity: 'visit',
          entityId: visit.id,
          visitId: visit.id,
          action: 'restore',
          changes: { deletedAt: null },
        },
        transaction,
      );
    }
    return { id: visit.id, status: visit.status, restored, rev: Number(visit.rev) };
  });
}
