// What sync accepts, the screen can use: the same pressure classes and the same array limits
// (lib/shared/reading-limits.ts). A value the engine would refuse is refused at the push instead.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { FlowMeasurement, PipeRun } from '@/lib/server/db';
import { MAX_TRIALS } from '@/lib/shared/reading-limits';
import { makeOrganisation } from './support/fixtures';
import { push, putOp } from './support/sync';

describe('sync and the engine share their limits', () => {
  it('a pressure class that is not one of the material’s (PN10 on HDPE) is refused with a 422; a real class is applied', async () => {
    const o = await makeOrganisation('limits-class');
    const bad = randomUUID();
    const res = await push(o.advisor, {
      ops: [putOp('pipeRun', bad, { visitId: o.visit.id, purpose: 'delivery', lengthM: 300, diameterMm: null, material: 'hdpe', pressureClass: 'PN10' })],
    });
    expect(res.status === 422 || res.results[0]?.status === 'rejected').toBe(true);
    expect(await PipeRun.findByPk(bad)).toBeNull();
    const good = randomUUID();
    const ok = await push(o.advisor, {
      ops: [putOp('pipeRun', good, { visitId: o.visit.id, purpose: 'delivery', lengthM: 300, diameterMm: null, material: 'hdpe', pressureClass: 'sdr-11' })],
    });
    expect(ok.results[0]?.status).toBe('applied');
    // Changing only the class later is checked against the stored material.
    const later = await push(o.advisor, { ops: [putOp('pipeRun', good, { pressureClass: 'sch40-class150' }, { baseRev: ok.results[0]?.rev as number })] });
    expect(later.results[0]?.status).toBe('rejected');
    expect(later.results[0]?.error?.message).toMatch(/class/i);
  });

  it(`a flow measurement with more than ${MAX_TRIALS} trials is refused with a 422 (150,000 were stored before)`, async () => {
    const o = await makeOrganisation('limits-trials');
    const id = randomUUID();
    const trials = Array.from({ length: 150_000 }, () => ({ volumeL: 20, seconds: 10 }));
    const res = await push(o.advisor, {
      ops: [
        putOp('flowMeasurement', id, {
          visitId: o.visit.id,
          sourceId: null,
          takenAt: null,
          notes: '',
          measurement: { method: 'volumetric', season: 'dry', trials },
        }),
      ],
    });
    expect(res.status).toBe(422);
    expect(res.error?.message).toMatch(/trials/);
    expect(await FlowMeasurement.findByPk(id)).toBeNull();
  });
});
