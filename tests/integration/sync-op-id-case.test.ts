// Op ids (and record ids) are UUIDs, which name the same thing in either case: an upper-cased copy
// of an op already applied is a replay, not a second application.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { AuditEntry, WaterSource } from '@/lib/server/db';
import { makeOrganisation } from './support/fixtures';
import { push, putOp } from './support/sync';

describe('op ids in any case', () => {
  it('an upper-cased copy of an applied op id answers replayed and changes nothing', async () => {
    const o = await makeOrganisation('op-case');
    const id = randomUUID();
    const created = await push(o.advisor, { ops: [putOp('waterSource', id, { visitId: o.visit.id, name: 'Spring', kind: 'spring', notes: '' })] });
    const rev = created.results[0]?.rev as number;
    const update = putOp('waterSource', id, { notes: 'fenced' }, { baseRev: rev });
    expect((await push(o.advisor, { ops: [update] })).results[0]?.status).toBe('applied');
    const audits = await AuditEntry.count({ where: { entityId: id } });
    const revAfter = Number((await WaterSource.findByPk(id, { rejectOnEmpty: true })).rev);

    const copy = { ...update, opId: update.opId.toUpperCase() };
    const again = await push(o.advisor, { ops: [copy] });
    expect(again.results[0]?.status).toBe('replayed');
    expect(again.results[0]?.opId).toBe(copy.opId.toLowerCase());
    expect(await AuditEntry.count({ where: { entityId: id } })).toBe(audits);
    expect(Number((await WaterSource.findByPk(id, { rejectOnEmpty: true })).rev)).toBe(revAfter);
  });

  it('an upper-cased record id names the same record', async () => {
    const o = await makeOrganisation('id-case');
    const id = randomUUID();
    const created = await push(o.advisor, { ops: [putOp('waterSource', id, { visitId: o.visit.id, name: 'Spring', kind: 'spring', notes: '' })] });
    const res = await push(o.advisor, { ops: [putOp('waterSource', id.toUpperCase(), { notes: 'upper' }, { baseRev: created.results[0]?.rev as number })] });
    expect(res.status).toBe(200);
    expect(res.results[0]?.status).toBe('applied');
    expect((await WaterSource.findByPk(id, { rejectOnEmpty: true })).notes).toBe('upper');
  });
});
