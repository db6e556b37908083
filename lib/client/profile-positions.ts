// The phone's profile stations and tank in the engine's shape, and adopting a ranked pair as normal synced changes.
import { levelRowsDropping } from '@/lib/engine/fall';
import type { BestPositionsInput, PositionPair, ProfileStation, ProfileTank } from '@/lib/engine';
import { fieldDb, type LocalRecord } from './db';
import { newId } from './ids';
import { deleteRecord, saveRecord } from './outbox';
import { localSiteReadings } from './site-readings';
import { showQuantity } from '@/lib/shared/display/quantities';
import type { UnitSystem } from '@/lib/shared/domain';

const live = <T extends { deletedAt: string | null }>(rows: T[]) => rows.filter((r) => !r.deletedAt);

export interface LocalProfile {
  stations: (ProfileStation & { point: LocalRecord<'point'> })[];
  /** Stations missing a chainage or a level (shown, not searched). */
  incomplete: number;
  tankPoint: LocalRecord<'point'> | null;
  base: Omit<BestPositionsInput, 'stations' | 'tank'> | null;
}

/** Level of a point: the levelled reduced level, else the GPS altitude. */
export const levelOf = (p: LocalRecord<'point'>): number | null => p.reducedLevelM ?? p.altitudeM ?? null;

/** Reads the visit's stations, tank point, flows, demand and pipe materials from the phone. */
export async function localProfile(visitId: string): Promise<LocalProfile> {
  const points = live(await fieldDb().points.where('visitId').equals(visitId).toArray());
  const rows = points.filter((p) => p.role === 'station');
  const stations = rows
    .flatMap((p) => {
      const level = levelOf(p);
      return p.chainageM !== null && level !== null
        ? [{ id: p.id, label: p.label, chainageM: p.chainageM, levelM: level, flags: p.flags ?? [], point: p }]
        : [];
    })
    .sort((a, b) => a.chainageM - b.chainageM);
  const readings = await localSiteReadings(visitId);
  const base = readings
    ? {
        flowMeasurements: readings.flowMeasurements,
        demand: readings.demand,
        settings: readings.settings,
        drivePipeMaterial: readings.drivePipe?.material,
        deliveryPipe: readings.deliveryPipe ? { material: readings.deliveryPipe.material } : undefined,
        samples: 2000,
        rankingSamples: 200,
      }
    : null;
  return { stations, incomplete: rows.length - stations.length, tankPoint: points.find((p) => p.role === 'tank') ?? null, base };
}

async function upsertPoint(visitId: string, role: 'intake' | 'pump', station: ProfileStation & { point?: LocalRecord<'point'> }, units: UnitSystem) {
  const existing = live(await fieldDb().points.where('visitId').equals(visitId).toArray()).find((p) => p.role === role);
  const fields = {
    label: `Station at ${showQuantity(station.chainageM, 'chainage', units)}${station.label ? ` (${station.label})` : ''}`.slice(0, 120),
    chainageM: station.chainageM,
    reducedLevelM: station.levelM,
    lat: station.point?.lat ?? null,
    lon: station.point?.lon ?? null,
    accuracyM: station.point?.accuracyM ?? null,
    altitudeM: station.point?.altitudeM ?? null,
    altitudeAccuracyM: station.point?.altitudeAccuracyM ?? null,
  };
  if (existing) await saveRecord('point', existing.id, fields);
  else await saveRecord('point', newId(), { visitId, role, capturedAt: new Date().toISOString(), flags: null, ...fields });
}

async function upsertPipe(visitId: string, purpose: 'drive' | 'delivery' | 'feed', lengthM: number) {
  const existing = live(await fieldDb().pipeRuns.where('visitId').equals(visitId).toArray()).find((p) => p.purpose === purpose);
  const rounded = Math.round(lengthM * 10) / 10;
  if (existing) await saveRecord('pipeRun', existing.id, { lengthM: rounded });
  else
    await saveRecord('pipeRun', newId(), {
      visitId,
      purpose,
      lengthM: rounded,
      diameterMm: null,
      material: purpose === 'drive' ? 'galvanized-steel' : 'hdpe',
      pressureClass: null,
    });
}

/** A pair without a stand pipe has no feed pipe: one left from an earlier arrangement goes. */
async function dropFeedPipe(visitId: string) {
  const existing = live(await fieldDb().pipeRuns.where('visitId').equals(visitId).toArray()).find((p) => p.purpose === 'feed');
  if (existing) await deleteRecord('pipeRun', existing.id);
}

/**
 * Adopts a pair: the intake and pump points move to its stations, the pipe lengths follow, and the
 * fall and lift readings are replaced by the profile's (the old ones described the old positions).
 */
export async function adoptPair(visitId: string, pair: PositionPair, stations: LocalProfile['stations'], tank: ProfileTank, units: UnitSystem): Promise<void> {
  const find = (id: string) => stations.find((s) => s.id === id) ?? pair.intake;
  await upsertPoint(visitId, 'intake', find(pair.intake.id), units);
  await upsertPoint(visitId, 'pump', find(pair.pump.id), units);
  await upsertPipe(visitId, 'drive', pair.driveLengthM);
  if (pair.standPipe) await upsertPipe(visitId, 'feed', pair.feedLengthM);
  else await dropFeedPipe(visitId);
  await upsertPipe(visitId, 'delivery', pair.deliveryLengthM);
  const runs = live(await fieldDb().fallReadings.where('visitId').equals(visitId).toArray());
  for (const r of runs) await deleteRecord('fallReading', r.id);
  const seq = runs.reduce((m, r) => Math.max(m, r.seq + 1), 0);
  const stand = pair.standPipe ? `, stand pipe at ${pair.standPipe.chainageM} m` : '';
  const note = `From the creek profile: intake at ${pair.intake.chainageM} m${stand}, ram at ${pair.pump.chainageM} m, tank at level ${tank.levelM} m.`;
  const takenAt = new Date().toISOString();
  const fall = Math.round(pair.fallM * 1000) / 1000;
  await saveRecord('fallReading', newId(), {
    visitId,
    purpose: 'fall',
    seq,
    takenAt,
    notes: note,
    bookedFrom: null,
    run: { method: 'level', rows: levelRowsDropping(fall) },
  });
  await saveRecord('fallReading', newId(), {
    visitId,
    purpose: 'lift',
    seq: seq + 1,
    takenAt,
    notes: note,
    bookedFrom: null,
    run: { method: 'direct', staticLiftM: Math.round(pair.staticLiftM * 1000) / 1000, liftMethod: 'level' },
  });
}
