import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { Farm, getSequelize } from '@/lib/server/db';
import { makeOrganisation } from './support/fixtures';

describe('server revisions of synced records', () => {
  it('every save takes a new, larger revision', async () => {
    const org = await makeOrganisation('rev');
    const sequelize = getSequelize();
    const before = (await Farm.findByPk(org.farm.id, { rejectOnEmpty: true })).rev;
    await sequelize.transaction(async (transaction) => {
      const farm = await Farm.findByPk(org.farm.id, { transaction, rejectOnEmpty: true });
      await farm.update({ notes: 'moved the gate' }, { transaction });
    });
    const after = (await Farm.findByPk(org.farm.id, { rejectOnEmpty: true })).rev;
    expect(after).toBeGreaterThan(before);
  });

  it('a save outside a transaction is refused, so no revision can commit out of order', async () => {
    const org = await makeOrganisation('rev-tx');
    await expect(Farm.create({ id: randomUUID(), organisationId: org.organisationId, ownerId: null, name: 'x', area: '', lat: null, lon: null, notes: '' }))
      .rejects.toThrow(/inside a transaction/);
  });

  it('a bulk update of a synced table is refused (it would skip revisions)', async () => {
    await expect(getSequelize().transaction((transaction) => Farm.update({ notes: 'x' }, { where: { name: 'nobody' }, transaction })))
      .rejects.toThrow(/one by one/);
  });

  it('a second writer waits for the first to commit, so a later revision never commits earlier', async () => {
    const org = await makeOrganisation('rev-order');
    const sequelize = getSequelize();
    const farm = (name: string) => ({ id: randomUUID(), organisationId: org.organisationId, ownerId: null, name, area: '', lat: null, lon: null, notes: '' });
    let firstCommittedAt = 0;
    let secondTookRevAt = 0;
    const first = sequelize.transaction(async (transaction) => {
      const row = await Farm.create(farm('first'), { transaction });
      await new Promise((r) => setTimeout(r, 300));
      firstCommittedAt = Date.now();
      return row.rev;
    });
    await new Promise((r) => setTimeout(r, 50));
    const second = sequelize.transaction(async (transaction) => {
      const row = await Farm.create(farm('second'), { transaction });
      secondTookRevAt = Date.now();
      return row.rev;
    });
    const [firstRev, secondRev] = await Promise.all([first, second]);
    expect(secondRev).toBeGreaterThan(firstRev);
    expect(secondTookRevAt).toBeGreaterThanOrEqual(firstCommittedAt);
  });
});
