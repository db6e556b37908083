// Sync obeys the permission table the routes do: deleting a visit is planning (coordinators), so an
// advisor's delete through sync is refused; a visit deleted anyway is listed and restored by a coordinator.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { GET as getDeleted } from '@/app/api/visits/deleted/route';
import { POST as postRestore } from '@/app/api/visits/[id]/restore/route';
import { GET as getVisit } from '@/app/api/visits/[id]/route';
import { Visit, getSequelize } from '@/lib/server/db';
import { makeOrganisation, params, request } from './support/fixtures';
import { deleteOp, pull, push, putOp } from './support/sync';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;

const revOf = async (id: string) => Number((await Visit.findByPk(id, { rejectOnEmpty: true })).rev);
const officeGet = async (o: Org, id: string) => getVisit(await request(`/api/visits/${id}`, o.coordinator), params({ id }));
const restore = async (o: Org, id: string, user = o.coordinator) =>
  postRestore(await request(`/api/visits/${id}/restore`, user, { method: 'POST', body: {} }), params({ id }));

async function deleteOnServer(id: string) {
  await getSequelize().transaction(async (transaction) => {
    const visit = await Visit.findByPk(id, { transaction, rejectOnEmpty: true });
    await visit.update({ deletedAt: new Date() }, { transaction });
  });
}

describe('deleting a visit through sync', () => {
  it('the assigned advisor may not delete the visit itself: rejected 403, the office still sees it', async () => {
    const o = await makeOrganisation('sync-del');
    const { status, results } = await push(o.advisor, { ops: [deleteOp('visit', o.visit.id, await revOf(o.visit.id))] });
    expect(status).toBe(200);
    expect(results[0]?.status).toBe('rejected');
    expect(results[0]?.error?.code).toBe(403);
    expect(results[0]?.error?.message).toMatch(/coordinator/i);
    expect((await Visit.findByPk(o.visit.id, { rejectOnEmpty: true })).deletedAt).toBeNull();
    expect((await officeGet(o, o.visit.id)).status).toBe(200);
  });

  it('the same advisor may still delete a reading of the visit (capture)', async () => {
    const o = await makeOrganisation('sync-del-reading');
    const id = randomUUID();
    const created = await push(o.advisor, { ops: [putOp('waterSource', id, { visitId: o.visit.id, name: 'Spring', kind: 'spring', notes: '' })] });
    expect(created.results[0]?.status).toBe('applied');
    const gone = await push(o.advisor, { ops: [deleteOp('waterSource', id, created.results[0]?.rev as number)] });
    expect(gone.results[0]?.status).toBe('applied');
  });
});

describe('restoring a deleted visit (coordinators)', () => {
  it('the office lists the deleted visit, restores it, and the advisor pulls it again', async () => {
    const o = await makeOrganisation('restore');
    await deleteOnServer(o.visit.id);
    expect((await officeGet(o, o.visit.id)).status).toBe(404);

    const listed = await getDeleted(await request('/api/visits/deleted', o.coordinator), params({}));
    expect(listed.status).toBe(200);
    const items = (await listed.json()).items as { id: string; farmName: string }[];
    expect(items.map((v) => v.id)).toEqual([o.visit.id]);
    expect(items[0]?.farmName).toBe(o.farm.name);

    const before = await pull(o.advisor);
    expect(before.visibleVisitIds).not.toContain(o.visit.id);
    const res = await restore(o, o.visit.id);
    expect(res.status).toBe(200);
    expect((await officeGet(o, o.visit.id)).status).toBe(200);
    const after = await pull(o.advisor, before.cursor);
    expect(after.visibleVisitIds).toContain(o.visit.id);
    expect(after.visits.map((v) => v.id)).toContain(o.visit.id);
    const empty = await getDeleted(await request('/api/visits/deleted', o.coordinator), params({}));
    expect((await empty.json()).items).toEqual([]);
  });

  it('an advisor may not restore (403) nor list deleted visits (403); another organisation gets 404 (as on every visit route)', async () => {
    const o = await makeOrganisation('restore-refused');
    const other = await makeOrganisation('restore-other');
    await deleteOnServer(o.visit.id);
    expect((await restore(o, o.visit.id, o.advisor)).status).toBe(403);
    expect((await getDeleted(await request('/api/visits/deleted', o.advisor), params({}))).status).toBe(403);
    expect((await restore(o, o.visit.id, other.coordinator)).status).toBe(404);
    expect((await Visit.findByPk(o.visit.id, { rejectOnEmpty: true })).deletedAt).not.toBeNull();
  });
});
