// A feed pipe to a stand pipe (gentle creeks) synced from the phone reaches the server's screening.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { Screening } from '@/lib/server/db';
import { makeOrganisation } from './support/fixtures';
import { push, putOp, readingOps } from './support/sync';

describe('a feed pipe synced from the phone', () => {
  it('is stored, and the screen takes its friction off the fall and puts it and a stand pipe on the bill', async () => {
    const o = await makeOrganisation('push-feed');
    const { ops } = readingOps(o.visit.id, o.farm.id);
    const feed = putOp('pipeRun', randomUUID(), { visitId: o.visit.id, purpose: 'feed', lengthM: 60, diameterMm: null, material: 'hdpe', pressureClass: null });
    const { status, results } = await push(o.advisor, { ops: [...ops, feed] });
    expect(status).toBe(200);
    expect(results.every((r) => r.status === 'applied')).toBe(true);
    const screening = await Screening.findOne({ where: { visitId: o.visit.id }, order: [['createdAt', 'DESC']], rejectOnEmpty: true });
    const result = screening.result as { figures: Record<string, { value: number }>; billOfMaterials: { item: string }[] };
    expect(result.figures.feedPipeLengthM?.value).toBe(60);
    expect(result.figures.drivingFallM?.value).toBeLessThan(result.figures.fallM?.value ?? 0);
    expect(result.billOfMaterials.map((b) => b.item).join(' | ')).toMatch(/Feed pipe.*stand pipe/);
  });

  it('is refused, with nothing stored, when its purpose is not one the protocol knows', async () => {
    const o = await makeOrganisation('push-feed-bad');
    const bad = putOp('pipeRun', randomUUID(), {
      visitId: o.visit.id,
      purpose: 'siphon',
      lengthM: 60,
      diameterMm: null,
      material: 'hdpe',
      pressureClass: null,
    });
    const { status, results } = await push(o.advisor, { ops: [bad] });
    expect([200, 422]).toContain(status);
    if (status === 200) expect(results[0]?.status).not.toBe('applied');
  });
});
