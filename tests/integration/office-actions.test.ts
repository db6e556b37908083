import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { POST as accept } from '@/app/api/invitations/[token]/accept/route';
import { GET as getMe } from '@/app/api/me/route';
import { PATCH as patchPerson } from '@/app/api/people/[id]/route';
import { POST as postInvitation } from '@/app/api/people/invitations/route';
import { PUT as putAssignment } from '@/app/api/visits/[id]/assignment/route';
import { GET as getAudit } from '@/app/api/visits/[id]/audit/route';
import { POST as postAssignments } from '@/app/api/visits/assignments/route';
import { GET as getVisits, POST as postVisit } from '@/app/api/visits/route';
import { verifyPassword } from '@/lib/server/auth/passwords';
import { Invitation, User, Visit, getSequelize } from '@/lib/server/db';
import { makeOrganisation, params, request } from './support/fixtures';
import { mailTo } from './support/mailbox';

const assign = async (o: Awaited<ReturnType<typeof makeOrganisation>>, visitId: string, body: Record<string, unknown>) =>
  putAssignment(await request(`/api/visits/${visitId}/assignment`, o.coordinator, { method: 'PUT', body }), params({ id: visitId }));

describe('planning and assignment', () => {
  it('assigning a visit sends exactly one e-mail to the advisor, bumps its revision and writes an audit line', async () => {
    const o = await makeOrganisation('assign');
    const before = await Visit.findByPk(o.otherVisit.id, { rejectOnEmpty: true });
    const res = await assign(o, o.otherVisit.id, { advisorId: o.advisor.id, plannedOn: '2026-12-24' });
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.visit.noticeSent).toBe(true);
    expect(body.visit.rev).toBeGreaterThan(Number(before.rev));
    const mail = await mailTo(o.advisor.email);
    expect(mail).toHaveLength(1);
    expect(mail[0]?.subject).toContain(o.otherFarm.name);
    expect(mail[0]?.raw).toMatch(/\/field/);
    // The advisor it was taken from is told, once.
    const away = await mailTo(o.otherAdvisor.email);
    expect(away.map((m) => m.subject)).toEqual([`Site visit moved to another advisor: ${o.otherFarm.name}`]);

    // The advisor now sees it in their own list (what the phone pulls reads the same rows).
    const list = await getVisits(await request('/api/visits', o.advisor), params({}));
    expect(((await list.json()).items as { id: string }[]).map((v) => v.id)).toContain(o.otherVisit.id);

    const audit = await getAudit(await request(`/api/visits/${o.otherVisit.id}/audit`, o.coordinator), params({ id: o.otherVisit.id }));
    const lines = (await audit.json()).items as { action: string; actor: { name: string } }[];
    expect(lines[0]?.action).toBe('reassign');
    expect(lines[0]?.actor.name).toBe(o.coordinator.name);
  });

  it('bulk assignment sends one e-mail listing every visit', async () => {
    const o = await makeOrganisation('bulk');
    const created = [];
    for (let i = 0; i < 3; i += 1) {
      const res = await postVisit(
        await request('/api/visits', o.coordinator, { method: 'POST', body: { farmId: o.farm.id, notes: `visit ${i}`, confirmDuplicate: true } }),
        params({}),
      );
      expect(res.status).toBe(201);
      created.push((await res.json()).visit.id as string);
    }
    const res = await postAssignments(
      await request('/api/visits/assignments', o.coordinator, {
        method: 'POST',
        body: { visitIds: created, advisorId: o.otherAdvisor.id, plannedOn: '2027-01-05' },
      }),
      params({}),
    );
    expect(res.status).toBe(200);
    expect((await res.json()).assigned).toBe(3);
    const mail = await mailTo(o.otherAdvisor.email);
    expect(mail).toHaveLength(1);
    expect(mail[0]?.subject).toBe('3 site visits for you');
    const rows = await Visit.findAll({ where: { id: created } });
    expect(rows.every((v) => v.advisorId === o.otherAdvisor.id && v.status === 'scheduled' && v.plannedOn === '2027-01-05')).toBe(true);
  });

  it('reassigning a visit whose data may not have synced warns (409) and changes nothing until confirmed', async () => {
    const o = await makeOrganisation('unsynced');
    await getSequelize().transaction(async (transaction) => {
      const v = await Visit.findByPk(o.visit.id, { transaction, rejectOnEmpty: true });
      await v.update({ plannedOn: '2020-01-10', status: 'surveyed', lastSyncedAt: null }, { transaction });
    });
    const warned = await assign(o, o.visit.id, { advisorId: o.otherAdvisor.id, plannedOn: '2026-12-30' });
    expect(warned.status).toBe(409);
    expect((await warned.json()).error.code).toBe('unsynced');
    expect((await Visit.findByPk(o.visit.id, { rejectOnEmpty: true })).advisorId).toBe(o.advisor.id);
    expect(await mailTo(o.otherAdvisor.email)).toHaveLength(0);

    const confirmed = await assign(o, o.visit.id, { advisorId: o.otherAdvisor.id, plannedOn: '2026-12-30', confirmUnsynced: true });
    expect(confirmed.status).toBe(200);
    expect((await Visit.findByPk(o.visit.id, { rejectOnEmpty: true })).advisorId).toBe(o.otherAdvisor.id);
    expect(await mailTo(o.otherAdvisor.email)).toHaveLength(1);
  });

  it('refuses an advisor of another organisation or a farmer as advisor, with a field error', async () => {
    const o = await makeOrganisation('wrong-advisor');
    const stranger = await makeOrganisation('wrong-advisor-other');
    for (const advisorId of [stranger.advisor.id, o.farmer.id]) {
      const res = await assign(o, o.visit.id, { advisorId, plannedOn: '2026-12-30' });
      expect(res.status).toBe(422);
      expect((await res.json()).error.fieldErrors.advisorId).toBeDefined();
    }
    const missingDate = await assign(o, o.visit.id, { advisorId: o.advisor.id });
    expect(missingDate.status).toBe(422);
    expect((await missingDate.json()).error.fieldErrors.plannedOn).toBeDefined();
  });
});

