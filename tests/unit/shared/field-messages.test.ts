import { describe, expect, it } from 'vitest';
import { messagesByPath, isSchemaText } from '@/lib/shared/field-messages';
import { recordSchemas } from '@/lib/shared/schemas/sync';
import { siteReadingsSchema } from '@/lib/shared/schemas/site-readings';

const VISIT = '11111111-1111-4111-8111-111111111111';
const FARM = '33333333-3333-4333-8333-333333333333';

function refusal(entity: keyof typeof recordSchemas, fields: unknown, units: 'metric' | 'us' = 'metric') {
  const parsed = recordSchemas[entity].safeParse(fields);
  expect(parsed.success, 'the record should be refused').toBe(false);
  return messagesByPath(parsed.success ? [] : parsed.error.issues, units);
}

const level = (rows: object[]) => ({ visitId: VISIT, purpose: 'fall', seq: 0, takenAt: null, notes: '', bookedFrom: null, run: { method: 'level', rows } });
const demand = (count: number, litresPerHeadPerDay: number) => ({
  farmId: FARM,
  kind: 'person-tap-on-plot',
  count,
  litresPerHeadPerDay,
  figureSource: '',
  note: '',
  confirmed: null,
});

// Each impossible value the field book once saved without a word, refused by the schema the phone and
// the server share, with a sentence that names the field (never a path, a code or zod's wording).
describe('impossible readings are refused in plain words', () => {
  it('a foresight of 500 m is no staff reading (a staff reads to 5 m; common practice, no source)', () => {
    const m = refusal('fallReading', level([{ backsightM: 0 }, { foresightM: 500 }]));
    expect(m['run.rows.1.foresightM']).toBe('Foresight must be at most 6.00 m.');
  });

  it('an uphill "fall" is refused with its climb, in the reader\'s units', () => {
    // Backsight 0.5, foresight 0: the far station is 0.5 m higher (height of instrument; surveying textbooks).
    const metric = refusal('fallReading', level([{ backsightM: 0.5 }, { foresightM: 0 }]));
    expect(metric['run.result']).toMatch(/^This run climbs 0\.50 m from the intake to the ram/);
    const parsed = recordSchemas.fallReading.safeParse(level([{ backsightM: 2.5 }, { foresightM: 0.5 }]));
    const us = messagesByPath(
      parsed.error!.issues.map((i) => ({ ...i, message: undefined })),
      'us',
    );
    expect(us['run.result']).toMatch(/^This run climbs 6\.56 ft/);
  });

  it('a lift of 5,000 m and one of −30 m are refused', () => {
    const direct = (staticLiftM: number) => ({
      visitId: VISIT,
      purpose: 'lift',
      seq: 1,
      takenAt: null,
      notes: '',
      bookedFrom: null,
      run: { method: 'direct', staticLiftM, liftMethod: 'level' },
    });
    expect(refusal('fallReading', direct(5000))['run.staticLiftM']).toBe('Height of the tank above the pump must be at most 500 m.');
    expect(refusal('fallReading', direct(-30))['run.staticLiftM']).toBe('Height of the tank above the pump must be more than 0.');
  });

  it('100,000 people and −50 L a head are refused; a 95° clinometer angle too', () => {
    expect(refusal('demandLine', demand(100_001, 50)).count).toMatch(/^How many must be at most 100,?000\.$/);
    expect(refusal('demandLine', demand(4, -50)).litresPerHeadPerDay).toBe('Water each per day must not be negative.');
    const clino = { ...level([]), run: { method: 'clinometer', legs: [{ slopeDistanceM: 10, angleBelowHorizontalDeg: 95 }] } };
    expect(refusal('fallReading', clino)['run.legs.0.angleBelowHorizontalDeg']).toBe('Angle must be at most 89');
  });

  it('a 5,000 mm pipe and a station at −20 m are refused, in inches and feet for a US advisor', () => {
    const pipe = { visitId: VISIT, purpose: 'drive', lengthM: 30, diameterMm: 5000, material: 'hdpe', pressureClass: null };
    const parsed = recordSchemas.pipeRun.safeParse(pipe, { error: undefined });
    expect(parsed.success).toBe(false);
    const us = messagesByPath(
      recordSchemas.pipeRun.safeParse(pipe).error!.issues.map((i) => ({ ...i, message: undefined })),
      'us',
    );
    expect(us.diameterMm).toBe('Inside diameter must be at most 23.62 in.');
    const station = {
      visitId: VISIT,
      role: 'station',
      label: '',
      lat: null,
      lon: null,
      accuracyM: null,
      altitudeM: null,
      altitudeAccuracyM: null,
      chainageM: -20,
      capturedAt: null,
    };
    expect(refusal('point', station).chainageM).toBe('Distance along the route must not be negative.');
  });

  it('a bucket of −20 L and a bucket of 5,000 L are refused at the bucket', () => {
    const flow = (volumeL: number) => ({
      visitId: VISIT,
      sourceId: null,
      takenAt: null,
      notes: '',
      measurement: { method: 'volumetric', season: 'dry', trials: [{ volumeL, seconds: 10 }] },
    });
    expect(refusal('flowMeasurement', flow(-20))['measurement.trials.0.volumeL']).toBe('Bucket volume must be more than 0');
    expect(refusal('flowMeasurement', flow(5000))['measurement.trials.0.volumeL']).toBe('Bucket volume must be at most 1,000 L.');
  });

  it("the engine's own input refuses an uphill fall run too", () => {
    const parsed = siteReadingsSchema.safeParse({ fallRuns: [{ method: 'hose', steps: [{ upperReadingM: 2, lowerReadingM: 0 }] }] });
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues.some((i) => i.path.join('.') === 'fallRuns.0.result' && /climbs 2\.00 m/.test(i.message))).toBe(true);
  });

  it("no message it gives is zod's own wording", () => {
    const m = refusal('pipeRun', { visitId: 'not-a-uuid', purpose: 'up', lengthM: 'x', diameterMm: -1, material: 'clay', pressureClass: 7 });
    for (const text of Object.values(m)) expect(isSchemaText(text), text).toBe(false);
  });
});
