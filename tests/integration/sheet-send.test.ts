import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { POST as postSend } from '@/app/api/visits/[id]/sheet/send/route';
import { POST as postPreview } from '@/app/api/visits/[id]/sheet/send/preview/route';
import { GET as getSends } from '@/app/api/visits/[id]/sheet/sends/route';
import { POST as postAck } from '@/app/api/visits/[id]/sheet/acknowledge/route';
import { GET as getQuestions, POST as postQuestion } from '@/app/api/visits/[id]/sheet/questions/route';
import { AuditEntry, Visit } from '@/lib/server/db';
import { makeOrganisation, params, request } from './support/fixtures';
import { mailTo } from './support/mailbox';
import { screenFixtureVisit } from './support/screened';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let org: Org;

beforeAll(async () => {
  org = await makeOrganisation('send');
  await screenFixtureVisit(org.visit.id, org.farm.id, org.advisor.id);
});

const id = () => org.visit.id;

describe('POST /api/visits/:id/sheet/send', () => {
  it('delivers one message to the farmer with the PDF attached and a link to the sheet, and records it', async () => {
    const res = await postSend(await request(`/api/visits/${id()}/sheet/send`, org.advisor, { method: 'POST', body: {} }), params({ id: id() }));
    expect(res.status).toBe(201);
    const { send } = await res.json();
    expect(send).toMatchObject({ to: org.farmer.email, status: 'sent', error: null, sentById: org.advisor.id });
    const caught = await mailTo(org.farmer.email);
    expect(caught).toHaveLength(1);
    expect(caught[0]?.raw).toMatch(/Content-Type: application\/pdf/i);
    expect(caught[0]?.raw).toMatch(/filename="?fallbook-sheet-send-farm\.pdf/);
    expect(caught[0]?.raw).toContain(`/sheets/${id()}`);
    const audit = await AuditEntry.findOne({ where: { entityId: send.id } });
    expect(audit?.action).toBe('sheet_sent');
  });

  it('the coordinator can send to another address they give', async () => {
    const to = `neighbour-${randomUUID().slice(0, 8)}@fixtures.test`;
    const res = await postSend(
      await request(`/api/visits/${id()}/sheet/send`, org.coordinator, { method: 'POST', body: { to, note: 'Bring the tank quote.' } }),
      params({ id: id() }),
    );
    expect(res.status).toBe(201);
    const caught = await mailTo(to);
    expect(caught).toHaveLength(1);
    // The personal note rides in the message, after the greeting.
    expect(caught[0]?.raw).toContain('Bring the tank quote.');
  });

  it('a bad address is a 422 that says what is wrong, and nothing is sent or recorded', async () => {
    const before = (await (await getSends(await request(`/api/visits/${id()}/sheet/sends`, org.advisor), params({ id: id() }))).json()).sends.length;
    const res = await postSend(
      await request(`/api/visits/${id()}/sheet/send`, org.advisor, { method: 'POST', body: { to: 'hallie at the farm' } }),
      params({ id: id() }),
    );
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.error.message).toMatch(/to: Enter a valid e-mail address/);
    expect(body.error.fieldErrors.to).toHaveLength(1);
    const after = (await (await getSends(await request(`/api/visits/${id()}/sheet/sends`, org.advisor), params({ id: id() }))).json()).sends.length;
    expect(after).toBe(before);
  });

  it('a preview shows the e-mail as it will go, with the personal note, and sends or records nothing', async () => {
    const sendsNow = async () =>
      (await (await getSends(await request(`/api/visits/${id()}/sheet/sends`, org.advisor), params({ id: id() }))).json()).sends.length;
    const before = await sendsNow();
    const mailsBefore = (await mailTo(org.farmer.email)).length;
    const note = 'I will be at the ford on Tuesday — bring the tank quote.';
    const res = await postPreview(
      await request(`/api/visits/${id()}/sheet/send/preview`, org.advisor, { method: 'POST', body: { note } }),
      params({ id: id() }),
    );
    expect(res.status).toBe(200);
    const { preview } = await res.json();
    expect(preview.to).toBe(org.farmer.email);
    expect(preview.subject).toMatch(/^Your water sheet: /);
    expect(preview.text).toContain(note);
    expect(preview.text).toContain(`/sheets/${id()}`);
    expect(await sendsNow()).toBe(before);
    expect((await mailTo(org.farmer.email)).length).toBe(mailsBefore);
  });

  it('a note that is too long is a 422 naming the note', async () => {
    const res = await postPreview(
      await request(`/api/visits/${id()}/sheet/send/preview`, org.advisor, { method: 'POST', body: { note: 'x'.repeat(1001) } }),
      params({ id: id() }),
    );
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toMatch(/note/i);
  });

  it('the list shows who sent to whom and when, newest first', async () => {
    const res = await getSends(await request(`/api/visits/${id()}/sheet/sends`, org.coordinator), params({ id: id() }));
    const { sends } = await res.json();
    expect(sends.length).toBe(2);
    expect(sends[0].sentById).toBe(org.coordinator.id);
    expect(sends[1]).toMatchObject({ to: org.farmer.email, status: 'sent' });
  });

  it('farmers and unassigned advisors cannot send or see sends', async () => {
    const farmer = await postSend(await request(`/api/visits/${id()}/sheet/send`, org.farmer, { method: 'POST', body: {} }), params({ id: id() }));
    expect(farmer.status).toBe(403);
    const other = await postSend(await request(`/api/visits/${id()}/sheet/send`, org.otherAdvisor, { method: 'POST', body: {} }), params({ id: id() }));
    expect(other.status).toBe(404);
    expect((await getSends(await request(`/api/visits/${id()}/sheet/sends`, org.farmer), params({ id: id() }))).status).toBe(403);
  });

  it('sending moves a screened visit to "sent"', async () => {
    expect((await Visit.findByPk(id()))?.status).toBe('sent');
  });
});

