import { describe, expect, it } from 'vitest';
import type { BillOfMaterialsLine } from '@/lib/engine/screening-types';
import { priceBill } from '@/lib/shared/costs/bill-prices';
import { sheetCosts } from '@/lib/shared/costs/cost-view';
import { DEFAULT_PRICE_LIST, priceListSchema } from '@/lib/shared/costs/price-list';
import { repurchases, tenYearComparison } from '@/lib/shared/costs/ten-year';

// A hand-checked example on the default price list (GBP), one 2″ ram, 24 m of steel drive pipe, 420 m of 32 mm HDPE
// delivery priced from the pipe list at £1.50 a metre, a 5,000 L tank.
const bill: BillOfMaterialsLine[] = [
  { item: 'Hydraulic ram', size: 'for 2″', quantity: 1, unit: 'each', note: '', priceKey: 'ram', driveIn: 2 },
  { item: 'Drive pipe', size: '2″', quantity: 24, unit: 'm', note: '', priceKey: 'pipe', pipe: { material: 'galvanized-steel', boreMm: 52.5 } },
  { item: 'Delivery pipe', size: '1″', quantity: 420, unit: 'm', note: '', priceKey: 'pipe', pipe: { material: 'hdpe', boreMm: 32 }, shared: true },
  { item: 'Valve on the drive pipe', size: '2″', quantity: 1, unit: 'each', note: '', priceKey: 'valve' },
  { item: 'Valve on the delivery', size: '1″', quantity: 1, unit: 'each', note: '', priceKey: 'valve', shared: true },
  { item: 'Air vessel', size: '10 L', quantity: 1, unit: 'each', note: '', priceKey: 'with-ram' },
  { item: 'Storage tank', size: '5000 L', quantity: 1, unit: 'each', note: '', priceKey: 'tank', litres: 5000, shared: true },
  { item: 'Intake screen', size: '—', quantity: 1, unit: 'each', note: '', priceKey: 'intake', shared: true },
  { item: 'Something old', size: '—', quantity: 2, unit: 'each', note: '' },
];
const pipes = [
  { material: 'HDPE', diameterMm: 32, pricePerM: 1.5, currency: 'GBP' },
  { material: 'HDPE', diameterMm: 32, pricePerM: 9, currency: 'EUR' },
];

describe('priceBill (hand-checked)', () => {
  const p = priceBill(bill, DEFAULT_PRICE_LIST, pipes);
  it('prices each line by its basis', () => {
    expect(p.lines.map((l) => Math.round(l.total * 100) / 100)).toEqual([600, 441, 630, 35, 35, 0, 1000, 60, 0]);
    expect(p.lines[1]?.basis).toEqual({ kind: 'pipe-estimate', perM: 18.375, perMmM: 0.35, boreMm: 52.5, steel: true });
    expect(p.lines[2]?.basis).toEqual({ kind: 'pipe-list', perM: 1.5, diameterMm: 32 });
    expect(p.lines[8]?.basis.kind).toBe('not-priced');
  });
  it('fittings 10 % of the pipe (£107.10), labour 1 day + 444 m at 150 m a day (3.96 days, £633.60), total £3,541.70', () => {
    expect(p.fittings).toBeCloseTo(107.1, 6);
    expect(p.labour.days).toBeCloseTo(3.96, 6);
    expect(p.labour.cost).toBeCloseTo(633.6, 6);
    expect(p.total).toBeCloseTo(3541.7, 6);
  });
  it('the shared part: pipe £630 + valve £35 + tank £1,000 + intake £60 + fittings £63 + 420 m of laying £448 = £2,236', () => {
    expect(p.sharedTotal).toBeCloseTo(2236, 6);
  });
});

describe('tenYearComparison (hand-checked)', () => {
  const c = tenYearComparison(priceBill(bill, DEFAULT_PRICE_LIST, pipes), DEFAULT_PRICE_LIST, 2000, 30);
  it('solar panels: 9.80665 × 30 m × 2,000 L / 3600 = 163.44 Wh a day over 3 h × 0.35 = 155.7 W', () => {
    expect(c.panelW).toBeCloseTo(155.66, 2);
  });
  it('ram £3,841.70; solar £4,336.10; petrol £5,560.25', () => {
    const [ram, solar, petrol] = c.options;
    expect(ram).toMatchObject({ option: 'ram', replacements: 0, running: 300 });
    expect(ram?.total).toBeCloseTo(3841.7, 6);
    expect(solar?.capital).toBeCloseTo(2236 + 160 + 700 + 155.6633 * 0.9, 2);
    expect(solar?.replacements).toBe(700);
    expect(solar?.total).toBeCloseTo(4336.1, 1);
    // 2,000 L / 60 L a minute = 0.556 h a day × 0.6 L/h × 365 = 121.67 L a year at £1.45.
    expect(c.petrolLitresPerYear).toBeCloseTo(121.667, 2);
    expect(petrol?.running).toBeCloseTo(10 * (80 + 121.6667 * 1.45), 2);
    expect(petrol?.total).toBeCloseTo(2696 + 300 + 2564.17, 1);
  });
  it('repurchases: a 5-year life buys once more in ten years, 8 once, 10 and 25 never', () => {
    expect([5, 8, 10, 25, 3].map((y) => repurchases(y))).toEqual([1, 1, 0, 0, 3]);
  });
});

describe('sheetCosts', () => {
  it('money in the organisation\u2019s currency, with the basis in words and the assumptions shown', () => {
    const v = sheetCosts(bill, DEFAULT_PRICE_LIST, pipes, { dailyL: 2000, liftM: 30, pumped: true });
    expect(v.total).toBe('£3,542');
    expect(v.lines[1]).toEqual({ basis: '£18.38 a metre (estimate from the bore, steel)', price: '£441' });
    expect(v.lines[2]?.basis).toBe('£1.50 a metre (your pipe prices, 32 mm)');
    // A US reader buys pipe by the foot: £18.375 × 0.3048 = £5.60.
    expect(sheetCosts(bill, DEFAULT_PRICE_LIST, pipes, { dailyL: 2000, liftM: 30, pumped: true }, 'en-US').lines[1]?.basis).toBe(
      '£5.60 a foot (estimate from the bore, steel)',
    );
    expect(v.lines[5]?.basis).toBe('Comes with a bought ram');
    expect(v.comparison?.map((o) => o.total)).toEqual(['£3,842', '£4,336', '£5,560']);
    expect(v.assumptions.join(' ')).toMatch(/156 W of panels/);
    const kes = sheetCosts(bill, { ...DEFAULT_PRICE_LIST, currency: 'KES' }, [], { dailyL: 2000, liftM: 30, pumped: true });
    expect(kes.total).toMatch(/^KES\s/);
  });
  it('no comparison for a gravity supply', () => {
    expect(sheetCosts(bill, DEFAULT_PRICE_LIST, pipes, { dailyL: 2000, liftM: 30, pumped: false }).comparison).toBeNull();
  });
  it('the price list refuses a made-up currency and a negative price with a plain message', () => {
    const bad = priceListSchema.safeParse({ ...DEFAULT_PRICE_LIST, currency: 'XQZ', valve: -3 });
    expect(bad.success).toBe(false);
    const messages = bad.success ? [] : bad.error.issues.map((i) => i.message);
    expect(messages).toContain('Not a currency code this app knows.');
    expect(priceListSchema.safeParse({ ...DEFAULT_PRICE_LIST, currency: 'pounds' }).error?.issues[0]?.message).toBe(
      'Give a three-letter currency code such as GBP, EUR, USD or KES.',
    );
    expect(messages).toContain('Valve price: at least 0.');
  });
});
