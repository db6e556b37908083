// Sane planning: planned dates in a window (past ones confirmed), a farm's second visit under way
// warned, the advisor told truthfully when a visit reaches the phone, the previous advisor told.
import { describe, expect, it } from 'vitest';
import { PUT as putAssignment } from '@/app/api/visits/[id]/assignment/route';
import { POST as postVisit } from '@/app/api/visits/route';
import { makeOrganisation, params, request } from './support/fixtures';
import { mailTo } from './support/mailbox';
import { inDays } from './support/route-table';
import { pull } from './support/sync';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
const assign = async (o: Org, body: Record<string, unknown>) =>
  putAssignment(await request(`/api/visits/${o.visit.id}/assignment`, o.coordinator, { method: 'PUT', body }), params({ id: o.visit.id }));
const body = (raw = '') => raw.replace(/=\r?\n/g, '');

describe('planned dates', () => {
  it.each([
    ['1900-06-01', /from Sat, 1 Jan 2000 on/],
    ['9999-12-31', /at most two years ahead/],
    [inDays(800), /at most two years ahead/],
    ['2027-02-30', /Pick a real date/],
  ])('refuses %s with a message at the field, and changes nothing', async (plannedOn, message) => {
    const o = await makeOrganisation('dates');
    const res = await assign(o, { advisorId: o.advisor.id, plannedOn });
    expect(res.status).toBe(422);
    expect((await res.json()).error.fieldErrors.plannedOn[0]).toMatch(message);
    expect(await mailTo(o.advisor.email)).toHaveLength(0);
  });

  it('a past date needs the confirmation; with it the visit is saved', async () => {
    const o = await makeOrganisation('dates-past');
    const yesterday = inDays(-1);
    const refused = await assign(o, { advisorId: o.advisor.id, plannedOn: yesterday });
    expect(refused.status).toBe(422);
    expect((await refused.json()).error.fieldErrors.plannedOn[0]).toMatch(/That day has passed/);
    const ok = await assign(o, { advisorId: o.advisor.id, plannedOn: yesterday, confirmPast: true });
    expect(ok.status).toBe(200);
    expect((await ok.json()).visit.plannedOn).toBe(yesterday);
  });
});

describe('a second visit for a farm', () => {
  it('is refused with a warning naming the visit under way, and made once confirmed', async () => {
    const o = await makeOrganisation('dupe');
    const warned = await postVisit(await request('/api/visits', o.coordinator, { method: 'POST', body: { farmId: o.farm.id } }), params({}));
    expect(warned.status).toBe(409);
    const error = (await warned.json()).error;
    expect(error.code).toBe('duplicate');
    expect(error.message).toBe(`${o.farm.name} already has a visit under way (Visit booked, planned Thu, 10 Dec 2026). Plan another one anyway?`);
    const made = await postVisit(
      await request('/api/visits', o.coordinator, { method: 'POST', body: { farmId: o.farm.id, confirmDuplicate: true } }),
      params({}),
    );
    expect(made.status).toBe(201);
  });
});

describe('telling the advisors', () => {
  it('a visit assigned without a date reaches the phone, and the e-mail says so and that the date is to come', async () => {
    const o = await makeOrganisation('nodate');
    const res = await postVisit(
      await request('/api/visits', o.coordinator, { method: 'POST', body: { farmId: o.otherFarm.id, advisorId: o.advisor.id, confirmDuplicate: true } }),
      params({}),
    );
    expect(res.status).toBe(201);
    const { visit } = await res.json();
    const page = await pull(o.advisor);
    expect(page.visits.map((v) => v.id)).toContain(visit.id);
    const mail = await mailTo(o.advisor.email);
    expect(mail).toHaveLength(1);
    expect(body(mail[0]?.raw)).toContain('no date yet: it will be agreed with you');
    expect(body(mail[0]?.raw)).toContain('It comes onto your phone at its next sync');
  });

  it('a reassignment tells the new advisor and the previous one', async () => {
    const o = await makeOrganisation('away');
    const res = await assign(o, { advisorId: o.otherAdvisor.id, plannedOn: inDays(20), confirmUnsynced: true });
    expect(res.status).toBe(200);
    expect((await mailTo(o.otherAdvisor.email)).map((m) => m.subject)).toEqual([`Site visit for you: ${o.farm.name}`]);
    const away = await mailTo(o.advisor.email);
    expect(away.map((m) => m.subject)).toEqual([`Site visit moved to another advisor: ${o.farm.name}`]);
    expect(body(away[0]?.raw)).toContain(`now with ${o.otherAdvisor.name}`);
    expect(body(away[0]?.raw)).toContain('It leaves your phone at its next sync');
  });
});
