import { describe, expect, it } from 'vitest';
import { buildSheetView, chance, needPhrase, summarySentences } from '@/lib/shared/sheet/view-model';
import { aboutDaily, length, perDay, roughly } from '@/lib/shared/sheet/quantities';
import { screenSite } from '@/lib/engine';
import { siteReadingsSchema } from '@/lib/shared/schemas/site-readings';
import { brandtLikeSource } from './fixture';

const source = brandtLikeSource();
const figure = (key: 'deliveryLpd' | 'demandLpd' | 'fallM') => source.screening.figures[key]?.value ?? NaN;
const digits = (text: string) => Number(text.replace(/[^\d.]/g, ''));

describe('rounding for the summary', () => {
  it('keeps two significant figures', () => {
    expect(roughly(2284)).toBe(2300);
    expect(roughly(1890)).toBe(1900);
    expect(roughly(456)).toBe(460);
    expect(roughly(95)).toBe(95);
    expect(aboutDaily(2284, 'metric')).toBe('about 2,300 litres');
  });

  it('says gallons for US readers (1 US gal = 3.785411784 L)', () => {
    expect(aboutDaily(3.785411784 * 2, 'us')).toBe('about 2 gallons');
    expect(aboutDaily(3.785411784 * 612, 'us')).toBe('about 610 gallons');
  });

  it('never shows a flat 100 % or 0 % chance', () => {
    expect(chance(1)).toBe('over 99 %');
    expect(chance(0)).toBe('under 1 %');
    expect(chance(0.874)).toBe('87 %');
  });
});

describe('the two-sentence summary', () => {
  it('names delivery and demand, rounded from the engine figures, and the tank point', () => {
    const [first, second] = summarySentences(source, 'metric');
    const match = first.match(/deliver about ([\d,]+) litres a day to the tank \(meadow bench\); your household and animals need about ([\d,]+)\./);
    expect(match, first).not.toBeNull();
    expect(digits(match?.[1] ?? '')).toBe(roughly(figure('deliveryLpd')));
    expect(digits(match?.[2] ?? '')).toBe(roughly(figure('demandLpd')));
    expect(second).toMatch(/ram pump/);
  });

  it('speaks of gallons in US units', () => {
    const [first] = summarySentences(source, 'us');
    expect(first).toMatch(/about [\d,]+ gallons a day/);
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
    expect(byKey.fallM).toBe(length(figure('fallM'), 'metric').text);
    expect(byKey.fallM).toMatch(/ m$/);
    expect(byKey.deliveryLpd).toMatch(/ L\/day$/);
    expect(view.figures.map((f) => f.key)).toEqual(expect.arrayContaining(
      ['fallM', 'designFlowLpm', 'totalLiftM', 'liftRatio', 'deliveryLpd', 'demandLpd', 'demandMarginLpd', 'probabilityMeetsDemand']));
  });

  it('shows ft and gal/day for a US reader, converted from the same figures', () => {
    const view = buildSheetView(source, 'us');
    const byKey = Object.fromEntries(view.figures.map((f) => [f.key, f.value]));
    expect(byKey.fallM).toMatch(/ ft$/);
    expect(digits(byKey.fallM ?? '')).toBeCloseTo(figure('fallM') / 0.3048, 1);
    expect(byKey.deliveryLpd).toBe(perDay(figure('deliveryLpd'), 'us').text);
    expect(byKey.deliveryLpd).toMatch(/gal\/day$/);
    expect(view.billOfMaterials.find((l) => l.item.startsWith('Drive pipe'))?.quantity).toMatch(/ ft$/);
  });

  it('carries every caution with a title, and the safety ones are there', () => {
    const view = buildSheetView(source, 'metric');
    expect(view.cautions.map((c) => c.code)).toEqual(expect.arrayContaining(['NOT_A_DESIGN', 'SURGE_PRESSURE', 'WORKING_IN_WATER', 'PERMITS', 'UNTREATED_WATER']));
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
    const gravity = brandtLikeSource();
    const screened = screenSite(siteReadingsSchema.parse({
      flowMeasurements: [{ method: 'volumetric', season: 'dry', trials: [{ volumeL: 20, seconds: 10 }] }],
      fallRuns: [{ method: 'hose', steps: [{ upperReadingM: 0, lowerReadingM: 4 }] }],
      lift: { kind: 'direct', staticLiftM: 1.5, method: 'level' },
      deliveryPipe: { lengthM: 300, material: 'hdpe' },
      demand: [{ kind: 'person-tap-on-plot', count: 4 }],
      monteCarlo: { samples: 500, seed: 1 },
    }));
    const view = buildSheetView({ ...gravity, screening: screened }, 'metric');
    expect(view.verdict).toBe('gravity');
    expect(view.verdictWord).toBe('No pump needed');
    expect(view.summary[1]).toMatch(/no pump is needed/);
    expect(view.billOfMaterials.map((b) => b.item).join(' ')).not.toMatch(/ram/i);
    expect(view.figures.map((f) => f.key)).toContain('gravityHeadM');
  });
});
