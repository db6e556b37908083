// Invitation links: a newer invitation supersedes older ones, an account the office switched off is
// never switched back on by a link sent before, and a spent link answers 410 with a plain sentence.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { POST as accept } from '@/app/api/invitations/[token]/accept/route';
import { PATCH as patchPerson } from '@/app/api/people/[id]/route';
import { POST as postInvitation } from '@/app/api/people/invitations/route';
import { verifyPassword } from '@/lib/server/auth/passwords';
import { invitationState } from '@/lib/server/data/invitations';
import { User } from '@/lib/server/db';
import { makeOrganisation, params, request } from './support/fixtures';
import { mailTo } from './support/mailbox';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
const good = (password: string) => ({ password, confirm: password });

async function invite(o: Org, email: string): Promise<string> {
  const before = (await mailTo(email)).length;
  const res = await postInvitation(
    await request('/api/people/invitations', o.coordinator, { method: 'POST', body: { name: 'Invitee', email, role: 'advisor' } }),
    params({}),
  );
  expect(res.status).toBe(201);
  const mail = await mailTo(email);
  expect(mail).toHaveLength(before + 1);
  const token = mail[mail.length - 1]!.raw.replace(/=\r?\n/g, '').match(/\/welcome\/([A-Za-z0-9_-]{20,})/)?.[1];
  if (!token) throw new Error('no link in the invitation');
  return token;
}

const acceptWith = async (token: string, password: string) =>
  accept(await request(`/api/invitations/${token}/accept`, undefined, { method: 'POST', body: good(password) }), params({ token }));

const switchOff = async (o: Org, id: string) =>
  patchPerson(await request(`/api/people/${id}`, o.coordinator, { method: 'PATCH', body: { active: false } }), params({ id }));

describe('invitation links', () => {
  it('an older link of an account the office switched off answers 410 and leaves it off, its password unchanged', async () => {
    const o = await makeOrganisation('inv-old');
    const email = `twice-${randomUUID().slice(0, 8)}@fixtures.test`;
    const a = await invite(o, email);
    const b = await invite(o, email);
    expect((await acceptWith(b, 'the password from link b')).status).toBe(200);
    const person = await User.findOne({ where: { email }, rejectOnEmpty: true });
    expect((await switchOff(o, person.id)).status).toBe(200);

    const res = await acceptWith(a, 'the password from link a');
    expect(res.status).toBe(410);
    expect((await res.json()).error.message).toMatch(/newer invitation/i);
    const after = await User.findOne({ where: { email }, rejectOnEmpty: true });
    expect(after.active).toBe(false);
    expect(await verifyPassword('the password from link a', after.passwordHash!)).toBe(false);
  });

  it('a newer invitation supersedes the older link at once (410 before anything is accepted); the newer one works', async () => {
    const o = await makeOrganisation('inv-super');
    const email = `super-${randomUUID().slice(0, 8)}@fixtures.test`;
    const a = await invite(o, email);
    const b = await invite(o, email);
    expect((await invitationState(a)).state).toBe('superseded');
    const res = await acceptWith(a, 'an old link password');
    expect(res.status).toBe(410);
    expect((await User.findOne({ where: { email }, rejectOnEmpty: true })).passwordHash).toBeNull();
    expect((await invitationState(b)).state).toBe('valid');
    expect((await acceptWith(b, 'the newest link password')).status).toBe(200);
  });

  it('switching off an invited account withdraws its pending link: accepting answers 410 and the account stays off', async () => {
    const o = await makeOrganisation('inv-off');
    const email = `pending-${randomUUID().slice(0, 8)}@fixtures.test`;
    const a = await invite(o, email);
    const person = await User.findOne({ where: { email }, rejectOnEmpty: true });
    expect((await switchOff(o, person.id)).status).toBe(200);
    expect((await invitationState(a)).state).toBe('withdrawn');
    const res = await acceptWith(a, 'a pending link password');
    expect(res.status).toBe(410);
    expect((await res.json()).error.message).toMatch(/withdrawn/i);
    const after = await User.findOne({ where: { email }, rejectOnEmpty: true });
    expect(after.active).toBe(false);
    expect(after.passwordHash).toBeNull();
  });

  it('the office may invite a switched-off person again: that newer link switches the account back on', async () => {
    const o = await makeOrganisation('inv-again');
    const email = `again-${randomUUID().slice(0, 8)}@fixtures.test`;
    expect((await acceptWith(await invite(o, email), 'first chosen password')).status).toBe(200);
    const person = await User.findOne({ where: { email }, rejectOnEmpty: true });
    await switchOff(o, person.id);
    const again = await invite(o, email);
    expect((await acceptWith(again, 'second chosen password')).status).toBe(200);
    expect((await User.findByPk(person.id, { rejectOnEmpty: true })).active).toBe(true);
  });

  it('a used link answers 410 with its own sentence (expired: office-actions.test.ts)', async () => {
    const o = await makeOrganisation('inv-gone');
    const email = `gone-${randomUUID().slice(0, 8)}@fixtures.test`;
    const a = await invite(o, email);
    expect((await acceptWith(a, 'a first good password')).status).toBe(200);
    const used = await acceptWith(a, 'a second good password');
    expect(used.status).toBe(410);
    expect((await used.json()).error.message).toMatch(/already been used/);
  });
});
