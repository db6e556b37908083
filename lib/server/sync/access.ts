import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { Farm, Visit, txConnection } from '@/lib/server/db';
import { authorize, can, type Permission, type SessionUser } from '../auth/permissions';
import { forbidden, notFound } from '../errors';

export interface VisitFacts {
  id: string;
  organisationId: string;
  farmId: string;
  advisorId: string | null;
  status: string;
}

/**
 * Who may write what during one push: visits and farms are read once per batch and the checks go
 * through the one permission helper (visit:capture for visit records, demand:edit for demand lines).
 */
export class SyncAccess {
  private visits = new Map<string, VisitFacts | null>();
  private farmAdvisors = new Map<string, { organisationId: string; ownerId: string | null; advisorIds: string[] } | null>();

  constructor(
    readonly user: SessionUser,
    private transaction: Transaction,
  ) {}

  /** The visit's facts, or null when it does not exist (or was deleted). */
  async visit(id: string): Promise<VisitFacts | null> {
    await this.preloadVisits([id]);
    return this.visits.get(id) ?? null;
  }

  /**
   * Reads the facts of these visits in one statement on the transaction's connection (sent at once,
   * so it can go out together with the batch's other first reads); later checks answer from them.
   */
  async preloadVisits(ids: string[]): Promise<void> {
    const wanted = ids.filter((id) => !this.visits.has(id));
    if (wanted.length === 0) return;
    const rows = await txConnection(this.transaction).query<VisitFacts[]>(
      'SELECT id, organisation_id AS organisationId, farm_id AS farmId, advisor_id AS advisorId, status FROM visits WHERE id IN (?) AND deleted_at IS NULL',
      [wanted],
    );
    for (const id of wanted) this.visits.set(id, null);
    for (const row of rows)
      this.visits.set(row.id, { id: row.id, organisationId: row.organisationId, farmId: row.farmId, advisorId: row.advisorId, status: row.status });
  }

  /** The visit's status as this batch knows it (read at its start, kept current by noteStatus). */
  knownStatus(id: string): string | null {
    return this.visits.get(id)?.status ?? null;
  }

  /** Keeps the batch's view of a visit's status current after the push changed it. */
  noteStatus(id: string, status: string): void {
    const facts = this.visits.get(id);
    if (facts) facts.status = status;
  }

  /** Throws 404/403 unless the caller holds the permission on the visit; returns its facts. */
  async assertOnVisit(visitId: string, permission: Permission): Promise<VisitFacts> {
    const facts = await this.visit(visitId);
    if (!facts) throw notFound('visit');
    const resource = { organisationId: facts.organisationId, advisorIds: facts.advisorId ? [facts.advisorId] : [] };
    // The role may not do this at all (an advisor deleting a visit): say who may.
    if (permission === 'visit:plan' && !can(this.user, permission)) {
      throw forbidden('Only a coordinator can delete a visit. Ask the office if this visit should go.');
    }
    authorize(this.user, permission, resource);
    return facts;
  }

  /** Throws 404/403 unless the caller may edit the farm's demand (advisor: a visit on it is theirs). */
  async assertCanEditDemand(farmId: string, permission: Permission = 'demand:edit'): Promise<void> {
    if (!this.farmAdvisors.has(farmId)) {
      const farm = await Farm.findOne({ where: { id: farmId, deletedAt: null }, transaction: this.transaction });
      const visits = farm
        ? await Visit.findAll({ attributes: ['advisorId'], where: { farmId, deletedAt: null, advisorId: { [Op.ne]: null } }, transaction: this.transaction })
        : [];
      this.farmAdvisors.set(
        farmId,
        farm ? { organisationId: farm.organisationId, ownerId: farm.ownerId, advisorIds: visits.map((v) => v.advisorId as string) } : null,
      );
    }
    const farm = this.farmAdvisors.get(farmId);
    if (!farm) throw notFound('farm');
    authorize(this.user, permission, farm);
  }
}
