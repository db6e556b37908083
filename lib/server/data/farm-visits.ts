import 'server-only';
import { Farm, Visit } from '@/lib/server/db';
import { authorize, type SessionUser } from '../auth/permissions';
import { notFound } from '../errors';
import { visitSummaries, type VisitSummary } from './visit-summaries';

/** Every visit of one farm, newest planned first (undated last), for the farm's page in the office. */
export async function farmVisitSummaries(user: SessionUser, farmId: string): Promise<VisitSummary[]> {
  const farm = await Farm.findOne({ where: { id: farmId, deletedAt: null }, attributes: ['id', 'organisationId'] });
  if (!farm) throw notFound('farm');
  authorize(user, 'visit:plan', { organisationId: farm.organisationId });
  const visits = await Visit.findAll({
    where: { farmId, deletedAt: null },
    attributes: ['id', 'plannedOn', 'createdAt'],
    order: [
      ['createdAt', 'DESC'],
      ['id', 'ASC'],
    ],
    limit: 200,
  });
  const ids = visits.sort((a, b) => (b.plannedOn ?? '0000').localeCompare(a.plannedOn ?? '0000')).map((v) => v.id);
  return visitSummaries(user, ids);
}
