import 'server-only';
import { User, getSequelize } from '@/lib/server/db';
import { recordAudit } from '../audit';
import { authorize, type SessionUser } from '../auth/permissions';
import { invalid, notFound } from '../errors';
import { withdrawPendingInvitations } from './invitations';

/**
 * Switches an account off or on. Switching off also bumps the session version, so every session
 * the person holds (browser or phone) is refused on its next request, and withdraws every pending
 * invitation link, so only a link sent after this can switch the account back on.
 */
export async function setPersonActive(user: SessionUser, id: string, active: boolean) {
  authorize(user, 'people:manage');
  return getSequelize().transaction(async (transaction) => {
    const person = await User.findOne({ where: { id }, transaction, lock: transaction.LOCK.UPDATE });
    if (!person) throw notFound('person');
    authorize(user, 'people:manage', { organisationId: person.organisationId });
    if (person.id === user.id && !active) throw invalid('You cannot switch off your own account; ask another coordinator.');
    if (person.active === active) return { id: person.id, active };
    await person.update({ active, sessionVersion: active ? person.sessionVersion : person.sessionVersion + 1 }, { transaction });
    if (!active) await withdrawPendingInvitations(person.id, new Date(), transaction);
    await recordAudit(
      {
        organisationId: user.organisationId,
        actorId: user.id,
        entity: 'user',
        entityId: person.id,
        action: active ? 'reactivate' : 'deactivate',
        changes: { email: person.email, role: person.role },
      },
      transaction,
    );
    return { id: person.id, active };
  });
}
