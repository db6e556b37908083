import 'server-only';
import { randomUUID } from 'node:crypto';
import type { Transaction } from 'sequelize';
import { Farm, User, getSequelize } from '@/lib/server/db';
import type { farmSchema } from '@/lib/shared/schemas/office';
import type { z } from 'zod';
import { recordAudit } from '../audit';
import { authorize, type SessionUser } from '../auth/permissions';
import { invalid, notFound } from '../errors';

type FarmInput = z.output<typeof farmSchema>;

async function checkOwner(user: SessionUser, ownerId: string | null, transaction: Transaction) {
  if (!ownerId) return;
  const owner = await User.findOne({ where: { id: ownerId, organisationId: user.organisationId, role: 'farmer' }, transaction });
  if (!owner) throw invalid('ownerId: Choose a farmer of your organisation.', { ownerId: ['Choose a farmer of your organisation.'] });
}

const plain = (f: Farm) => ({ id: f.id, name: f.name, area: f.area, ownerId: f.ownerId, lat: f.lat, lon: f.lon, notes: f.notes });

/** Adds a farm to the organisation. */
export async function createFarm(user: SessionUser, input: FarmInput) {
  authorize(user, 'farm:edit');
  return getSequelize().transaction(async (transaction) => {
    await checkOwner(user, input.ownerId, transaction);
    const farm = await Farm.create({ id: randomUUID(), organisationId: user.organisationId, ...input, createdById: user.id }, { transaction });
    await recordAudit(
      { organisationId: user.organisationId, actorId: user.id, entity: 'farm', entityId: farm.id, action: 'create', changes: plain(farm) },
      transaction,
    );
    return plain(farm);
  });
}

/** Edits a farm of the organisation (404 if unknown, 403 if another organisation's); audit lists what changed. */
export async function updateFarm(user: SessionUser, id: string, input: FarmInput) {
  authorize(user, 'farm:edit');
  return getSequelize().transaction(async (transaction) => {
    const farm = await Farm.findOne({ where: { id, deletedAt: null }, transaction, lock: transaction.LOCK.UPDATE });
    if (!farm) throw notFound('farm');
    authorize(user, 'farm:edit', { organisationId: farm.organisationId });
    await checkOwner(user, input.ownerId, transaction);
    const before = plain(farm);
    await farm.update(input, { transaction });
    const after = plain(farm);
    const changed = Object.fromEntries(
      Object.entries(after)
        .filter(([k, v]) => before[k as keyof typeof before] !== v)
        .map(([k, v]) => [k, { from: before[k as keyof typeof before], to: v }]),
    );
    if (Object.keys(changed).length) {
      await recordAudit(
        { organisationId: user.organisationId, actorId: user.id, entity: 'farm', entityId: farm.id, action: 'update', changes: changed },
        transaction,
      );
    }
    return after;
  });
}

/** One farm for the edit form. */
export async function getFarmForEdit(user: SessionUser, id: string) {
  const farm = await Farm.findOne({ where: { id, deletedAt: null } });
  if (!farm) throw notFound('farm');
  authorize(user, 'farm:edit', { organisationId: farm.organisationId });
  return plain(farm);
}
