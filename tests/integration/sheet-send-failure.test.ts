import { beforeAll, describe, expect, it, vi } from 'vitest';
import { makeOrganisation, params, request } from './support/fixtures';
import { mailTo } from './support/mailbox';
import { screenFixtureVisit } from './support/screened';

// The mail server refuses the first message (as a relay that is down would), then takes the retry.
vi.mock('@/lib/server/mail/transport', async (importOriginal) => {
  const actual = await importOriginal<typeof import('@/lib/server/mail/transport')>();
  let refused = false;
  return {
    ...actual,
    sendMail: vi.fn(async (mail: Parameters<typeof actual.sendMail>[0]) => {
      if (!refused) {
        refused = true;
        throw new Error('Connection refused by the relay');
      }
      return actual.sendMail(mail);
    }),
  };
});

const { POST: postSend } = await import('@/app/api/visits/[id]/sheet/send/route');
const { GET: getSends } = await import('@/app/api/visits/[id]/sheet/sends/route');

let org: Awaited<ReturnType<typeof makeOrganisation>>;
beforeAll(async () => {
  org = await makeOrganisation('sendfail');
  await screenFixtureVisit(org.visit.id, org.farm.id, org.advisor.id);
});

describe('a failed send', () => {
  it('is answered 502 with a plain message (never the mail server’s own words), recorded as failed, and a retry goes through', async () => {
    const id = org.visit.id;
    const first = await postSend(await request(`/api/visits/${id}/sheet/send`, org.advisor, { method: 'POST', body: {} }), params({ id }));
    expect(first.status).toBe(502);
    const failed = await first.json();
    expect(failed.error.message).toMatch(/did not take the message/);
    expect(JSON.stringify(failed)).not.toMatch(/Connection refused|relay/);
    expect(failed.send.status).toBe('failed');
    expect(await mailTo(org.farmer.email)).toHaveLength(0);

    const listed = (await (await getSends(await request(`/api/visits/${id}/sheet/sends`, org.advisor), params({ id }))).json()).sends;
    expect(listed[0]).toMatchObject({ status: 'failed', to: org.farmer.email });

    const retry = await postSend(await request(`/api/visits/${id}/sheet/send`, org.advisor, { method: 'POST', body: { to: failed.send.to } }), params({ id }));
    expect(retry.status).toBe(201);
    expect(await mailTo(org.farmer.email)).toHaveLength(1);
  });
});
