// Keys a person sends meet lookup tables only as own keys: `constructor` or `__proto__` is not a
// demand kind. An organisation that already holds such a key still gets its screenings, and a
// visit that cannot be screened says why on the office's visit page (not silently "incomplete").
import { describe, expect, it } from 'vitest';
import { PUT as putSettings } from '@/app/api/organisation/settings/route';
import { screeningBlockers } from '@/lib/server/services/screening';
import { Organisation, Screening } from '@/lib/server/db';
import { defaultOrganisationSettings } from '@/lib/server/organisation-settings';
import { makeOrganisation, params, request } from './support/fixtures';
import { screenFixtureVisit } from './support/screened';

const settingsBody = (demandFigures: Record<string, number>) => ({ unitsDefault: 'metric', designFractionOfLowest: 0.5, demandFigures, pipePrices: [] });

describe('prototype keys', () => {
  it.each(['constructor', 'toString', 'hasOwnProperty', '__proto__'])(
    'settings demandFigures {"%s": 3} is refused with a 422 naming it; nothing stored',
    async (key) => {
      const o = await makeOrganisation('proto-settings');
      const body = JSON.parse(`{"unitsDefault":"metric","designFractionOfLowest":0.5,"pipePrices":[],"demandFigures":{${JSON.stringify(key)}:3}}`);
      const res = await putSettings(await request('/api/organisation/settings', o.coordinator, { method: 'PUT', body }), params({}));
      expect(res.status).toBe(422);
      expect(JSON.stringify((await res.json()).error)).toContain(key);
      expect((await Organisation.findByPk(o.organisationId, { rejectOnEmpty: true })).settings.demandFigures).toEqual({});
    },
  );

  it('a real demand kind is still accepted', async () => {
    const o = await makeOrganisation('proto-ok');
    const res = await putSettings(await request('/api/organisation/settings', o.coordinator, { method: 'PUT', body: settingsBody({ goat: 8 }) }), params({}));
    expect(res.status).toBe(200);
  });

  it('an organisation that already stored {"constructor": 3} still gets its visits screened', async () => {
    const o = await makeOrganisation('proto-stored');
    await Organisation.update(
      { settings: { ...defaultOrganisationSettings(), demandFigures: { constructor: 3, goat: 8 } } },
      { where: { id: o.organisationId } },
    );
    await screenFixtureVisit(o.visit.id, o.farm.id, o.advisor.id);
    expect(await Screening.count({ where: { visitId: o.visit.id } })).toBe(1);
  });

  it('a visit that cannot be screened yet lists why, in plain words (no field paths)', async () => {
    const o = await makeOrganisation('proto-blockers');
    const blockers = await screeningBlockers(o.visit.id);
    expect(blockers.length).toBeGreaterThan(0);
    for (const b of blockers) expect(b).not.toMatch(/\.\d+\.|^\w+\.\w+:/);
  });
});
