import 'server-only';
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import type { Transaction } from 'sequelize';
import { Invitation, Organisation, User, getSequelize } from '@/lib/server/db';
import type { acceptInvitationSchema, invitationSchema } from '@/lib/shared/schemas/office';
import type { z } from 'zod';
import { recordAudit } from '../audit';
import { hashPassword } from '../auth/passwords';
import { recordLinkMiss } from '../auth/rate-limit';
import { authorize, type SessionUser } from '../auth/permissions';
import { AppError, conflict } from '../errors';
import { sendInvitation } from '../mail/notices';

// A week: long enough for someone who checks mail at the weekend, short enough to go stale.
export const INVITATION_DAYS = 7;

/** Only the sha-256 of a token is stored: a leaked table does not let anyone in. */
export const hashToken = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

/** Invites a person by e-mail (creating their account without a password) and mails a one-time link. */
export async function invitePerson(user: SessionUser, input: z.output<typeof invitationSchema>, now = new Date()) {
  authorize(user, 'people:manage');
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(now.getTime() + INVITATION_DAYS * 86_400_000);
  const { person, invitation, organisation } = await getSequelize().transaction(async (transaction) => {
    let person = await User.findOne({ where: { email: input.email }, transaction, lock: transaction.LOCK.UPDATE });
    if (person && person.organisationId !== user.organisationId) throw conflict('That e-mail address already has an account with another organisation.');
    if (person && person.passwordHash && person.active) throw conflict(`${person.name} already has an active account and can sign in.`);
    if (person) await person.update({ name: input.name, role: input.role }, { transaction });
    else {
      person = await User.create(
        {
          id: randomUUID(),
          organisationId: user.organisationId,
          email: input.email,
          name: input.name,
          role: input.role,
          passwordHash: null,
          units: null,
          phone: null,
          lastSignInAt: null,
        },
        { transaction },
      );
    }
    await supersedePendingInvitations(person.id, now, transaction);
    const invitation = await Invitation.create(
      {
        id: randomUUID(),
        organisationId: user.organisationId,
        email: input.email,
        name: input.name,
        role: input.role,
        tokenHash: hashToken(token),
        invitedById: user.id,
        userId: person.id,
        expiresAt,
        usedAt: null,
      },
      { transaction },
    );
    await recordAudit(
      {
        organisationId: user.organisationId,
        actorId: user.id,
        entity: 'user',
        entityId: person.id,
        action: 'invite',
        changes: { email: input.email, role: input.role, expiresAt: expiresAt.toISOString() },
      },
      transaction,
    );
    const organisation = await Organisation.findByPk(user.organisationId, { transaction, rejectOnEmpty: true });
    return { person, invitation, organisation };
  });
  let mailSent = true;
  try {
    await sendInvitation({ email: person.email, name: person.name }, token, organisation.name, user.name, expiresAt);
  } catch (error) {
    console.error('[fallbook] invitation not sent', error);
    mailSent = false;
  }
  return { id: invitation.id, userId: person.id, email: person.email, expiresAt: expiresAt.toISOString(), mailSent };
}

export type InvitationState = 'valid' | 'expired' | 'used' | 'superseded' | 'withdrawn' | 'unknown';

/** Ends every link still pending for the person: a newer invitation replaces them. */
async function supersedePendingInvitations(userId: string, now: Date, transaction: Transaction) {
  await Invitation.update({ supersededAt: now }, { where: { userId, usedAt: null, supersededAt: null, withdrawnAt: null }, transaction });
}

/** Ends every link still pending for the person: the office switched the account off. */
export async function withdrawPendingInvitations(userId: string, now: Date, transaction: Transaction) {
  await Invitation.update({ withdrawnAt: now }, { where: { userId, usedAt: null, supersededAt: null, withdrawnAt: null }, transaction });
}

type StoredLink = Pick<Invitation, 'usedAt' | 'supersededAt' | 'withdrawnAt' | 'expiresAt'>;

function stateOf(invitation: StoredLink | null, now: Date): InvitationState {
  if (!invitation) return 'unknown';
  if (invitation.usedAt) return 'used';
  if (invitation.withdrawnAt) return 'withdrawn';
  if (invitation.supersededAt) return 'superseded';
  return invitation.expiresAt <= now ? 'expired' : 'valid';
}

