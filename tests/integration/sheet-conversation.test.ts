// The loop between farmer, advisor and office on a sheet: the farmer reads it only once sent;
// reading and deciding are separate records and states; a question reaches the advisor and the
// coordinators by e-mail and the open-questions list; the answer reaches the farmer.
import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { GET as getOpen } from '@/app/api/questions/route';
import { POST as postAck } from '@/app/api/visits/[id]/sheet/acknowledge/route';
import { POST as postAnswer } from '@/app/api/visits/[id]/sheet/answers/route';
import { POST as postDecision } from '@/app/api/visits/[id]/sheet/decision/route';
import { GET as getThread, POST as postQuestion } from '@/app/api/visits/[id]/sheet/questions/route';
import { GET as getSheet } from '@/app/api/visits/[id]/sheet/route';
import { POST as postSend } from '@/app/api/visits/[id]/sheet/send/route';
import { SheetResponse, Visit } from '@/lib/server/db';
import { makeOrganisation, params, request } from './support/fixtures';
import { mailTo } from './support/mailbox';
import { screenFixtureVisit } from './support/screened';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let o: Org;
const id = () => o.visit.id;
const call = async (handler: typeof postAck, path: string, user: Org['farmer'], body?: unknown) =>
  handler(await request(`/api/visits/${id()}/sheet/${path}`, user, { method: 'POST', body: body ?? {} }), params({ id: id() }));
// The message's text with quoted-printable soft line breaks joined.
const body = (raw = '') => raw.replace(/=\r?\n/g, '');
const status = async () => (await Visit.findByPk(id(), { rejectOnEmpty: true })).status;

beforeAll(async () => {
  o = await makeOrganisation('loop');
  await screenFixtureVisit(o.visit.id, o.farm.id, o.advisor.id);
});

describe('reading is not agreeing', () => {
  it('a farmer cannot open, acknowledge or ask on a screened sheet nobody has sent', async () => {
    const res = await getSheet(await request(`/api/visits/${id()}/sheet`, o.farmer), params({ id: id() }));
    expect(res.status).toBe(404);
    expect((await res.json()).error.message).toMatch(/not been sent to you yet/);
    expect((await call(postAck, 'acknowledge', o.farmer)).status).toBe(404);
    expect((await call(postQuestion, 'questions', o.farmer, { text: 'Is it a go?' })).status).toBe(404);
    expect(await status()).toBe('screened');
  });

  it('once sent, "I have read it" moves the visit to read, not to agreed, and records no decision', async () => {
    const sent = await postSend(await request(`/api/visits/${id()}/sheet/send`, o.coordinator, { method: 'POST', body: {} }), params({ id: id() }));
    expect(sent.status).toBe(201);
    expect(await status()).toBe('sent');
    expect((await getSheet(await request(`/api/visits/${id()}/sheet`, o.farmer), params({ id: id() }))).status).toBe(200);
    const ack = await call(postAck, 'acknowledge', o.farmer);
    expect(ack.status).toBe(201);
    expect((await ack.json()).response.kind).toBe('acknowledged');
    expect(await status()).toBe('acknowledged');
    const rows = await SheetResponse.findAll({ where: { visitId: id() } });
    expect(rows.map((r) => r.kind)).toEqual(['acknowledged']);
  });

  it('"not now" needs a reason; with one the visit is declined; "go ahead" later agrees; each is its own record', async () => {
    const bare = await call(postDecision, 'decision', o.farmer, { decision: 'not-now', reason: '' });
    expect(bare.status).toBe(422);
    expect((await bare.json()).error.fieldErrors.reason[0]).toMatch(/why not now/);
    expect(await status()).toBe('acknowledged');
    expect((await call(postDecision, 'decision', o.farmer, { decision: 'not-now', reason: 'Money is short until the lambs sell.' })).status).toBe(201);
    expect(await status()).toBe('declined');
    expect((await call(postDecision, 'decision', o.farmer, { decision: 'go-ahead' })).status).toBe(201);
    expect(await status()).toBe('agreed');
    const kinds = (await SheetResponse.findAll({ where: { visitId: id() }, order: [['createdAt', 'ASC']] })).map((r) => `${r.kind}:${r.text}`);
    expect(kinds).toEqual(['acknowledged:I have read the sheet.', 'not-now:Money is short until the lambs sell.', 'go-ahead:']);
  });

  it('the advisor cannot decide for the farmer', async () => {
    expect((await call(postDecision, 'decision', o.advisor, { decision: 'go-ahead' })).status).toBe(403);
  });
});