describe('the farmer acknowledges or asks', () => {
  it('a question is recorded and the advisor and coordinator see it', async () => {
    const res = await postQuestion(
      await request(`/api/visits/${id()}/sheet/questions`, org.farmer, { method: 'POST', body: { text: 'Can the tank go by the barn instead?' } }),
      params({ id: id() }),
    );
    expect(res.status).toBe(201);
    for (const reader of [org.advisor, org.coordinator]) {
      const { responses } = await (await getQuestions(await request(`/api/visits/${id()}/sheet/questions`, reader), params({ id: id() }))).json();
      expect(responses.map((r: { text: string }) => r.text)).toContain('Can the tank go by the barn instead?');
    }
  });

  it('a write from another site is refused; the same host by its address (127.0.0.1) is not', async () => {
    const url = `/api/visits/${id()}/sheet/questions`;
    const body = { text: 'Is the pipe buried?' };
    const evil = await postQuestion(
      await request(url, org.farmer, { method: 'POST', body, headers: { origin: 'http://evil.example', host: '127.0.0.1:3100' } }),
      params({ id: id() }),
    );
    expect(evil.status).toBe(403);
    const same = await postQuestion(
      await request(url, org.farmer, { method: 'POST', body, headers: { origin: 'http://127.0.0.1:3100', host: '127.0.0.1:3100' } }),
      params({ id: id() }),
    );
    expect(same.status).toBe(201);
  });

  it('an empty question is a 422 saying what to do', async () => {
    const res = await postQuestion(
      await request(`/api/visits/${id()}/sheet/questions`, org.farmer, { method: 'POST', body: { text: ' ' } }),
      params({ id: id() }),
    );
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toMatch(/Write your question/);
  });

  it('only the owner may acknowledge; acknowledging moves the visit to "acknowledged"', async () => {
    const other = await postAck(await request(`/api/visits/${id()}/sheet/acknowledge`, org.otherFarmer, { method: 'POST' }), params({ id: id() }));
    expect(other.status).toBe(404);
    const advisor = await postAck(await request(`/api/visits/${id()}/sheet/acknowledge`, org.advisor, { method: 'POST' }), params({ id: id() }));
    expect(advisor.status).toBe(403);
    const res = await postAck(await request(`/api/visits/${id()}/sheet/acknowledge`, org.farmer, { method: 'POST' }), params({ id: id() }));
    expect(res.status).toBe(201);
    expect((await Visit.findByPk(id()))?.status).toBe('acknowledged');
    const audit = await AuditEntry.findOne({ where: { visitId: id(), action: 'sheet_acknowledged' } });
    expect(audit?.actorId).toBe(org.farmer.id);
  });
});