// A token longer than any we issue is not looked up at all.
const MAX_TOKEN_LENGTH = 100;

/** What the welcome page should say about a token (no session: the token is the key). */
export async function invitationState(token: string, now = new Date()) {
  const invitation = token.length <= MAX_TOKEN_LENGTH ? await Invitation.findOne({ where: { tokenHash: hashToken(token) } }) : null;
  if (!invitation) return { state: 'unknown' as InvitationState };
  const organisation = await Organisation.findByPk(invitation.organisationId);
  return { state: stateOf(invitation, now), name: invitation.name, email: invitation.email, organisation: organisation?.name ?? '' };
}

/** The sentence a person reads for a link that no longer works (the API's 404/410 and the welcome page). */
export const INVITATION_GONE: Record<Exclude<InvitationState, 'valid'>, string> = {
  unknown: 'This invitation link is not valid. Check that the whole link was copied, or ask your coordinator for a new one.',
  used: 'This invitation has already been used. Sign in with the password you chose, or ask your coordinator for a new link.',
  expired: 'This invitation has expired. Ask your coordinator to send a new one.',
  superseded: 'A newer invitation was sent to this address, so this link no longer works. Use the link in the latest e-mail.',
  withdrawn: 'This invitation was withdrawn: the account was switched off. Ask your coordinator if you still need access.',
};

/**
 * Sets the invited person's password, switches the account on and spends the token, all at once.
 * The token is looked up before any password is hashed, so guessed tokens cost no hashing; only the
 * newest link sent to a person works, and none works once the office switched the account off after
 * sending it (switching off withdraws pending links). Tokens that match nothing are counted per
 * address and slowed down (429).
 */
export async function acceptInvitation(token: string, input: z.output<typeof acceptInvitationSchema>, address: string, now = new Date()) {
  const found = token.length <= MAX_TOKEN_LENGTH ? await Invitation.findOne({ where: { tokenHash: hashToken(token) } }) : null;
  const early = stateOf(found, now);
  if (early === 'unknown') await recordLinkMiss(address, now);
  if (early !== 'valid') throw invitationGone(early);
  const passwordHash = await hashPassword(input.password);
  return getSequelize().transaction(async (transaction) => {
    const invitation = await Invitation.findOne({ where: { tokenHash: hashToken(token) }, transaction, lock: transaction.LOCK.UPDATE });
    const state = stateOf(invitation, now);
    if (!invitation || state !== 'valid') throw invitationGone(state);
    const person = invitation.userId ? await User.findByPk(invitation.userId, { transaction, lock: transaction.LOCK.UPDATE }) : null;
    if (!person) throw invitationGone('unknown');
    await person.update({ passwordHash, active: true, sessionVersion: person.sessionVersion + 1 }, { transaction });
    await invitation.update({ usedAt: now }, { transaction });
    await recordAudit(
      {
        organisationId: person.organisationId,
        actorId: person.id,
        entity: 'user',
        entityId: person.id,
        action: 'accept-invitation',
        changes: { email: person.email },
      },
      transaction,
    );
    return { email: person.email, role: person.role };
  });
}

function invitationGone(state: InvitationState): AppError {
  if (state === 'unknown' || state === 'valid') return new AppError(404, 'invitation_unknown', INVITATION_GONE.unknown);
  return new AppError(410, `invitation_${state}`, INVITATION_GONE[state]);
}

/** The organisation's recent invitations for the people page. */
export async function listInvitations(user: SessionUser, now = new Date()) {
  authorize(user, 'people:read');
  const rows = await Invitation.findAll({ where: { organisationId: user.organisationId }, order: [['createdAt', 'DESC']], limit: 50 });
  return rows.map((i) => ({
    id: i.id,
    email: i.email,
    name: i.name,
    role: i.role,
    expiresAt: i.expiresAt.toISOString(),
    state: listState(stateOf(i, now)),
  }));
}

/** The people page's three words for a link: superseded and withdrawn links are as good as expired. */
function listState(state: InvitationState): 'used' | 'expired' | 'waiting' {
  return state === 'used' ? 'used' : state === 'valid' ? 'waiting' : 'expired';
}
