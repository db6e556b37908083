import { describe, expect, it } from 'vitest';
import { screenSite } from '@/lib/engine';
import { buildSiteReadings, type VisitRecords } from '@/lib/shared/site-readings-input';

const VISIT = '11111111-1111-4111-8111-111111111111';
const FARM = '33333333-3333-4333-8333-333333333333';
const id = (n: number) => `00000000-0000-4000-8000-00000000000${n}`;

const records: VisitRecords = {
  flows: [
    {
      id: id(2),
      visitId: VISIT,
      sourceId: null,
      takenAt: '2026-08-02T10:00:00Z',
      notes: '',
      measurement: { method: 'volumetric', season: 'dry', trials: [{ volumeL: 20, seconds: 8 }] },
    },
    {
      id: id(1),
      visitId: VISIT,
      sourceId: null,
      takenAt: '2026-08-01T10:00:00Z',
      notes: '',
      measurement: { method: 'volumetric', season: 'dry', trials: [{ volumeL: 20, seconds: 9 }] },
    },
    {
      id: id(3),
      visitId: VISIT,
      sourceId: null,
      takenAt: null,
      notes: '',
      deletedAt: '2026-08-03T00:00:00Z',
      measurement: { method: 'volumetric', season: 'dry', trials: [{ volumeL: 20, seconds: 1 }] },
    },
  ],
  runs: [
    {
      id: id(5),
      visitId: VISIT,
      purpose: 'lift',
      seq: 1,
      takenAt: null,
      notes: '',
      bookedFrom: null,
      run: { method: 'direct', staticLiftM: 14, liftMethod: 'level' },
    },
    {
      id: id(4),
      visitId: VISIT,
      purpose: 'fall',
      seq: 0,
      takenAt: null,
      notes: '',
      bookedFrom: null,
      run: { method: 'hose', steps: [{ upperReadingM: 0.2, lowerReadingM: 2.2 }] },
    },
  ],
  pipes: [
    { id: id(6), visitId: VISIT, purpose: 'delivery', lengthM: 300, diameterMm: null, material: 'hdpe', pressureClass: null },
    { id: id(7), visitId: VISIT, purpose: 'feed', lengthM: null, diameterMm: null, material: 'hdpe', pressureClass: null },
  ],
  demand: [
    { id: id(9), farmId: FARM, kind: 'sheep', count: 40, litresPerHeadPerDay: 7.6, figureSource: '', note: '', confirmed: null },
    { id: id(8), farmId: FARM, kind: 'person-tap-on-plot', count: 4, litresPerHeadPerDay: 50, figureSource: '', note: '', confirmed: null },
  ],
  settings: { designFractionOfLowest: 0.5 },
  samples: 2000,
};

describe('one builder of the engine input', () => {
  it('orders flows by time, runs by booking order, demand by id, and leaves out deleted records and an empty feed pipe', () => {
    const input = buildSiteReadings(records);
    expect(input.flowMeasurements.map((f) => f.id)).toEqual([id(1), id(2)]);
    expect(input.fallRuns).toHaveLength(1);
    expect(input.lift).toMatchObject({ kind: 'direct', staticLiftM: 14, method: 'level' });
    expect(input.feedPipe).toBeUndefined();
    expect(input.demand?.map((d) => d.kind)).toEqual(['person-tap-on-plot', 'sheep']);
  });

  it('the same records in any order give the same input and the same screen', () => {
    const shuffled: VisitRecords = {
      ...records,
      flows: [...records.flows].reverse(),
      runs: [...records.runs].reverse(),
      demand: [...records.demand].reverse(),
    };
    expect(buildSiteReadings(shuffled)).toEqual(buildSiteReadings(records));
    expect(screenSite(buildSiteReadings(shuffled)).verdict).toBe(screenSite(buildSiteReadings(records)).verdict);
  });
});