describe('conversations', () => {
  it('a question e-mails the assigned advisor and the coordinator, is listed as open, and its answer is e-mailed to the farmer', async () => {
    const text = `Could the tank sit nearer the yard? ${randomUUID().slice(0, 6)}`;
    const asked = await call(postQuestion, 'questions', o.farmer, { text });
    expect(asked.status).toBe(201);
    const question = (await asked.json()).response;
    expect(question.told).toBe(2);
    for (const who of [o.advisor, o.coordinator]) {
      const mail = (await mailTo(who.email)).filter((m) => m.subject.startsWith('Question from'));
      expect(mail).toHaveLength(1);
      expect(mail[0]?.subject).toBe(`Question from ${o.farmer.name} about ${o.farm.name}`);
      expect(body(mail[0]?.raw)).toContain(text);
      expect(body(mail[0]?.raw)).toContain(`/sheets/${id()}`);
    }
    expect((await mailTo(o.otherAdvisor.email)).filter((m) => m.subject.startsWith('Question from'))).toHaveLength(0);

    for (const who of [o.advisor, o.coordinator]) {
      const open = await (await getOpen(await request('/api/questions', who), params({}))).json();
      expect(open.questions.map((q: { text: string }) => q.text)).toContain(text);
    }
    const other = await (await getOpen(await request('/api/questions', o.otherAdvisor), params({}))).json();
    expect(other.questions).toHaveLength(0);

    const answered = await call(postAnswer, 'answers', o.advisor, { questionId: question.id, text: 'Yes: 40 m nearer costs about 2 m more lift.' });
    expect(answered.status).toBe(201);
    expect((await answered.json()).response.farmerTold).toBe(true);
    const farmerMail = (await mailTo(o.farmer.email)).filter((m) => m.subject.startsWith('Answer to your question'));
    expect(farmerMail).toHaveLength(1);
    expect(body(farmerMail[0]?.raw)).toContain('40 m nearer costs about 2 m more lift');
    expect(body(farmerMail[0]?.raw)).toContain(text);

    const open = await (await getOpen(await request('/api/questions', o.coordinator), params({}))).json();
    expect(open.questions.map((q: { text: string }) => q.text)).not.toContain(text);

    const thread = (await (await getThread(await request(`/api/visits/${id()}/sheet/questions`, o.farmer), params({ id: id() }))).json()).responses;
    const last = thread.at(-1);
    expect(last).toMatchObject({ kind: 'answer', replyToId: question.id, author: { name: o.advisor.name, role: 'advisor' } });
    expect(thread.find((r: { id: string }) => r.id === question.id)).toMatchObject({ answered: true, author: { name: o.farmer.name, role: 'farmer' } });
  });

  it('refuses an answer to a question of another visit, and a farmer answering', async () => {
    const q = await SheetResponse.findOne({ where: { visitId: id(), kind: 'question' }, rejectOnEmpty: true });
    expect((await call(postAnswer, 'answers', o.farmer, { questionId: q.id, text: 'Answering myself' })).status).toBe(403);
    const res = await call(postAnswer, 'answers', o.coordinator, { questionId: randomUUID(), text: 'Which question?' });
    expect(res.status).toBe(422);
    expect((await res.json()).error.fieldErrors.questionId[0]).toBe('Choose a question on this sheet.');
  });
});
