// Input that looks valid but the database cannot hold: dates past 9999 or before 1000 once their
// offset is applied, integers past a 32-bit column, lone UTF-16 surrogates that are not text. Each
// is refused at the boundary with a 422 naming the field, never a 500; nothing is stored.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { POST as postFarm } from '@/app/api/farms/route';
import { PUT as putAssignment } from '@/app/api/visits/[id]/assignment/route';
import { POST as postQuestion } from '@/app/api/visits/[id]/sheet/questions/route';
import { GET as getVisits } from '@/app/api/visits/route';
import { Farm, FlowMeasurement, Photo, Point, Visit } from '@/lib/server/db';
import { makeOrganisation, params, request } from './support/fixtures';
import { push, putOp } from './support/sync';

const LONE = '\ud83d';

describe('valid-looking input is refused with a 422, never a 500', () => {
  it('a lone surrogate in a point label: 422 naming the field and saying what is wrong; nothing stored', async () => {
    const o = await makeOrganisation('lone-label');
    const id = randomUUID();
    const res = await push(o.advisor, {
      ops: [
        putOp('point', id, {
          visitId: o.visit.id,
          role: 'pump',
          label: `Ram ${LONE}`,
          lat: 52.4,
          lon: -3.6,
          accuracyM: 4,
          altitudeM: 230,
          altitudeAccuracyM: 5,
          chainageM: null,
          capturedAt: '2026-08-01T09:30:00.000Z',
        }),
      ],
    });
    expect(res.status).toBe(422);
    expect(res.error?.message).toMatch(/label/);
    expect(res.error?.message).toMatch(/broken character/i);
    expect(await Point.findByPk(id)).toBeNull();
  });

  it('a lone surrogate in a farm name, and in a farmer’s question: 422', async () => {
    const o = await makeOrganisation('lone-farm');
    const farm = await postFarm(
      await request('/api/farms', o.coordinator, { method: 'POST', body: { name: `Farm ${LONE}`, area: '', ownerId: null, lat: null, lon: null, notes: '' } }),
      params({}),
    );
    expect(farm.status).toBe(422);
    expect((await farm.json()).error.fieldErrors.name).toBeDefined();
    expect(await Farm.count({ where: { organisationId: o.organisationId } })).toBe(2);
    const question = await postQuestion(
      await request(`/api/visits/${o.visit.id}/sheet/questions`, o.farmer, { method: 'POST', body: { text: `How deep is the intake ${LONE}?` } }),
      params({ id: o.visit.id }),
    );
    expect(question.status).toBe(422);
  });

  it('a date-time past year 9999 once its offset is applied, or before year 1000: 422', async () => {
    const o = await makeOrganisation('far-date');
    for (const takenAt of ['9999-12-31T23:59:59-23:59', '0000-01-01T00:00:00Z', '0999-12-31T00:00:00Z']) {
      const id = randomUUID();
      const res = await push(o.advisor, {
        ops: [
          putOp('flowMeasurement', id, {
            visitId: o.visit.id,
            sourceId: null,
            takenAt,
            notes: '',
            measurement: { method: 'volumetric', season: 'dry', trials: [{ volumeL: 20, seconds: 10 }] },
          }),
        ],
      });
      expect(res.status, takenAt).toBe(422);
      expect(res.error?.message).toMatch(/takenAt/);
      expect(await FlowMeasurement.findByPk(id)).toBeNull();
    }
  });

  it('a photo 2^31 pixels wide: 422', async () => {
    const o = await makeOrganisation('wide-photo');
    const id = randomUUID();
    const res = await push(o.advisor, {
      ops: [
        putOp('photo', id, {
          visitId: o.visit.id,
          pointId: null,
          caption: '',
          mime: 'image/jpeg',
          bytes: 1000,
          sha256: 'a'.repeat(64),
          width: 2 ** 31,
          height: 10,
          lat: null,
          lon: null,
          takenAt: null,
        }),
      ],
    });
    expect(res.status).toBe(422);
    expect(res.error?.message).toMatch(/width/);
    expect(await Photo.findByPk(id)).toBeNull();
  });

  it('days before year 1000 are refused (they came back shifted: 0000-01-01 as 2000-01-01); the lowest allowed planned day round-trips', async () => {
    const o = await makeOrganisation('old-day');
    const assign = async (plannedOn: string) =>
      putAssignment(
        await request(`/api/visits/${o.visit.id}/assignment`, o.coordinator, {
          method: 'PUT',
          body: { advisorId: o.advisor.id, plannedOn, confirmUnsynced: true, confirmPast: true },
        }),
        params({ id: o.visit.id }),
      );
    for (const day of ['0000-01-01', '0999-12-31']) {
      const res = await assign(day);
      expect(res.status, day).toBe(422);
      expect((await res.json()).error.fieldErrors.plannedOn).toBeDefined();
    }
    const list = await getVisits(await request('/api/visits?plannedFrom=0000-01-01', o.coordinator), params({}));
    expect(list.status).toBe(422);
    // Planned days start in 2000 (the planning window); a past one needs its confirmation.
    expect((await assign('2000-01-01')).status).toBe(200);
    expect((await Visit.findByPk(o.visit.id, { rejectOnEmpty: true })).plannedOn).toBe('2000-01-01');
  });
});
