// Sheet e-mails: a sender may send a limited number per hour (to the farmer or any address), and
// every send is in the visit's audit trail with its address.
import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { POST as postSend } from '@/app/api/visits/[id]/sheet/send/route';
import { AuditEntry, SheetSend } from '@/lib/server/db';
import { SHEET_SENDS_PER_HOUR } from '@/lib/server/sheets/send-limit';
import { makeOrganisation, params, request } from './support/fixtures';
import { mailTo } from './support/mailbox';
import { screenFixtureVisit } from './support/screened';

let o: Awaited<ReturnType<typeof makeOrganisation>>;
beforeAll(async () => {
  o = await makeOrganisation('send-limit');
  await screenFixtureVisit(o.visit.id, o.farm.id, o.advisor.id);
});

const send = async (to: string) =>
  postSend(await request(`/api/visits/${o.visit.id}/sheet/send`, o.advisor, { method: 'POST', body: { to } }), params({ id: o.visit.id }));

describe('sheet sends', () => {
  it('a send to any address is audited with that address', async () => {
    const to = `someone-${randomUUID().slice(0, 8)}@elsewhere.test`;
    expect((await send(to)).status).toBe(201);
    const lines = await AuditEntry.findAll({ where: { visitId: o.visit.id, action: 'sheet_sent' } });
    expect(lines.some((l) => JSON.stringify(l.changes).includes(to))).toBe(true);
  });

  it(`past ${SHEET_SENDS_PER_HOUR} sends in an hour the sender gets a 429 with a plain message, and nothing goes out`, async () => {
    const screeningId = (await SheetSend.findOne({ where: { visitId: o.visit.id }, rejectOnEmpty: true })).screeningId;
    for (let i = 0; i < SHEET_SENDS_PER_HOUR; i++) {
      await SheetSend.create({
        id: randomUUID(),
        visitId: o.visit.id,
        screeningId,
        sentById: o.advisor.id,
        toAddress: `x${i}@elsewhere.test`,
        paper: 'a4',
        status: 'sent',
        error: null,
        messageId: null,
      });
    }
    const to = `over-${randomUUID().slice(0, 8)}@elsewhere.test`;
    const res = await send(to);
    expect(res.status).toBe(429);
    expect((await res.json()).error.message).toMatch(/sheets in the last hour/);
    expect(await mailTo(to)).toHaveLength(0);
    expect(await SheetSend.count({ where: { toAddress: to } })).toBe(0);
  });
});
