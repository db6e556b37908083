import 'server-only';
import { randomUUID } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { Farm, User, Visit, getSequelize } from '@/lib/server/db';
import { VISIT_STATUS_LABELS, type VisitStatus } from '@/lib/shared/domain';
import type { visitAssignSchema, visitCreateSchema, bulkAssignSchema } from '@/lib/shared/schemas/office';
import { mayHoldUnsyncedData, todayIso } from '@/lib/shared/visit-rules';
import { ACTIVE_STATUSES, canMove, moveRefusal } from '@/lib/shared/visit-states';
import { formatDay } from '@/lib/shared/display/dates';
import type { z } from 'zod';
import { recordAudit } from '../audit';
import { authorize, type SessionUser } from '../auth/permissions';
import { AppError, invalid, notFound } from '../errors';
import { sendAssignmentNotice, sendReassignedAwayNotice, type AssignedVisit } from '../mail/notices';
import { moveVisit } from './visit-moves';

type Assign = z.output<typeof visitAssignSchema>;

/** An active advisor of the caller's organisation, or a 422 naming the field. */
async function advisorOrThrow(user: SessionUser, advisorId: string, transaction?: Transaction) {
  const advisor = await User.findOne({ where: { id: advisorId, organisationId: user.organisationId, role: 'advisor' }, transaction });
  if (!advisor) throw invalid('advisorId: Choose an advisor of your organisation.', { advisorId: ['Choose an advisor of your organisation.'] });
  if (!advisor.active) throw invalid('advisorId: That advisor’s account is switched off.', { advisorId: ['That advisor’s account is switched off.'] });
  return advisor;
}

/** A visit of the caller's organisation, locked for update (404 / 403 otherwise). */
async function visitForPlanning(user: SessionUser, id: string, transaction: Transaction) {
  const visit = await Visit.findOne({ where: { id, deletedAt: null }, include: [{ model: Farm }], transaction, lock: transaction.LOCK.UPDATE });
  if (!visit) throw notFound('visit');
  authorize(user, 'visit:plan', { organisationId: visit.organisationId });
  return visit as Visit & { Farm: Farm };
}

// Mail goes after the commit: a notice must never announce a change that rolled back.
async function notify(advisor: User, visits: AssignedVisit[], by: SessionUser): Promise<boolean> {
  try {
    await sendAssignmentNotice({ email: advisor.email, name: advisor.name }, visits, by.name);
    return true;
  } catch (error) {
    console.error('[fallbook] assignment notice not sent', error);
    return false;
  }
}

/** Creates a visit for a farm (a 409 to confirm when the farm has one under way); with an advisor and a date it is booked; an advisor is told. */
export async function createVisit(user: SessionUser, input: z.output<typeof visitCreateSchema>) {
  authorize(user, 'visit:plan');
  const { visit, advisor, farm } = await getSequelize().transaction(async (transaction) => {
    const farm = await Farm.findOne({ where: { id: input.farmId, organisationId: user.organisationId, deletedAt: null }, transaction });
    if (!farm) throw invalid('farmId: Choose a farm of your organisation.', { farmId: ['Choose a farm of your organisation.'] });
    if (!input.confirmDuplicate) {
      const active = await Visit.findOne({
        where: { farmId: farm.id, deletedAt: null, status: [...ACTIVE_STATUSES] },
        order: [['createdAt', 'DESC']],
        transaction,
      });
      if (active) {
        throw new AppError(
          409,
          'duplicate',
          `${farm.name} already has a visit under way (${VISIT_STATUS_LABELS[active.status]}${active.plannedOn ? `, planned ${formatDay(active.plannedOn)}` : ''}). Plan another one anyway?`,
        );
      }
    }
    const advisor = input.advisorId ? await advisorOrThrow(user, input.advisorId, transaction) : null;
    const status: VisitStatus = advisor && input.plannedOn ? 'scheduled' : 'requested';
    const visit = await Visit.create(
      {
        id: randomUUID(),
        organisationId: user.organisationId,
        farmId: farm.id,
        advisorId: advisor?.id ?? null,
        plannedOn: input.plannedOn ?? null,
        status,
        notes: input.notes,
        visitedAt: null,
        lastSyncedAt: null,
        createdById: user.id,
      },
      { transaction },
    );
    await recordAudit(
      {
        organisationId: user.organisationId,
        actorId: user.id,
        entity: 'visit',
        entityId: visit.id,
        visitId: visit.id,
        action: 'create',
        changes: { farm: farm.name, advisorId: visit.advisorId, plannedOn: visit.plannedOn, status },
      },
      transaction,
    );
    return { visit, advisor, farm };
  });
  const noticeSent = advisor ? await notify(advisor, [{ farmName: farm.name, area: farm.area, plannedOn: visit.plannedOn }], user) : false;
  return { id: visit.id, status: visit.status, noticeSent };
}

/** Applies one assignment inside a transaction; refuses an unconfirmed reassignment of unsynced work. */
async function assignOne(user: SessionUser, visit: Visit & { Farm: Farm }, input: Assign, transaction: Transaction) {
  const before = { advisorId: visit.advisorId, plannedOn: visit.plannedOn, status: visit.status };
  const reassigning = !!visit.advisorId && visit.advisorId !== input.advisorId;
  if (reassigning && !input.confirmUnsynced && mayHoldUnsyncedData({ ...visit.get(), lastSyncedAt: visit.lastSyncedAt }, todayIso())) {
    throw new AppError(409, 'unsynced', `${visit.Farm.name}: the current advisor may have readings on their phone that have not synced. Reassign anyway?`);
  }
  const status: VisitStatus = visit.status === 'requested' ? 'scheduled' : visit.status;
  await visit.update({ advisorId: input.advisorId, plannedOn: input.plannedOn, status }, { transaction });
  const changed = before.advisorId !== input.advisorId || before.plannedOn !== input.plannedOn;
  if (changed || before.status !== status) {
    await recordAudit(
      {
        organisationId: user.organisationId,
        actorId: user.id,
        entity: 'visit',
        entityId: visit.id,
        visitId: visit.id,
        action: reassigning ? 'reassign' : before.advisorId ? 'replan' : 'assign',
        changes: { before, after: { advisorId: input.advisorId, plannedOn: input.plannedOn, status } },
      },
      transaction,
    );
  }
  return before.advisorId !== input.advisorId || before.plannedOn !== input.plannedOn;
}

