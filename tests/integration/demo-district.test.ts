// The demo district `npm start` loads (already in the test database, as on a first start): enough
// farms, people and a season of visits in every state for the office to show what it is for.
import { Op } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { Commissioning, Farm, Screening, SheetResponse, SheetSend, User, Visit } from '@/lib/server/db';
import { buildDigests } from '@/lib/server/digest/daily-digest';
import { demoId } from '@/lib/server/demo/ids';
import { seedDemo } from '@/lib/server/demo/seed';
import { VISIT_STATUSES } from '@/lib/shared/domain';

const organisationId = demoId('org:wenlow');

describe('the demo district', () => {
  it('has about 40 farms, 4 advisors and visits in every state over a season', async () => {
    expect(await Farm.count({ where: { organisationId } })).toBeGreaterThanOrEqual(38);
    const advisors = await User.findAll({ where: { organisationId, role: 'advisor' }, attributes: ['name'] });
    expect(advisors).toHaveLength(4);
    const visits = await Visit.findAll({ where: { organisationId }, attributes: ['status', 'plannedOn'] });
    expect(new Set(visits.map((v) => v.status))).toEqual(new Set(VISIT_STATUSES));
    const days = visits.flatMap((v) => (v.plannedOn ? [Date.parse(v.plannedOn)] : []));
    expect((Math.max(...days) - Math.min(...days)) / 86_400_000).toBeGreaterThan(120);
  });

  it('has every verdict, sends (one failed), questions with and without answers, decisions and two commissioned rams', async () => {
    const visitIds = (await Visit.findAll({ where: { organisationId }, attributes: ['id'] })).map((v) => v.id);
    const screenings = await Screening.findAll({ where: { visitId: { [Op.in]: visitIds } }, attributes: ['verdict'] });
    expect(new Set(screenings.map((s) => s.verdict))).toEqual(new Set(['go', 'conditional', 'no-go', 'gravity']));
    const sends = await SheetSend.findAll({ where: { visitId: { [Op.in]: visitIds } }, attributes: ['status'] });
    expect(sends.filter((s) => s.status === 'sent').length).toBeGreaterThanOrEqual(10);
    expect(sends.filter((s) => s.status === 'failed')).toHaveLength(1);
    const responses = await SheetResponse.findAll({ where: { visitId: { [Op.in]: visitIds } }, attributes: ['kind', 'replyToId'] });
    const kinds = responses.map((r) => r.kind);
    for (const kind of ['acknowledged', 'go-ahead', 'not-now', 'question', 'answer'] as const) expect(kinds).toContain(kind);
    const answered = new Set(responses.flatMap((r) => (r.replyToId ? [r.replyToId] : [])));
    expect(kinds.filter((k) => k === 'question').length).toBeGreaterThan(answered.size);
    expect(await Commissioning.count({ where: { organisationId } })).toBe(2);
  });

  it("gives the coordinator's morning digest something in every list, and each advisor only their own", async () => {
    const digests = await buildDigests(organisationId);
    const maren = digests.find((d) => d.to.email === 'maren@wenlow-water.test');
    expect(maren?.counts.overdue).toBeGreaterThanOrEqual(4);
    expect(maren?.counts.questions).toBe(2);
    expect(maren?.counts.unread).toBeGreaterThanOrEqual(2);
    expect(maren?.counts.failed).toBe(1);
    const dilys = digests.find((d) => d.to.email === 'dilys@wenlow-water.test');
    expect(dilys?.text).toContain('Rowan Leys');
    expect(dilys?.text).not.toContain('Glanrhos');
  });

  it('is loaded once: a second seed changes nothing', async () => {
    const before = await Visit.count({ where: { organisationId } });
    expect(await seedDemo()).toBe('present');
    expect(await Visit.count({ where: { organisationId } })).toBe(before);
  });
});
