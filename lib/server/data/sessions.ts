import 'server-only';
import { User, getSequelize } from '@/lib/server/db';
import { recordAudit } from '../audit';
import { authorize, type SessionUser } from '../auth/permissions';

/** Ends every session the person holds, on every device, by moving their session version on. */
export async function endAllSessions(user: SessionUser) {
  authorize(user, 'profile:read', { organisationId: user.organisationId, userId: user.id });
  await getSequelize().transaction(async (transaction) => {
    const person = await User.findByPk(user.id, { transaction, lock: transaction.LOCK.UPDATE, rejectOnEmpty: true });
    await person.update({ sessionVersion: person.sessionVersion + 1 }, { transaction });
    await recordAudit(
      { organisationId: user.organisationId, actorId: user.id, entity: 'user', entityId: user.id, action: 'sign-out-everywhere', changes: null },
      transaction,
    );
  });
  return { ended: true };
}
