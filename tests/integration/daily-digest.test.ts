// A coordinator's morning: the daily digest names overdue visits, open questions, sheets sent but
// not read and failed sends, with links; each advisor gets only their own visits; nobody gets an
// empty one. Checked in what the fake SMTP server caught.
import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { POST as postQuestion } from '@/app/api/visits/[id]/sheet/questions/route';
import { POST as postSend } from '@/app/api/visits/[id]/sheet/send/route';
import { buildDigests, sendDailyDigests } from '@/lib/server/digest/daily-digest';
import { digestHourSchema, digestPattern, scheduleDailyDigest } from '@/lib/server/digest/schedule';
import { Screening, SheetSend, Visit, getSequelize } from '@/lib/server/db';
import { makeOrganisation, params, request } from './support/fixtures';
import { mailTo } from './support/mailbox';
import { screenFixtureVisit } from './support/screened';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let o: Org;
let overdueId: string;
const DAY = 86_400_000;
const isoDay = (t: number) => new Date(t).toISOString().slice(0, 10);
// The message's text with quoted-printable soft line breaks and escapes undone.
const digestsTo = async (address: string) => (await mailTo(address)).filter((m) => m.subject.startsWith('Fallbook this morning'));
const body = (raw = '') =>
  Buffer.from(
    raw.replace(/=\r?\n/g, '').replace(/=([0-9A-F]{2})/g, (_, h: string) => String.fromCharCode(parseInt(h, 16))),
    'latin1',
  ).toString('utf8');

beforeAll(async () => {
  o = await makeOrganisation('digest');
  await screenFixtureVisit(o.visit.id, o.farm.id, o.advisor.id);
  await screenFixtureVisit(o.otherVisit.id, o.otherFarm.id, o.otherAdvisor.id);
  // The first visit's sheet goes out and its farmer asks a question.
  expect(
    (await postSend(await request(`/api/visits/${o.visit.id}/sheet/send`, o.coordinator, { method: 'POST', body: {} }), params({ id: o.visit.id }))).status,
  ).toBe(201);
  expect(
    (
      await postQuestion(
        await request(`/api/visits/${o.visit.id}/sheet/questions`, o.farmer, { method: 'POST', body: { text: 'Can the tank sit by the barn instead?' } }),
        params({ id: o.visit.id }),
      )
    ).status,
  ).toBe(201);
  // The second visit's send failed at the mail server.
  const screening = await Screening.findOne({ where: { visitId: o.otherVisit.id }, rejectOnEmpty: true });
  await SheetSend.create({
    id: randomUUID(),
    visitId: o.otherVisit.id,
    screeningId: screening.id,
    sentById: o.coordinator.id,
    toAddress: 'digest-farmer-2@fixtures.test',
    paper: 'a4',
    status: 'failed',
    error: 'Connection refused',
    messageId: null,
  });
  // A booked visit of the first advisor whose day passed five days ago.
  overdueId = randomUUID();
  await getSequelize().transaction((transaction) =>
    Visit.create(
      {
        id: overdueId,
        organisationId: o.organisationId,
        farmId: o.farm.id,
        advisorId: o.advisor.id,
        plannedOn: isoDay(Date.now() - 5 * DAY),
        status: 'scheduled',
        notes: '',
        visitedAt: null,
        lastSyncedAt: null,
      },
      { transaction },
    ),
  );
});

describe('the daily digest', () => {
  it('tells the coordinator of all four lists in plain words with links, through the mail server', async () => {
    const outcome = await sendDailyDigests(new Date(Date.now() + 4 * DAY), [o.organisationId]);
    expect(outcome).toEqual({ sent: 3, failed: 0 });
    const caught = await digestsTo(o.coordinator.email);
    expect(caught).toHaveLength(1);
    expect(caught[0]?.subject).toBe('Fallbook this morning: 1 overdue visit, 1 open question, 1 unread sheet, 1 failed send');
    const text = body(caught[0]?.raw);
    expect(text).toContain('Visits past their planned day (1)');
    expect(text).toMatch(/digest farm: planned for \w{3}, \d+ \w+ \d{4}, 9 days ago; with digest-advisor/);
    expect(text).toContain(`/office/visits/${overdueId}`);
    expect(text).toContain('Questions waiting for an answer (1)');
    expect(text).toContain('“Can the tank sit by the barn instead?”');
    expect(text).toContain(`/sheets/${o.visit.id}#conversation`);
    expect(text).toContain('Sheets sent more than 3 days ago and not read yet (1)');
    expect(text).toContain(`digest farm: sent to ${o.farmer.email}`);
    expect(text).toContain('Sheet e-mails that did not go out (1)');
    expect(text).toMatch(/digest farm 2: the e-mail to digest-farmer-2@fixtures\.test on .+ UTC failed; send it again from the sheet/);
    expect(text).toContain(`/office/visits/${o.otherVisit.id}`);
    expect(text).not.toMatch(/sheet_sent|undefined|null|NaN/);
  });

  it('gives each advisor only their own visits', async () => {
    const mine = body((await digestsTo(o.advisor.email))[0]?.raw);
    expect(mine).toContain('Visits past their planned day (1)');
    expect(mine).toContain('Questions waiting for an answer (1)');
    expect(mine).toContain(`/field/visit?id=${overdueId}`);
    expect(mine).not.toContain('digest farm 2');
    const theirs = await digestsTo(o.otherAdvisor.email);
    expect(theirs).toHaveLength(1);
    expect(theirs[0]?.subject).toBe('Fallbook this morning: 1 failed send');
    expect(body(theirs[0]?.raw)).not.toContain('Can the tank sit');
  });

  it('leaves a sheet sent this morning out of the unread list, and sends nothing on a quiet day', async () => {
    const today = await buildDigests(o.organisationId, new Date());
    expect(today.find((d) => d.to.id === o.coordinator.id)?.counts).toEqual({ overdue: 1, questions: 1, unread: 0, failed: 1 });
    const quiet = await makeOrganisation('quiet-digest');
    // Its two booked visits are planned after this morning: nothing is waiting.
    const morning = new Date('2026-12-01T06:00:00Z');
    expect(await buildDigests(quiet.organisationId, morning)).toEqual([]);
    expect(await sendDailyDigests(morning, [quiet.organisationId])).toEqual({ sent: 0, failed: 0 });
    expect(await mailTo(quiet.coordinator.email)).toHaveLength(0);
  });

  it('reads its hour from DIGEST_HOUR (UTC) and refuses a bad one', () => {
    expect(digestPattern(digestHourSchema.parse('7') ?? -1)).toBe('0 7 * * *');
    expect(digestHourSchema.parse(undefined)).toBe(6);
    expect(digestHourSchema.parse('off')).toBeNull();
    expect(() => digestHourSchema.parse('25')).toThrow(/DIGEST_HOUR must be an hour from 0 to 23/);
  });

  it('is scheduled with croner for the next such hour, and not at all when off', () => {
    const job = scheduleDailyDigest('7', () => {});
    try {
      const next = job?.nextRun();
      expect(next?.getUTCHours()).toBe(7);
      expect(next?.getUTCMinutes()).toBe(0);
      expect((next?.getTime() ?? 0) - Date.now()).toBeLessThanOrEqual(86_400_000);
    } finally {
      job?.stop();
    }
    expect(scheduleDailyDigest('off')).toBeNull();
  });
});
