import { describe, expect, it } from 'vitest';
import { buildSheetView, chance, needPhrase, summarySentences } from '@/lib/shared/sheet/view-model';
import { dailyInWords, quantity, roughly } from '@/lib/shared/display/quantities';
import { plainTrade } from '@/lib/shared/sheet/trade-words';
import { SOURCES, type SourceId } from '@/lib/engine/sources';
import { brandtLikeSource, gravitySource } from './fixture';

const source = brandtLikeSource();
const figure = (key: 'deliveryLpd' | 'demandLpd' | 'fallM') => source.screening.figures[key]?.value ?? NaN;
const digits = (text: string) => Number(text.replace(/[^\d.]/g, ''));

describe('rounding for the summary', () => {
  it('keeps two significant figures', () => {
    expect(roughly(2284)).toBe(2300);
    expect(roughly(1890)).toBe(1900);
    expect(roughly(456)).toBe(460);
    expect(roughly(95)).toBe(95);
  });

  it("says the daily figures in words with the key figure's own number, gallons for US readers", () => {
    expect(dailyInWords(2284.4, 'metric')).toBe(`${quantity(2284.4, 'litresPerDay', 'metric').number} litres`);
    expect(dailyInWords(2284.4, 'metric')).toBe('2,280 litres');
    expect(dailyInWords(3.785411784 * 612, 'us')).toBe('612 gallons');
  });

  it('words a chance as a likelihood with how often it held, never a promise', () => {
    expect(chance(1)).toBe('Very likely (about 99 in 100)');
    expect(chance(0)).toBe('Very unlikely (about 1 in 100)');
    expect(chance(0.874)).toBe('Likely (about 87 in 100)');
    expect(chance(0.6)).toMatch(/^Uncertain/);
    expect(chance(0.999)).not.toMatch(/%|over|certain(?!ty)/i);
  });
});

describe('the two-sentence summary', () => {
  it('names delivery and demand, rounded from the engine figures, and the tank point', () => {
    const [first, second] = summarySentences(source, 'metric');
    const match = first.match(/deliver ([\d,]+) litres a day to the tank \(meadow bench\); your household and animals need ([\d,]+) litres\./);
    expect(match, first).not.toBeNull();
    // One rounding per figure: the summary says the very numbers of the key figures.
    const view = buildSheetView(source, 'metric');
    const shown = (key: string) => view.figures.find((f) => f.key === key)?.value;
    expect(`${match?.[1]} L/day`).toBe(shown('deliveryLpd'));
    expect(`${match?.[2]} L/day`).toBe(shown('demandLpd'));
    expect(second).toMatch(/ram pump/);
  });

  it('speaks of gallons in US units', () => {
    const [first] = summarySentences(source, 'us');
    expect(first).toMatch(/deliver [\d,]+ gallons a day/);
    expect(first).not.toMatch(/litres/);
  });

  it('says who the water is for', () => {
    expect(needPhrase(['person-basic'])).toBe('your household need');
    expect(needPhrase(['goat', 'person-tap-on-plot', 'garden-m2'])).toBe('your household, animals and garden need');
  });
});

describe('the sheet view', () => {
  it('shows metric figures with units for a metric reader', () => {
    const view = buildSheetView(source, 'metric');
    const byKey = Object.fromEntries(view.figures.map((f) => [f.key, f.value]));
    expect(byKey.fallM).toBe(quantity(figure('fallM'), 'length', 'metric').text);
    expect(byKey.fallM).toMatch(/ m$/);
    expect(byKey.deliveryLpd).toMatch(/ L\/day$/);
    expect(view.figures.map((f) => f.key)).toEqual(
      expect.arrayContaining(['fallM', 'designFlowLpm', 'totalLiftM', 'liftRatio', 'deliveryLpd', 'demandLpd', 'demandMarginLpd', 'probabilityMeetsDemand']),
    );
  });

  it('shows ft and gal/day for a US reader, converted from the same figures', () => {
    const view = buildSheetView(source, 'us');
    const byKey = Object.fromEntries(view.figures.map((f) => [f.key, f.value]));
    expect(byKey.fallM).toMatch(/ ft$/);
    expect(digits(byKey.fallM ?? '')).toBeCloseTo(figure('fallM') / 0.3048, 1);
    expect(byKey.deliveryLpd).toBe(quantity(figure('deliveryLpd'), 'litresPerDay', 'us').text);
    expect(byKey.deliveryLpd).toMatch(/gal\/day$/);
    expect(view.billOfMaterials.find((l) => l.item.startsWith('Drive pipe'))?.quantity).toMatch(/ ft$/);
  });

  it('carries every caution with a title, and the safety ones are there', () => {
    const view = buildSheetView(source, 'metric');
    expect(view.cautions.map((c) => c.code)).toEqual(
      expect.arrayContaining(['NOT_A_DESIGN', 'SURGE_PRESSURE', 'WORKING_IN_WATER', 'PERMITS', 'UNTREATED_WATER']),
    );
    expect(view.cautions.every((c) => c.title.length > 0 && c.text.length > 0)).toBe(true);
    expect(view.surveyed).toContain('Tobias Test');
    expect(view.sources.length).toBeGreaterThan(3);
  });
});

describe('the engine sentences follow the reader units', () => {
  it('a US reader sees no metric quantity in the cautions, reasons or conditions', () => {
    const view = buildSheetView(source, 'us');
    const texts = [...view.reasons, ...view.conditions, ...view.cautions.map((c) => c.text)].join(' ');
    expect(texts).not.toMatch(/\d (m|L\/day|L\/min|kPa|mm)\b/);
    expect(texts).toMatch(/\d (ft|gal\/day|psi)\b/);
  });
  it('a metric reader sees the engine sentences as written', () => {
    const view = buildSheetView(source, 'metric');
    expect(view.cautions.map((c) => c.text)).toEqual(source.screening.cautions.map((c) => c.text));
  });
});

