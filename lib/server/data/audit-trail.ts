import 'server-only';
import { AuditEntry, User, Visit } from '@/lib/server/db';
import { authorize, type SessionUser } from '../auth/permissions';
import { notFound } from '../errors';

export interface AuditLine {
  id: number;
  at: string;
  /** What the line is about (visit, point, sheet_send, …): with the action it picks the words. */
  entity: string;
  action: string;
  actor: { id: string; name: string } | null;
  changes: unknown;
}

/** Who changed what on a visit, and when: newest first (index audit_visit_created). */
export async function visitAuditTrail(user: SessionUser, visitId: string, limit = 200): Promise<AuditLine[]> {
  const visit = await Visit.findOne({ where: { id: visitId }, attributes: ['id', 'organisationId'] });
  if (!visit) throw notFound('visit');
  authorize(user, 'visit:audit', { organisationId: visit.organisationId });
  const rows = await AuditEntry.findAll({
    where: { visitId },
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit,
  });
  const actorIds = [...new Set(rows.map((r) => r.actorId).filter((id): id is string => !!id))];
  const actors = new Map((await User.findAll({ where: { id: actorIds }, attributes: ['id', 'name'] })).map((u) => [u.id, u.name]));
  return rows.map((r) => ({
    id: Number(r.id),
    at: r.createdAt.toISOString(),
    entity: r.entity,
    action: r.action,
    actor: r.actorId ? { id: r.actorId, name: actors.get(r.actorId) ?? 'Unknown person' } : null,
    changes: r.changes,
  }));
}
