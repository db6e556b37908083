import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { Computed, Farm, nextRev, PlainRow, reservePendingRevs, reserveRevs, txConnection, writeSyncedRows, getSequelize } from '@/lib/server/db';
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
    await expect(
      Farm.create({ id: randomUUID(), organisationId: org.organisationId, ownerId: null, name: 'x', area: '', lat: null, lon: null, notes: '' }),
    ).rejects.toThrow(/inside a transaction/);
  });

  it('a bulk update of a synced table is refused (it would skip revisions)', async () => {
    await expect(getSequelize().transaction((transaction) => Farm.update({ notes: 'x' }, { where: { name: 'nobody' }, transaction }))).rejects.toThrow(
      /one by one/,
    );
  });

  it('a second writer waits for the first to commit, so a later revision never commits earlier', async () => {
    const org = await makeOrganisation('rev-order');
    const sequelize = getSequelize();
    const farm = (name: string) => ({ id: randomUUID(), organisationId: org.organisationId, ownerId: null, name, area: '', lat: null, lon: null, notes: '' });
    let firstCommittedAt = 0;
    let secondTookRevAt = 0;
    let firstTookRev: () => void = () => undefined;
    const firstHasRev = new Promise<void>((resolve) => (firstTookRev = resolve));
    const first = sequelize.transaction(async (transaction) => {
      const row = await Farm.create(farm('first'), { transaction });
      firstTookRev();
      await new Promise((r) => setTimeout(r, 300));
      firstCommittedAt = Date.now();
      return row.rev;
    });
    // The second starts once the first holds its revision (on a busy machine a fixed delay may not be enough).
    await firstHasRev;
    const second = sequelize.transaction(async (transaction) => {
      const row = await Farm.create(farm('second'), { transaction });
      secondTookRevAt = Date.now();
      return row.rev;
    });
    const [firstRev, secondRev] = await Promise.all([first, second]);
    expect(secondRev).toBeGreaterThan(firstRev);
    expect(secondTookRevAt).toBeGreaterThanOrEqual(firstCommittedAt);
  });

  it('every pooled connection reads committed, which the push relies on (it sets no level itself)', async () => {
    // Three transactions at once hold three connections of the pool.
    const levels = await Promise.all(
      [1, 2, 3].map(() =>
        getSequelize().transaction(async (transaction) => {
          const [row] = await txConnection(transaction).query<{ level: string }[]>('SELECT @@tx_isolation AS level');
          return row?.level;
        }),
      ),
    );
    expect(levels).toEqual(['READ-COMMITTED', 'READ-COMMITTED', 'READ-COMMITTED']);
  });

  it('a reserved block is consecutive, handed out in order, and later revisions come after it', async () => {
    const sequelize = getSequelize();
    const { block, taken, after } = await sequelize.transaction(async (transaction) => {
      const block = await reserveRevs(transaction, 4);
      const taken = [block.take(), block.take(), block.take(), block.take()];
      expect(() => block.take()).toThrow(/used up/);
      return { block, taken, after: await nextRev(transaction) };
    });
    expect(block.last - block.first).toBe(3);
    expect(taken).toEqual([block.first, block.first + 1, block.first + 2, block.first + 3]);
    expect(after).toBeGreaterThan(block.last);
  });

  it('the bulk writer refuses rows whose revision this transaction did not reserve, and writes reserved ones', async () => {
    const org = await makeOrganisation('rev-bulk');
    const sequelize = getSequelize();
    const farm = (rev: number) =>
      Farm.build({ id: randomUUID(), organisationId: org.organisationId, ownerId: null, name: 'bulk', area: '', lat: null, lon: null, notes: '', rev });
    await expect(
      sequelize.transaction(async (transaction) => {
        const block = await reserveRevs(transaction, 1);
        await writeSyncedRows(Farm, { created: [farm(block.last + 1000)], updated: [] }, [], transaction);
      }),
    ).rejects.toThrow(/not reserved/);
    await expect(sequelize.transaction((transaction) => writeSyncedRows(Farm, { created: [farm(1)], updated: [] }, [], transaction))).rejects.toThrow(
      /not reserved/,
    );
    const written = await sequelize.transaction(async (transaction) => {
      const block = await reserveRevs(transaction, 1);
      const row = farm(block.take());
      await writeSyncedRows(Farm, { created: [row], updated: [] }, [], transaction);
      return row;
    });
    expect((await Farm.findByPk(written.id, { rejectOnEmpty: true })).rev).toBe(written.rev);
  });

  it('a pending block numbers its rows in the database, in order, and refuses a computed revision it did not give', async () => {
    const org = await makeOrganisation('rev-pending');
    const sequelize = getSequelize();
    const plain = (rev: unknown) =>
      new PlainRow({ id: randomUUID(), organisationId: org.organisationId, ownerId: null, name: 'pending', area: '', lat: null, lon: null, notes: '', rev });
    const { rows, numbers, top, after } = await sequelize.transaction(async (transaction) => {
      const block = reservePendingRevs(transaction, 3);
      const cells = [block.take(), block.take(), block.take()];
      const rows = cells.map((cell) => plain(cell));
      // Written without waiting for the block's number: the database computes each revision.
      await Promise.all([writeSyncedRows(Farm, { created: rows, updated: [] }, [], transaction), block.top]);
      const numbers = cells.map((cell) => block.revOf(cell));
      const after = await nextRev(transaction);
      return { rows, numbers, top: await block.top, after };
    });
    expect(numbers).toEqual([top - 2, top - 1, top]);
    const stored = await Promise.all(rows.map(async (row) => (await Farm.findByPk(row.id, { rejectOnEmpty: true })).rev));
    expect(stored).toEqual(numbers);
    expect(after).toBe(top + 1);
    await expect(
      sequelize.transaction(async (transaction) => {
        reservePendingRevs(transaction, 1);
        await writeSyncedRows(Farm, { created: [plain(new Computed('@fallbook_rev_top - ?', [0]))], updated: [] }, [], transaction);
      }),
    ).rejects.toThrow(/not reserved/);
  });
});