describe('people', () => {
  it('deactivating a user refuses their existing session on the next request', async () => {
    const o = await makeOrganisation('switch-off');
    expect((await getMe(await request('/api/me', o.advisor), params({}))).status).toBe(200);
    const res = await patchPerson(
      await request(`/api/people/${o.advisor.id}`, o.coordinator, { method: 'PATCH', body: { active: false } }),
      params({ id: o.advisor.id }),
    );
    expect(res.status).toBe(200);
    expect((await getMe(await request('/api/me', o.advisor), params({}))).status).toBe(401);
    // Even switched back on, the old cookie stays dead: the session version moved on.
    await patchPerson(await request(`/api/people/${o.advisor.id}`, o.coordinator, { method: 'PATCH', body: { active: true } }), params({ id: o.advisor.id }));
    expect((await getMe(await request('/api/me', o.advisor), params({}))).status).toBe(401);
  });

  it('a coordinator cannot switch off their own account', async () => {
    const o = await makeOrganisation('self-off');
    const res = await patchPerson(
      await request(`/api/people/${o.coordinator.id}`, o.coordinator, { method: 'PATCH', body: { active: false } }),
      params({ id: o.coordinator.id }),
    );
    expect(res.status).toBe(422);
  });
});

describe('invitations', () => {
  async function invite(o: Awaited<ReturnType<typeof makeOrganisation>>, email: string, role = 'farmer') {
    return postInvitation(
      await request('/api/people/invitations', o.coordinator, { method: 'POST', body: { name: 'Newcomer Farmer', email, role } }),
      params({}),
    );
  }
  const acceptWith = async (token: string, body: unknown) =>
    accept(await request(`/api/invitations/${token}/accept`, undefined, { method: 'POST', body }), params({ token }));

  it('mails a one-time link that sets a password once; the token is stored only as its hash', async () => {
    const o = await makeOrganisation('invite');
    const email = `invitee-${randomUUID().slice(0, 8)}@fixtures.test`;
    const res = await invite(o, email);
    expect(res.status).toBe(201);
    const mail = await mailTo(email);
    expect(mail).toHaveLength(1);
    const token = mail[0]!.raw.replace(/=\r?\n/g, '').match(/\/welcome\/([A-Za-z0-9_-]{20,})/)?.[1];
    expect(token).toBeDefined();
    const stored = await Invitation.findOne({ where: { email } });
    expect(stored?.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored?.tokenHash).not.toContain(token!);

    const short = await acceptWith(token!, { password: 'short', confirm: 'short' });
    expect(short.status).toBe(422);
    expect((await short.json()).error.fieldErrors.password).toBeDefined();
    const differ = await acceptWith(token!, { password: 'long enough pass', confirm: 'long enough pasS' });
    expect((await differ.json()).error.fieldErrors.confirm).toBeDefined();

    const ok = await acceptWith(token!, { password: 'a good long password', confirm: 'a good long password' });
    expect(ok.status).toBe(200);
    const user = await User.findOne({ where: { email }, rejectOnEmpty: true });
    expect(user.role).toBe('farmer');
    expect(user.active).toBe(true);
    expect(await verifyPassword('a good long password', user.passwordHash!)).toBe(true);

    const again = await acceptWith(token!, { password: 'another long password', confirm: 'another long password' });
    expect(again.status).toBe(410);
    expect((await again.json()).error.message).toMatch(/already been used/);
  });

  it('an expired link is refused with a clear message; an unknown one is 404', async () => {
    const o = await makeOrganisation('invite-expired');
    const email = `late-${randomUUID().slice(0, 8)}@fixtures.test`;
    await invite(o, email, 'advisor');
    const token = (await mailTo(email))[0]!.raw.replace(/=\r?\n/g, '').match(/\/welcome\/([A-Za-z0-9_-]{20,})/)![1]!;
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email } });
    const res = await acceptWith(token, { password: 'a good long password', confirm: 'a good long password' });
    expect(res.status).toBe(410);
    expect((await res.json()).error.message).toMatch(/expired/);
    expect((await User.findOne({ where: { email }, rejectOnEmpty: true })).passwordHash).toBeNull();
    expect((await acceptWith('x'.repeat(43), { password: 'a good long password', confirm: 'a good long password' })).status).toBe(404);
  });

  it('refuses to invite an address that already has an active account', async () => {
    const o = await makeOrganisation('invite-dupe');
    await User.update({ passwordHash: 'x' }, { where: { id: o.advisor.id } });
    const res = await invite(o, o.advisor.email, 'advisor');
    expect(res.status).toBe(409);
  });
});
