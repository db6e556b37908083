// The table of visit states, enforced by the office's route handlers and by the sync push.
import { describe, expect, it } from 'vitest';
import { GET as getAudit } from '@/app/api/visits/[id]/audit/route';
import { POST as postJump } from '@/app/api/visits/[id]/jump/route';
import { PATCH as patchVisit } from '@/app/api/visits/[id]/route';
import { Visit, getSequelize } from '@/lib/server/db';
import { makeOrganisation, params, request } from './support/fixtures';
import { push, putOp } from './support/sync';

const setStatus = async (id: string, status: Visit['status']) =>
  getSequelize().transaction(async (transaction) => {
    await (await Visit.findByPk(id, { transaction, rejectOnEmpty: true })).update({ status }, { transaction });
  });

describe('the office moves a visit only as the table allows', () => {
  it('refuses "Visit booked" → "Running, checked" with a 409 in words, and changes nothing', async () => {
    const o = await makeOrganisation('states');
    const res = await patchVisit(
      await request(`/api/visits/${o.visit.id}`, o.coordinator, { method: 'PATCH', body: { status: 'commissioned' } }),
      params({ id: o.visit.id }),
    );
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toBe(
      'A visit cannot go from “Visit booked” to “Running, checked” in one step. To move it anyway, use “Move outside the usual order” and give your reason.',
    );
    expect((await Visit.findByPk(o.visit.id, { rejectOnEmpty: true })).status).toBe('scheduled');
  });

  it('takes an allowed move (booked → cancelled) and audits it', async () => {
    const o = await makeOrganisation('states-ok');
    const res = await patchVisit(
      await request(`/api/visits/${o.visit.id}`, o.coordinator, { method: 'PATCH', body: { status: 'cancelled' } }),
      params({ id: o.visit.id }),
    );
    expect(res.status).toBe(200);
    const lines = (await (await getAudit(await request(`/api/visits/${o.visit.id}/audit`, o.coordinator), params({ id: o.visit.id }))).json()).items;
    expect(lines[0]).toMatchObject({ action: 'status', changes: { from: 'scheduled', to: 'cancelled' } });
  });

  it('a jump needs a reason (422 without), and with one is made and audited with the reason', async () => {
    const o = await makeOrganisation('states-jump');
    const url = `/api/visits/${o.visit.id}/jump`;
    const bare = await postJump(await request(url, o.coordinator, { method: 'POST', body: { status: 'installed', reason: ' ' } }), params({ id: o.visit.id }));
    expect(bare.status).toBe(422);
    expect((await bare.json()).error.fieldErrors.reason[0]).toMatch(/Say in a few words why/);
    expect((await Visit.findByPk(o.visit.id, { rejectOnEmpty: true })).status).toBe('scheduled');
    const asAdvisor = await postJump(
      await request(url, o.advisor, { method: 'POST', body: { status: 'installed', reason: 'Done on paper.' } }),
      params({ id: o.visit.id }),
    );
    expect(asAdvisor.status).toBe(403);
    const res = await postJump(
      await request(url, o.coordinator, { method: 'POST', body: { status: 'installed', reason: 'Installed on paper last spring.' } }),
      params({ id: o.visit.id }),
    );
    expect(res.status).toBe(200);
    expect((await Visit.findByPk(o.visit.id, { rejectOnEmpty: true })).status).toBe('installed');
    const lines = (await (await getAudit(await request(`/api/visits/${o.visit.id}/audit`, o.coordinator), params({ id: o.visit.id }))).json()).items;
    expect(lines[0]).toMatchObject({ action: 'status_jump', changes: { from: 'scheduled', to: 'installed', reason: 'Installed on paper last spring.' } });
  });
});

describe('the sync push checks the same table', () => {
  it('refuses a phone moving a visit the office has not booked ("Needs requested" → "Site walked")', async () => {
    const o = await makeOrganisation('states-sync');
    await setStatus(o.visit.id, 'requested');
    const row = await Visit.findByPk(o.visit.id, { rejectOnEmpty: true });
    const { results } = await push(o.advisor, {
      ops: [putOp('visit', o.visit.id, { status: 'surveyed' }, { baseRev: Number(row.rev), base: { status: 'scheduled' } })],
    });
    expect(results[0]).toMatchObject({
      status: 'rejected',
      error: { code: 409, message: 'A visit cannot go from “Needs requested” to “Site walked” in one step.' },
    });
    expect((await Visit.findByPk(o.visit.id, { rejectOnEmpty: true })).status).toBe('requested');
  });

  it('takes the allowed "Visit booked" → "Site walked" from the phone, and keeps the office’s later state for a phone behind it', async () => {
    const o = await makeOrganisation('states-sync-ok');
    let row = await Visit.findByPk(o.visit.id, { rejectOnEmpty: true });
    const first = await push(o.advisor, {
      ops: [putOp('visit', o.visit.id, { status: 'surveyed' }, { baseRev: Number(row.rev), base: { status: 'scheduled' } })],
    });
    expect(first.results[0]?.status).toBe('applied');
    expect((await Visit.findByPk(o.visit.id, { rejectOnEmpty: true })).status).toBe('surveyed');
    await setStatus(o.visit.id, 'sent');
    row = await Visit.findByPk(o.visit.id, { rejectOnEmpty: true });
    const behind = await push(o.advisor, {
      ops: [putOp('visit', o.visit.id, { status: 'surveyed', notes: 'Gate code 1234' }, { baseRev: Number(row.rev), base: { status: 'surveyed', notes: '' } })],
    });
    expect(behind.results[0]?.status).toBe('applied');
    const after = await Visit.findByPk(o.visit.id, { rejectOnEmpty: true });
    expect([after.status, after.notes]).toEqual(['sent', 'Gate code 1234']);
  });
});
