// Saving the organisation's settings: blank per-head boxes mean the catalogue figure; only kinds
// the catalogue itself holds are accepted (not names every object inherits).
import { describe, expect, it } from 'vitest';
import { GET, PUT } from '@/app/api/organisation/settings/route';
import { Organisation } from '@/lib/server/db';
import { makeOrganisation, params, request } from './support/fixtures';

const body = (demandFigures: Record<string, unknown>) => ({ unitsDefault: 'us', designFractionOfLowest: '0.6', demandFigures, pipePrices: [] });

describe('PUT /api/organisation/settings', () => {
  it('saves with blank per-head boxes and keeps only the figures typed', async () => {
    const o = await makeOrganisation('settings');
    const res = await PUT(
      await request('/api/organisation/settings', o.coordinator, { method: 'PUT', body: body({ sheep: '', goat: '', 'dairy-cow-dry': '80' }) }),
      params({}),
    );
    expect(res.status).toBe(200);
    const org = await Organisation.findByPk(o.organisationId, { rejectOnEmpty: true });
    expect(org.settings.unitsDefault).toBe('us');
    expect(org.settings.demandFigures).toEqual({ 'dairy-cow-dry': 80 });
    const read = await (await GET(await request('/api/organisation/settings', o.coordinator), params({}))).json();
    expect(read.settings.designFractionOfLowest).toBe(0.6);
  });

  it.each(['constructor', 'toString', '__proto__', 'hasOwnProperty'])('refuses the inherited name %s as a kind and changes nothing', async (kind) => {
    const o = await makeOrganisation('settings-proto');
    const res = await PUT(await request('/api/organisation/settings', o.coordinator, { method: 'PUT', body: body({ [kind]: '5' }) }), params({}));
    expect(res.status).toBe(422);
    const json = await res.json();
    // __proto__ is stopped at the JSON boundary itself; the others by the schema's catalogue check. Both name the box.
    const expected = kind === '__proto__' ? 'This name is not allowed here.' : 'Not a demand kind the screen knows.';
    expect(json.error.fieldErrors[`demandFigures.${kind}`]).toContain(expected);
    const org = await Organisation.findByPk(o.organisationId, { rejectOnEmpty: true });
    expect(org.settings.unitsDefault).toBe('metric');
  });
});

describe('PUT /api/organisation/settings: the price list', () => {
  it('reads the invented defaults before anything is saved, saves typed prices, and keeps them when a later save leaves the list out', async () => {
    const o = await makeOrganisation('settings-prices');
    const first = await (await GET(await request('/api/organisation/settings', o.coordinator), params({}))).json();
    expect(first.settings.priceList.currency).toBe('GBP');
    expect(first.settings.priceList.ramPerInch).toBe(300);
    const priceList = { ...first.settings.priceList, currency: 'kes', ramPerInch: '21000', fuelPricePerL: '180,5' };
    const res = await PUT(await request('/api/organisation/settings', o.coordinator, { method: 'PUT', body: { ...body({}), priceList } }), params({}));
    expect(res.status).toBe(200);
    const org = await Organisation.findByPk(o.organisationId, { rejectOnEmpty: true });
    expect(org.settings.priceList).toMatchObject({ currency: 'KES', ramPerInch: 21000, fuelPricePerL: 180.5 });
    await PUT(await request('/api/organisation/settings', o.coordinator, { method: 'PUT', body: body({}) }), params({}));
    const read = await (await GET(await request('/api/organisation/settings', o.coordinator), params({}))).json();
    expect(read.settings.priceList).toMatchObject({ currency: 'KES', ramPerInch: 21000 });
  });

  it('refuses an unknown currency and a negative price, naming the box, and changes nothing', async () => {
    const o = await makeOrganisation('settings-prices-bad');
    const first = await (await GET(await request('/api/organisation/settings', o.coordinator), params({}))).json();
    const priceList = { ...first.settings.priceList, currency: 'XQZ', valve: '-5' };
    const res = await PUT(await request('/api/organisation/settings', o.coordinator, { method: 'PUT', body: { ...body({}), priceList } }), params({}));
    expect(res.status).toBe(422);
    const json = await res.json();
    expect(json.error.fieldErrors['priceList.currency']).toContain('Not a currency code this app knows.');
    expect(json.error.fieldErrors['priceList.valve']).toContain('Valve price: at least 0.');
    const org = await Organisation.findByPk(o.organisationId, { rejectOnEmpty: true });
    expect(org.settings.priceList?.currency ?? 'GBP').toBe('GBP');
  });
});
