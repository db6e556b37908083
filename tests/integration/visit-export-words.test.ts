// The CSV export: verdict words (not codes), the latest screening's delivery, demand and margin,
// and units in the headers.
import { describe, expect, it } from 'vitest';
import { GET as getExport } from '@/app/api/visits/export.csv/route';
import { Screening } from '@/lib/server/db';
import { VERDICT_WORDS } from '@/lib/shared/sheet/view-model';
import type { Verdict } from '@/lib/shared/domain';
import { makeOrganisation, params, request } from './support/fixtures';
import { screenFixtureVisit } from './support/screened';

/** The cells of one CSV line (quoted cells may hold commas). */
const cells = (line: string) =>
  [...line.matchAll(/("([^"]|"")*"|[^,]*)(,|$)/g)]
    .map((m) => m[1] ?? '')
    .map((c) => c.replace(/^"|"$/g, '').replace(/""/g, '"'))
    .slice(0, -1);

describe('GET /api/visits/export.csv', () => {
  it('has units in the headers and a screened visit’s verdict word, delivery, demand and margin', async () => {
    const o = await makeOrganisation('export-words');
    await screenFixtureVisit(o.visit.id, o.farm.id, o.advisor.id);
    const s = await Screening.findOne({ where: { visitId: o.visit.id }, rejectOnEmpty: true });
    const res = await getExport(await request('/api/visits/export.csv?sort=farm&dir=asc', o.coordinator), params({}));
    expect(res.status).toBe(200);
    const lines = (await res.text())
      .replace(/^\uFEFF/, '')
      .trimEnd()
      .split('\r\n');
    expect(lines[0]).toBe(
      'Farm,Area,Farmer,Advisor,Planned (date),State,Overdue,Verdict,Delivery (L/day),Demand (L/day),Margin (L/day: delivery minus demand),Last synced (UTC),Visit id',
    );
    const screened = cells(lines.find((l) => l.endsWith(o.visit.id)) ?? '');
    expect(screened.slice(5, 11)).toEqual([
      'Screened',
      'no',
      VERDICT_WORDS[s.verdict as Verdict],
      String(Math.round(s.deliveryLpd ?? NaN)),
      String(Math.round(s.demandLpd ?? NaN)),
      String(Math.round((s.deliveryLpd ?? NaN) - (s.demandLpd ?? NaN))),
    ]);
    const unscreened = lines.find((l) => l.endsWith(o.otherVisit.id)) ?? '';
    expect(cells(unscreened).slice(7, 12)).toEqual(['not screened', '', '', '', 'never']);
    expect(lines.join('\n')).not.toMatch(/,(go|no-go|conditional),/);
  });
});
