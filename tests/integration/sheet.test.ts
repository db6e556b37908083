import { beforeAll, describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { GET as getSheet } from '@/app/api/visits/[id]/sheet/route';
import { GET as getPdf } from '@/app/api/visits/[id]/sheet/pdf/route';
import { showQuantity } from '@/lib/shared/display/quantities';
import { Screening, User, Visit, getSequelize } from '@/lib/server/db';
import { makeOrganisation, params, request, type TestUser } from './support/fixtures';
import { screenFixtureVisit } from './support/screened';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let org: Org;
let otherOrg: Org;
let stored: { deliveryLpd: number; demandLpd: number; verdict: string };

beforeAll(async () => {
  org = await makeOrganisation('sheet');
  otherOrg = await makeOrganisation('sheet-other');
  await screenFixtureVisit(org.visit.id, org.farm.id, org.advisor.id);
  // Sent, as the farmer reads a sheet only then (sheet-conversation.test.ts checks the 404 before).
  await getSequelize().transaction(async (transaction) => {
    await (await Visit.findByPk(org.visit.id, { transaction, rejectOnEmpty: true })).update({ status: 'sent' }, { transaction });
  });
  const row = await Screening.findOne({ where: { visitId: org.visit.id }, order: [['createdAt', 'DESC']] });
  stored = { deliveryLpd: row?.deliveryLpd ?? NaN, demandLpd: row?.demandLpd ?? NaN, verdict: row?.verdict ?? '' };
});

const sheetAs = async (user: TestUser | undefined, visitId = org.visit.id) =>
  getSheet(await request(`/api/visits/${visitId}/sheet`, user), params({ id: visitId }));

describe('GET /api/visits/:id/sheet as each role', () => {
  it('the farm owner reads their sheet, with the stored verdict and figures', async () => {
    const res = await sheetAs(org.farmer);
    expect(res.status).toBe(200);
    const { sheet } = await res.json();
    expect(sheet.verdict).toBe(stored.verdict);
    expect(sheet.summary[0]).toMatch(/^This site can deliver [\d,]+ litres a day/);
    expect(sheet.figures.find((f: { key: string }) => f.key === 'deliveryLpd').value).toBe(showQuantity(stored.deliveryLpd, 'litresPerDay', 'metric'));
  });

  it('the assigned advisor and the coordinator read it too', async () => {
    expect((await sheetAs(org.advisor)).status).toBe(200);
    expect((await sheetAs(org.coordinator)).status).toBe(200);
  });

  it('another farmer, an unassigned advisor and another organisation get 404 (as if there were no sheet)', async () => {
    expect((await sheetAs(org.otherFarmer)).status).toBe(404);
    expect((await sheetAs(org.otherAdvisor)).status).toBe(404);
    expect((await sheetAs(otherOrg.coordinator)).status).toBe(404);
    expect((await sheetAs(otherOrg.farmer)).status).toBe(404);
  });

  it('signed out is 401; an unknown visit is 404; a visit not yet screened is 404 saying so', async () => {
    expect((await sheetAs(undefined)).status).toBe(401);
    expect((await sheetAs(org.coordinator, crypto.randomUUID())).status).toBe(404);
    const res = await sheetAs(org.coordinator, org.otherVisit.id);
    expect(res.status).toBe(404);
    expect((await res.json()).error.message).toMatch(/not been screened/);
  });

  it('a US reader gets feet and gallons', async () => {
    await User.update({ units: 'us' }, { where: { id: org.coordinator.id } });
    try {
      const { sheet } = await (await sheetAs(org.coordinator)).json();
      expect(sheet.figures.find((f: { key: string }) => f.key === 'fallM').value).toMatch(/ ft$/);
      expect(sheet.figures.find((f: { key: string }) => f.key === 'deliveryLpd').value).toMatch(/ gal\/day$/);
    } finally {
      await User.update({ units: 'metric' }, { where: { id: org.coordinator.id } });
    }
  });
});

describe('GET /api/visits/:id/sheet/pdf', () => {
  const pdfText = async (res: Response) => {
    const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
    try {
      return (await parser.getText()).text;
    } finally {
      await parser.destroy();
    }
  };

  it('returns a PDF whose text has the verdict, delivery and demand and the cautions', async () => {
    const res = await getPdf(await request(`/api/visits/${org.visit.id}/sheet/pdf?paper=a4`, org.farmer), params({ id: org.visit.id }));
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const text = (await pdfText(res)).replace(/\s+/g, ' ');
    const word = { go: 'Go', conditional: 'Go, with conditions', 'no-go': 'No-go' }[stored.verdict] ?? '?';
    expect(text).toContain(word);
    expect(text).toContain(showQuantity(stored.deliveryLpd, 'litresPerDay', 'metric'));
    expect(text).toContain(showQuantity(stored.demandLpd, 'litresPerDay', 'metric'));
    for (const caution of ['Pressure surges and pipe rating', 'Floods, working in water, frost', 'Water rights and permits', 'Drinking water', 'licensed']) {
      expect(text).toContain(caution);
    }
  });

  it('is A4 or US Letter as asked, and refuses other paper with a 422', async () => {
    const size = async (paper: string) => {
      const res = await getPdf(await request(`/api/visits/${org.visit.id}/sheet/pdf?paper=${paper}`, org.advisor), params({ id: org.visit.id }));
      return (
        Buffer.from(await res.arrayBuffer())
          .toString('latin1')
          .match(/\/MediaBox \[0 0 ([\d.]+) ([\d.]+)\]/) ?? []
      )
        .slice(1)
        .map(Number);
    };
    expect((await size('a4')).map(Math.round)).toEqual([595, 842]);
    expect(await size('letter')).toEqual([612, 792]);
    const bad = await getPdf(await request(`/api/visits/${org.visit.id}/sheet/pdf?paper=a3`, org.advisor), params({ id: org.visit.id }));
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.message).toMatch(/a4 or letter/);
  });

  it('links the sources that have an address to their documents, the same ones the page links, and no others', async () => {
    const { sheet } = await (await sheetAs(org.farmer)).json();
    const sources: { citation: string; url: string | null }[] = sheet.sources;
    const linked = sources.flatMap((s) => (s.url ? [s.url] : []));
    expect(linked.length).toBeGreaterThan(0);
    expect(sources.some((s) => s.url === null)).toBe(true);
    const res = await getPdf(await request(`/api/visits/${org.visit.id}/sheet/pdf?paper=letter`, org.farmer), params({ id: org.visit.id }));
    const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
    try {
      const links = (await parser.getInfo({ parsePageInfo: true })).pages.flatMap((p) => p.links);
      expect([...new Set(links.map((l) => l.url))].sort()).toEqual([...new Set(linked)].sort());
    } finally {
      await parser.destroy();
    }
  });

  it('another farmer cannot download it', async () => {
    const res = await getPdf(await request(`/api/visits/${org.visit.id}/sheet/pdf`, org.otherFarmer), params({ id: org.visit.id }));
    expect(res.status).toBe(404);
  });
});