describe('the new figures and outcomes on the sheet', () => {
  it('shows the pressure in normal running and if the delivery is blocked, never lift + surge as one figure', () => {
    const view = buildSheetView(source, 'metric');
    const labels = view.figures.map((f) => f.label);
    expect(labels).toContain('Pressure at the ram in normal running');
    expect(labels).toContain('Pressure at the ram if the delivery is blocked');
    expect(labels).not.toContain('Pressure at the ram');
  });

  it('a gravity site reads "No pump needed", with no ram in its summary or bill', () => {
    const view = buildSheetView(gravitySource(), 'metric');
    expect(view.verdict).toBe('gravity');
    expect(view.verdictWord).toBe('No pump needed');
    expect(view.summary[1]).toMatch(/no pump is needed/);
    expect(view.billOfMaterials.map((b) => b.item).join(' ')).not.toMatch(/ram/i);
    expect(view.figures.map((f) => f.key)).toContain('gravityHeadM');
  });
});

describe('figures said plainly', () => {
  it('a metric sheet leads with DN and kPa, explains Schedule 40, and shows no bare psi or inch size', () => {
    expect(plainTrade('Galvanized steel, Schedule 40, class 150 fittings (300 psi)', 'metric')).toBe(
      'Galvanized steel, Schedule 40 (standard-wall steel), class 150 fittings (2,070 kPa, 300 psi)',
    );
    expect(plainTrade('for 1¼″ (32 mm) drive pipe', 'metric')).toBe('for DN 32 (1¼″) drive pipe');
    expect(plainTrade('PE SDR 17 (125 psi)', 'metric')).toBe('PE SDR 17 (862 kPa, 125 psi)');
    const view = buildSheetView(source, 'metric');
    const bill = view.billOfMaterials.map((b) => `${b.item} ${b.size} ${b.note}`).join('\n');
    expect(bill).not.toMatch(/″ \(\d+ mm\)/);
    for (const line of bill.split('\n').filter((l) => l.includes('psi'))) expect(line).toMatch(/kPa, \d+ psi/);
  });

  it('one rounding per figure: the pressures read the same in the key figures and in the cautions', () => {
    const view = buildSheetView(source, 'metric');
    const surge = view.cautions.find((c) => c.code === 'SURGE_PRESSURE')?.text ?? '';
    for (const key of ['workingPeakHeadM', 'blockedDeliveryHeadM']) {
      const shown = view.figures.find((f) => f.key === key)?.value ?? '?';
      expect(surge, key).toContain(shown);
    }
  });

  it('a US sheet gives inch sizes as sold, without decimal inches', () => {
    const view = buildSheetView(source, 'us');
    const text = [...view.billOfMaterials.map((b) => `${b.item} ${b.size} ${b.note}`), ...view.cautions.map((c) => c.text)].join('\n');
    expect(text).not.toMatch(/″ \([\d.]+ (mm|in)\)/);
  });

  it('"How we worked this out" names sources in words, never by their ids', () => {
    const view = buildSheetView(source, 'metric');
    expect(view.sources.length).toBeGreaterThan(5);
    for (const s of view.sources) expect(s.citation).not.toMatch(/^[a-z0-9]+(-[a-z0-9]+)+$/);
    expect(new Set(view.sources.map((s) => s.citation)).size).toBe(view.sources.length);
  });

  it("gives each source the registry's address where it has one, and none where it has not", () => {
    const view = buildSheetView(source, 'metric');
    for (const s of view.sources) expect(s.url, s.id).toBe(SOURCES[s.id as SourceId].url ?? null);
    expect(view.sources.some((s) => s.url !== null)).toBe(true);
    expect(view.sources.some((s) => s.url === null)).toBe(true);
  });

  it('links the sources of a sheet screened before the registry had addresses (stored without them)', () => {
    const old = brandtLikeSource();
    old.screening = { ...old.screening, sources: [{ id: 'iversen-1975', citation: 'Iversen (1975)', confidence: 'found' }] };
    expect(buildSheetView(old, 'metric').sources).toEqual([{ id: 'iversen-1975', citation: 'Iversen (1975)', url: SOURCES['iversen-1975'].url }]);
  });
});

describe('buildSheetView costs', () => {
  it('prices a current screening and shows no costs for one made before lines were priced', () => {
    const priced = buildSheetView(brandtLikeSource(), 'metric');
    expect(priced.costs?.total).toMatch(/^£[\d,]+$/);
    expect(priced.billOfMaterials[0]?.price).toMatch(/^£[\d,]+$/);
    const old = brandtLikeSource();
    old.screening = {
      ...old.screening,
      billOfMaterials: old.screening.billOfMaterials.map(({ priceKey: _k, pipe: _p, driveIn: _d, litres: _l, shared: _s, ...line }) => line),
    };
    const view = buildSheetView(old, 'metric');
    expect(view.costs).toBeNull();
    expect(view.billOfMaterials.every((line) => line.price === '—')).toBe(true);
  });
  it('uses the organisation\u2019s currency and pipe prices', () => {
    const s = brandtLikeSource();
    s.prices = { list: { currency: 'EUR' }, pipes: [] };
    expect(buildSheetView(s, 'metric').costs?.total).toMatch(/^€[\d,]+$/);
  });
});
