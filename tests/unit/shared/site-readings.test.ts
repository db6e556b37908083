import { describe, expect, it } from 'vitest';
import { MAX_FLOW_MEASUREMENTS, MAX_TRIALS } from '@/lib/shared/reading-limits';
import { siteReadingsSchema } from '@/lib/shared/schemas/site-readings';
import { clearGo } from '../engine/fixtures/demo-sites';

function messagesFor(patch: Record<string, unknown>): { path: string; message: string }[] {
  const result = siteReadingsSchema.safeParse({ ...structuredClone(clearGo), ...patch });
  expect(result.success).toBe(false);
  return result.success ? [] : result.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
}

describe('SiteReadings schema', () => {
  it('accepts the demo readings and fills the stated defaults', () => {
    const parsed = siteReadingsSchema.parse(clearGo);
    expect(parsed.settings.designFractionOfLowest).toBe(0.5);
    expect(parsed.settings.efficiencyCurve).toBe('building-trades-table');
    expect(parsed.settings.tankRule).toBe('one-day');
    expect(parsed.drivePipe.material).toBe('galvanized-steel');
    expect(parsed.monteCarlo).toEqual({ samples: 10000, seed: 42 });
  });

  it.each<[string, Record<string, unknown>, string, string]>([
    [
      'zero seconds',
      { flowMeasurements: [{ method: 'volumetric', season: 'dry', trials: [{ volumeL: 20, seconds: 0 }] }] },
      'flowMeasurements.0.trials.0.seconds',
      'Seconds must be more than 0',
    ],
    [
      'NaN volume',
      { flowMeasurements: [{ method: 'volumetric', season: 'dry', trials: [{ volumeL: Number.NaN, seconds: 3 }] }] },
      'flowMeasurements.0.trials.0.volumeL',
      'Bucket volume must be a number',
    ],
    [
      'missing head',
      { flowMeasurements: [{ method: 'v-notch', season: 'dry', trials: [{}] }] },
      'flowMeasurements.0.trials.0.headM',
      'Head over the notch is needed',
    ],
    [
      'unknown flow method',
      { flowMeasurements: [{ method: 'guess', season: 'dry', trials: [] }] },
      'flowMeasurements.0.method',
      'Flow method must be volumetric, v-notch, rectangular-weir or float',
    ],
    ['negative delivery length', { deliveryPipe: { lengthM: -300, material: 'hdpe' } }, 'deliveryPipe.lengthM', 'Delivery pipe length must be more than 0'],
    ['no flow measurement', { flowMeasurements: [] }, 'flowMeasurements', 'Add at least one flow measurement'],
    [
      'level booking: missing change-point backsight',
      { fallRuns: [{ method: 'level', rows: [{ backsightM: 1 }, { foresightM: 1 }, { foresightM: 1 }] }] },
      'fallRuns.0.rows.1.backsightM',
      'This station needs a backsight',
    ],
    [
      'weir narrower than a fifth of the head',
      { flowMeasurements: [{ method: 'rectangular-weir', season: 'dry', trials: [{ crestWidthM: 0.01, headM: 0.1 }] }] },
      'flowMeasurements.0.trials.0.crestWidthM',
      'Crest width must be more than a fifth of the head',
    ],
    [
      'angle out of range',
      { fallRuns: [{ method: 'clinometer', legs: [{ slopeDistanceM: 10, angleBelowHorizontalDeg: 95 }] }] },
      'fallRuns.0.legs.0.angleBelowHorizontalDeg',
      'Angle must be at most 89',
    ],
    ['samples too few', { monteCarlo: { samples: 10, seed: 1 } }, 'monteCarlo.samples', 'Samples must be at least 100'],
  ])('rejects %s with a plain sentence', (_label, patch, path, message) => {
    expect(messagesFor(patch)).toContainEqual({ path, message });
  });

  it('every message is a sentence that starts with a capital letter', () => {
    const issues = messagesFor({ flowMeasurements: [{ method: 'float', season: 'spring', areaM2: -1, trials: [{ distanceM: 0, seconds: Infinity }] }] });
    expect(issues.length).toBeGreaterThanOrEqual(3);
    for (const i of issues) expect(i.message).toMatch(/^[A-Z][^{}]*[a-z0-9]$/);
  });
});

describe('SiteReadings schema: the shared reading limits (lib/shared/reading-limits.ts)', () => {
  const trial = { volumeL: 20, seconds: 10 };
  const measurement = { method: 'volumetric', season: 'dry', trials: [trial] };
  it.each<[string, Record<string, unknown>, string, RegExp]>([
    [
      `${MAX_TRIALS + 1} trials`,
      { flowMeasurements: [{ ...measurement, trials: Array(MAX_TRIALS + 1).fill(trial) }] },
      'flowMeasurements.0.trials',
      /At most 100 trials/,
    ],
    [
      `${MAX_FLOW_MEASUREMENTS + 1} measurements`,
      { flowMeasurements: Array(MAX_FLOW_MEASUREMENTS + 1).fill(measurement) },
      'flowMeasurements',
      /At most 200 flow measurements/,
    ],
    [
      'a pressure class of another material',
      { deliveryPipe: { lengthM: 300, material: 'hdpe', pressureClass: 'sch40-class150' } },
      'deliveryPipe.pressureClass',
      /not one of its material/,
    ],
    ['a made-up pressure class', { drivePipe: { material: 'galvanized-steel', pressureClass: 'PN10' } }, 'drivePipe.pressureClass', /not one of its material/],
  ])('refuses %s', (_label, patch, path, message) => {
    const issues = messagesFor(patch);
    expect(
      issues.some((i) => i.path === path && message.test(i.message)),
      JSON.stringify(issues.slice(0, 3)),
    ).toBe(true);
  });

  it('accepts the limits themselves and a real class of the material', () => {
    const ok = siteReadingsSchema.safeParse({
      ...structuredClone(clearGo),
      flowMeasurements: [{ ...measurement, trials: Array(MAX_TRIALS).fill(trial) }],
      deliveryPipe: { lengthM: 300, material: 'hdpe', pressureClass: 'sdr-11' },
    });
    expect(ok.success, ok.success ? '' : JSON.stringify(ok.error.issues.slice(0, 3))).toBe(true);
  });
});
