// A commissioning check sent again under a new op id is acknowledged only for someone who may
// commission the visit: the same access check as a new check, before the stored record is consulted.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { Commissioning } from '@/lib/server/db';
import { makeOrganisation } from './support/fixtures';
import { screenFixtureVisit } from './support/screened';
import { push, putOp } from './support/sync';

const fields = (visitId: string) => ({
  visitId,
  driveLpm: 55,
  deliveredLpm: 4,
  beatsPerMinute: 70,
  liftM: 20,
  fallM: 3,
  drivePipeMaterial: 'galvanized-steel',
  notes: '',
});

describe('commissioning replays', () => {
  it('an advisor not assigned to the visit, replaying a stored check id, is refused (404) like a new id', async () => {
    const o = await makeOrganisation('commission-replay');
    await screenFixtureVisit(o.visit.id, o.farm.id, o.advisor.id);
    const id = randomUUID();
    const first = await push(o.advisor, { ops: [putOp('commissioning', id, fields(o.visit.id))] });
    expect(first.results[0]?.status).toBe('applied');

    const newId = await push(o.otherAdvisor, { ops: [putOp('commissioning', randomUUID(), fields(o.visit.id))] });
    expect(newId.results[0]?.status).toBe('rejected');
    const replay = await push(o.otherAdvisor, { ops: [putOp('commissioning', id, fields(o.visit.id))] });
    expect(replay.results[0]?.status).toBe('rejected');
    expect(replay.results[0]?.error?.code).toBe(404);
    expect(await Commissioning.count({ where: { visitId: o.visit.id } })).toBe(1);

    // The assigned advisor's own replay is still acknowledged.
    const own = await push(o.advisor, { ops: [putOp('commissioning', id, fields(o.visit.id))] });
    expect(own.results[0]?.status).toBe('applied');
  });
});
