import { describe, expect, it } from 'vitest';
import { unusualIn, withConfirmations } from '@/lib/shared/plausibility';
import type { EntityFields } from '@/lib/shared/schemas/sync';

const VISIT = '11111111-1111-4111-8111-111111111111';
const FARM = '33333333-3333-4333-8333-333333333333';
const notch = (heads: number[]): EntityFields<'flowMeasurement'> => ({
  visitId: VISIT,
  sourceId: null,
  takenAt: null,
  notes: '',
  measurement: { method: 'v-notch', season: 'dry', notchAngleDeg: 90, trials: heads.map((headM) => ({ headM })) },
});
const bucket = (seconds: number[]): EntityFields<'flowMeasurement'> => ({
  visitId: VISIT,
  sourceId: null,
  takenAt: null,
  notes: '',
  measurement: { method: 'volumetric', season: 'dry', trials: seconds.map((s) => ({ volumeL: 20, seconds: s })) },
});
const hoseFall = (dropM: number): EntityFields<'fallReading'> => ({
  visitId: VISIT,
  purpose: 'fall',
  seq: 0,
  takenAt: null,
  notes: '',
  bookedFrom: null,
  run: { method: 'hose', steps: Array.from({ length: Math.ceil(dropM / 5) }, () => ({ upperReadingM: 0, lowerReadingM: dropM / Math.ceil(dropM / 5) })) },
});
const people = (count: number): EntityFields<'demandLine'> => ({
  farmId: FARM,
  kind: 'person-tap-on-plot',
  count,
  litresPerHeadPerDay: 50,
  figureSource: '',
  note: '',
  confirmed: null,
});

describe('unusual readings ask "is this right?"', () => {
  it('a 90° V-notch head outside 0.06–0.38 m (USBR Water Measurement Manual range, from memory) is asked about, inside it is not', () => {
    expect(unusualIn('flowMeasurement', notch([0.1, 0.2]))).toEqual([]);
    const found = unusualIn('flowMeasurement', notch([0.3, 0.45]));
    expect(found.map((u) => [u.code, u.path])).toEqual([['notch-head-range', 'measurement.trials.1.headM']]);
    expect(found[0]!.message).toMatch(/0\.45 m is outside .*\(0\.06 m to 0\.38 m\)/);
  });

  it('trials that differ tenfold are asked about (a 3 s and a 30 s fill of one bucket), ninefold are not', () => {
    expect(unusualIn('flowMeasurement', bucket([10, 90])).map((u) => u.code)).toEqual([]);
    expect(unusualIn('flowMeasurement', bucket([3, 30])).map((u) => u.code)).toEqual(['trial-spread']);
  });

  it('a fall over 30 m and more than 200 people are asked about; 30 m and 200 people are not', () => {
    expect(unusualIn('fallReading', hoseFall(30))).toEqual([]);
    expect(unusualIn('fallReading', hoseFall(31)).map((u) => u.code)).toEqual(['fall-high']);
    expect(unusualIn('demandLine', people(200))).toEqual([]);
    expect(unusualIn('demandLine', people(201)).map((u) => u.code)).toEqual(['people-many']);
  });

  it('a lift over 250 m, booked from the pump going up, is asked about in feet for a US advisor', () => {
    const lift: EntityFields<'fallReading'> = {
      ...hoseFall(5),
      purpose: 'lift',
      bookedFrom: 'pump',
      run: { method: 'hose', steps: Array.from({ length: 52 }, () => ({ upperReadingM: 5, lowerReadingM: 0 })) },
    };
    const found = unusualIn('fallReading', lift, 'us');
    expect(found.map((u) => u.code)).toEqual(['lift-high']);
    expect(found[0]!.message).toMatch(/853 ft .*about 820 ft/);
  });

  it('a confirmation is kept on the record, and a confirmed value is no longer asked about', () => {
    const confirmed = withConfirmations('demandLine', people(450), ['people-many']);
    expect(confirmed.confirmed).toEqual(['people-many']);
    expect(unusualIn('demandLine', confirmed)).toEqual([expect.objectContaining({ code: 'people-many', confirmed: true })]);
    const flow = withConfirmations('flowMeasurement', notch([0.5]), ['notch-head-range']);
    expect(flow.measurement.confirmed).toEqual(['notch-head-range']);
    expect(unusualIn('flowMeasurement', flow).every((u) => u.confirmed)).toBe(true);
  });
});