type AwayVisit = AssignedVisit & { newAdvisor: string };

// The advisors who lost visits to a reassignment each get one message listing theirs (after the commit).
async function notifyPrevious(away: Map<string, AwayVisit[]>, by: SessionUser): Promise<void> {
  if (away.size === 0) return;
  const people = await User.findAll({ where: { id: [...away.keys()], active: true }, attributes: ['id', 'name', 'email'] });
  for (const person of people) {
    try {
      await sendReassignedAwayNotice({ email: person.email, name: person.name }, away.get(person.id) ?? [], by.name);
    } catch (error) {
      console.error('[fallbook] reassignment notice not sent', error);
    }
  }
}

function noteAway(away: Map<string, AwayVisit[]>, previousAdvisorId: string | null, visit: Visit & { Farm: Farm }, advisor: User) {
  if (!previousAdvisorId || previousAdvisorId === advisor.id) return;
  away.set(previousAdvisorId, [
    ...(away.get(previousAdvisorId) ?? []),
    { farmName: visit.Farm.name, area: visit.Farm.area, plannedOn: visit.plannedOn, newAdvisor: advisor.name },
  ]);
}

/** Assigns or reassigns one visit with a planned date; the advisor gets one e-mail notice, and a previous advisor is told it left them. */
export async function assignVisit(user: SessionUser, id: string, input: Assign) {
  authorize(user, 'visit:plan');
  const away = new Map<string, AwayVisit[]>();
  const { advisor, visit, changed } = await getSequelize().transaction(async (transaction) => {
    const visit = await visitForPlanning(user, id, transaction);
    const advisor = await advisorOrThrow(user, input.advisorId, transaction);
    const previous = visit.advisorId;
    const changed = await assignOne(user, visit, input, transaction);
    noteAway(away, previous, visit, advisor);
    return { advisor, visit, changed };
  });
  const noticeSent = changed ? await notify(advisor, [{ farmName: visit.Farm.name, area: visit.Farm.area, plannedOn: visit.plannedOn }], user) : false;
  await notifyPrevious(away, user);
  return { id: visit.id, status: visit.status, advisorId: visit.advisorId, plannedOn: visit.plannedOn, rev: Number(visit.rev), noticeSent };
}

/** Assigns many visits to one advisor at once: all or none; one e-mail listing them. */
export async function bulkAssign(user: SessionUser, input: z.output<typeof bulkAssignSchema>) {
  authorize(user, 'visit:plan');
  const ids = [...new Set(input.visitIds)];
  const away = new Map<string, AwayVisit[]>();
  const { advisor, assigned } = await getSequelize().transaction(async (transaction) => {
    const advisor = await advisorOrThrow(user, input.advisorId, transaction);
    const visits = (await Visit.findAll({
      where: { id: { [Op.in]: ids }, organisationId: user.organisationId, deletedAt: null },
      include: [{ model: Farm }],
      order: [['id', 'ASC']],
      transaction,
      lock: transaction.LOCK.UPDATE,
    })) as (Visit & { Farm: Farm })[];
    if (visits.length !== ids.length) throw notFound('visit (one of those ticked is gone or not yours)');
    const assigned: AssignedVisit[] = [];
    for (const visit of visits) {
      const previous = visit.advisorId;
      if (await assignOne(user, visit, input, transaction)) assigned.push({ farmName: visit.Farm.name, area: visit.Farm.area, plannedOn: visit.plannedOn });
      noteAway(away, previous, visit, advisor);
    }
    return { advisor, assigned };
  });
  const noticeSent = assigned.length ? await notify(advisor, assigned, user) : false;
  await notifyPrevious(away, user);
  return { assigned: assigned.length, noticeSent };
}

/** Moves a visit by hand to a state the table allows the office from where it is (audited); anything else is a 409. */
export async function setVisitStatus(user: SessionUser, id: string, status: VisitStatus) {
  return getSequelize().transaction(async (transaction) => {
    const visit = await visitForPlanning(user, id, transaction);
    if (visit.status !== status && !canMove(visit.status, status, 'office')) {
      throw new AppError(409, 'transition', `${moveRefusal(visit.status, status)} To move it anyway, use “Move outside the usual order” and give your reason.`);
    }
    await moveVisit(visit, status, { by: 'office', actorId: user.id }, transaction);
    return { id: visit.id, status: visit.status };
  });
}

/** A coordinator's move outside the table, with their stated reason in the audit line. */
export async function jumpVisitStatus(user: SessionUser, id: string, status: VisitStatus, reason: string) {
  authorize(user, 'visit:jump');
  return getSequelize().transaction(async (transaction) => {
    const visit = await visitForPlanning(user, id, transaction);
    authorize(user, 'visit:jump', { organisationId: visit.organisationId });
    const allowed = canMove(visit.status, status, 'office');
    await moveVisit(
      visit,
      status,
      { by: 'office', actorId: user.id, jumpReason: allowed ? undefined : reason, cause: allowed ? reason : undefined },
      transaction,
    );
    return { id: visit.id, status: visit.status };
  });
}
