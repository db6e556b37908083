// Impossible readings the server once accepted (a 500 m staff reading, an uphill "fall", a 5,000 m lift,
// 100,000 people) are refused at the push with a plain reason, and nothing is stored — the same rules
// the phone's save applies (lib/shared/schemas/sync.ts recordSchemas).
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { DemandLine, FallReading } from '@/lib/server/db';
import { makeOrganisation } from './support/fixtures';
import { push, putOp } from './support/sync';

const fall = (visitId: string, run: object, purpose: 'fall' | 'lift' = 'fall', bookedFrom: 'pump' | 'tank' | null = null) => ({
  visitId,
  purpose,
  seq: 0,
  takenAt: null,
  notes: '',
  bookedFrom,
  run,
});

describe('the push refuses impossible readings in plain words', () => {
  it('a 500 m foresight, an uphill fall and a 5,000 m lift are refused; nothing is stored', async () => {
    const o = await makeOrganisation('impossible-fall');
    const cases = [
      { run: { method: 'level', rows: [{ backsightM: 0 }, { foresightM: 500 }] }, reason: /Foresight must be at most 6/ },
      { run: { method: 'level', rows: [{ backsightM: 2.5 }, { foresightM: 0.5 }] }, reason: /climbs 2\.00 m from the intake to the ram/ },
      { run: { method: 'direct', staticLiftM: 5000, liftMethod: 'level' }, purpose: 'lift' as const, reason: /at most 500/ },
    ];
    for (const c of cases) {
      const id = randomUUID();
      const res = await push(o.advisor, { ops: [putOp('fallReading', id, fall(o.visit.id, c.run, c.purpose ?? 'fall'))] });
      const result = res.results?.[0];
      expect(res.status === 422 || result?.status === 'rejected', JSON.stringify(res)).toBe(true);
      // A whole push refused (422) names the op's field path for API clients; the sentence after it is plain.
      const reason = (result?.error?.message ?? res.error?.message ?? '').replace(/^ops\.\d+\.changes\.[\w.]+: /, '');
      expect(reason).toMatch(c.reason);
      expect(reason).not.toMatch(/Invalid input|expected .* to be|ops\.\d/);
      expect(await FallReading.findByPk(id)).toBeNull();
    }
  });

  it('an edit that turns a stored fall uphill is refused and the stored run stays', async () => {
    const o = await makeOrganisation('impossible-edit');
    const id = randomUUID();
    const made = await push(o.advisor, {
      ops: [putOp('fallReading', id, fall(o.visit.id, { method: 'hose', steps: [{ upperReadingM: 0.2, lowerReadingM: 1.7 }] }))],
    });
    expect(made.results[0]?.status).toBe('applied');
    const edit = await push(o.advisor, {
      ops: [
        putOp('fallReading', id, { run: { method: 'hose', steps: [{ upperReadingM: 1.7, lowerReadingM: 0.2 }] } }, { baseRev: made.results[0]?.rev as number }),
      ],
    });
    expect(edit.results[0]?.status).toBe('rejected');
    expect(edit.results[0]?.error?.message).toMatch(/climbs 1\.50 m/);
    const stored = await FallReading.findByPk(id);
    expect((stored?.get('bookings') as { steps: { lowerReadingM: number }[] }).steps[0]?.lowerReadingM).toBe(1.7);
  });

  it('100,001 people on one line is refused; 450 confirmed on the phone is stored with its confirmation', async () => {
    const o = await makeOrganisation('impossible-demand');
    const line = (count: number, confirmed: string[] | null) => ({
      farmId: o.farm.id,
      kind: 'person-tap-on-plot',
      count,
      litresPerHeadPerDay: 50,
      figureSource: '',
      note: '',
      confirmed,
    });
    const bad = randomUUID();
    const refused = await push(o.advisor, { ops: [putOp('demandLine', bad, line(100_001, null))] });
    expect(refused.status === 422 || refused.results?.[0]?.status === 'rejected').toBe(true);
    expect(await DemandLine.findByPk(bad)).toBeNull();
    const good = randomUUID();
    const ok = await push(o.advisor, { ops: [putOp('demandLine', good, line(450, ['people-many']))] });
    expect(ok.results[0]?.status).toBe('applied');
    expect((await DemandLine.findByPk(good))?.confirmed).toEqual(['people-many']);
  });
});
