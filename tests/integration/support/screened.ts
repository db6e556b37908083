// Gives a fixture visit invented field readings and a stored screening (as a sync would).
import { randomUUID } from 'node:crypto';
import { DemandLine, FallReading, FlowMeasurement, PipeRun, Point, Visit, WaterSource, getSequelize } from '@/lib/server/db';
import { screenVisit } from '@/lib/server/services/screening';

export async function screenFixtureVisit(visitId: string, farmId: string, advisorId: string): Promise<void> {
  await getSequelize().transaction(async (transaction) => {
    const sourceId = randomUUID();
    const base = { visitId, createdById: advisorId, notes: '' };
    await WaterSource.create({ ...base, id: sourceId, name: 'Fixture brook', kind: 'creek' }, { transaction });
    await FlowMeasurement.create(
      {
        ...base,
        id: randomUUID(),
        sourceId,
        method: 'volumetric',
        season: 'dry',
        takenAt: new Date(),
        readings: {
          trials: [
            { volumeL: 20, seconds: 10.4 },
            { volumeL: 20, seconds: 10.9 },
            { volumeL: 20, seconds: 10.1 },
          ],
        },
      },
      { transaction },
    );
    await FallReading.create(
      {
        ...base,
        id: randomUUID(),
        purpose: 'fall',
        method: 'level',
        seq: 0,
        takenAt: new Date(),
        bookings: { rows: [{ backsightM: 1.842 }, { foresightM: 2.618, backsightM: 0.512 }, { foresightM: 2.309, backsightM: 0.688 }, { foresightM: 2.215 }] },
      },
      { transaction },
    );
    await FallReading.create(
      {
        ...base,
        id: randomUUID(),
        purpose: 'lift',
        method: 'clinometer',
        seq: 1,
        takenAt: new Date(),
        bookings: {
          bookedFrom: 'pump',
          legs: [
            { slopeDistanceM: 60, angleBelowHorizontalDeg: -9 },
            { slopeDistanceM: 55, angleBelowHorizontalDeg: -12 },
          ],
        },
      },
      { transaction },
    );
    for (const [purpose, lengthM, material] of [
      ['drive', 24, 'galvanized-steel'],
      ['delivery', 300, 'hdpe'],
    ] as const) {
      await PipeRun.create(
        { id: randomUUID(), visitId, purpose, lengthM, diameterMm: null, material, pressureClass: null, createdById: advisorId },
        { transaction },
      );
    }
    const points = [
      ['intake', 'Intake pool', 52.41931, -3.61702],
      ['pump', 'Ram site', 52.41912, -3.61668],
      ['tank', 'Tank by the barn', 52.41835, -3.61403],
    ] as const;
    for (const [role, label, lat, lon] of points) {
      await Point.create(
        {
          id: randomUUID(),
          visitId,
          role,
          label,
          lat,
          lon,
          accuracyM: 4,
          altitudeM: null,
          altitudeAccuracyM: null,
          chainageM: null,
          capturedAt: new Date(),
          createdById: advisorId,
        },
        { transaction },
      );
    }
    await DemandLine.create(
      { id: randomUUID(), farmId, kind: 'goat', count: 30, litresPerHeadPerDay: 7.57, figureSource: 'hindawi-2017', note: '', createdById: advisorId },
      { transaction },
    );
    await DemandLine.create(
      {
        id: randomUUID(),
        farmId,
        kind: 'person-tap-on-plot',
        count: 3,
        litresPerHeadPerDay: 50,
        figureSource: 'who-howard-bartram-2003',
        note: '',
        createdById: advisorId,
      },
      { transaction },
    );
    const outcome = await screenVisit(visitId, advisorId, transaction);
    if (outcome.status === 'incomplete') throw new Error(`fixture readings incomplete: ${outcome.missing.join('; ')}`);
    const visit = await Visit.findByPk(visitId, { transaction, rejectOnEmpty: true });
    await visit.update({ status: 'screened', visitedAt: new Date() }, { transaction });
  });
}
