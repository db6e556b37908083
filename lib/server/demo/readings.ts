import 'server-only';
import type { Transaction } from 'sequelize';
import { FallReading, FlowMeasurement, PipeRun, Point, WaterSource } from '@/lib/server/db';
import { screenVisit } from '../services/screening';
import { demoId } from './ids';
import { seedDemoProfile } from './profile';

// Raw field readings of the two walked demo sites (invented), stored exactly as the phone sends them.
const SITES = [
  {
    visit: 'visit:brandt-hollow',
    source: { name: 'Brandt spring brook', kind: 'spring' },
    flows: [
      {
        method: 'volumetric',
        season: 'dry',
        readings: {
          trials: [
            { volumeL: 20, seconds: 10.4 },
            { volumeL: 20, seconds: 10.9 },
            { volumeL: 20, seconds: 10.1 },
          ],
        },
      },
      { method: 'v-notch', season: 'wet', readings: { notchAngleDeg: 90, trials: [{ headM: 0.12 }, { headM: 0.118 }] } },
    ],
    fall: [
      {
        method: 'level',
        bookings: { rows: [{ backsightM: 1.842 }, { foresightM: 2.618, backsightM: 0.512 }, { foresightM: 2.309, backsightM: 0.688 }, { foresightM: 2.215 }] },
      },
      { method: 'gps', bookings: { startAltitudeM: 236, endAltitudeM: 232, horizontalAccuracyM: 5 } },
    ],
    lift: [
      {
        method: 'clinometer',
        bookings: {
          bookedFrom: 'pump',
          legs: [
            { slopeDistanceM: 60, angleBelowHorizontalDeg: -9 },
            { slopeDistanceM: 55, angleBelowHorizontalDeg: -12 },
            { slopeDistanceM: 70, angleBelowHorizontalDeg: -7 },
          ],
        },
      },
    ],
    pipes: [
      { purpose: 'drive', lengthM: 24, diameterMm: null, material: 'galvanized-steel' },
      { purpose: 'delivery', lengthM: 420, diameterMm: null, material: 'hdpe' },
    ],
    points: [
      { role: 'intake', label: 'Intake pool below the spring', lat: 52.41931, lon: -3.61702, altitudeM: 236, accuracyM: 4 },
      { role: 'pump', label: 'Ram site on the gravel bar', lat: 52.41912, lon: -3.61668, altitudeM: 232, accuracyM: 4 },
      { role: 'tank', label: 'Tank on the meadow bench', lat: 52.41835, lon: -3.61403, altitudeM: 261, accuracyM: 5 },
    ],
  },
  {
    visit: 'visit:pryce-upper',
    source: { name: 'Cwm Ddu side-creek', kind: 'creek' },
    flows: [
      {
        method: 'volumetric',
        season: 'dry',
        readings: {
          trials: [
            { volumeL: 10, seconds: 14.2 },
            { volumeL: 10, seconds: 15.0 },
            { volumeL: 10, seconds: 13.8 },
          ],
        },
      },
    ],
    fall: [{ method: 'hose', bookings: { steps: [0.74, 0.81, 0.69, 0.77, 0.72, 0.79].map((d) => ({ upperReadingM: 0.2, lowerReadingM: 0.2 + d })) } }],
    lift: [
      {
        method: 'clinometer',
        bookings: {
          bookedFrom: 'pump',
          legs: [
            { slopeDistanceM: 80, angleBelowHorizontalDeg: -18 },
            { slopeDistanceM: 75, angleBelowHorizontalDeg: -21 },
            { slopeDistanceM: 40, angleBelowHorizontalDeg: -14 },
          ],
        },
      },
    ],
    pipes: [
      { purpose: 'drive', lengthM: 30, diameterMm: null, material: 'galvanized-steel' },
      { purpose: 'delivery', lengthM: 260, diameterMm: null, material: 'hdpe' },
    ],
    points: [
      { role: 'intake', label: 'Pool above the slate step', lat: 52.43388, lon: -3.6412, altitudeM: 318, accuracyM: 6 },
      { role: 'pump', label: 'Flat by the alder', lat: 52.43362, lon: -3.64085, altitudeM: 313, accuracyM: 6 },
      { role: 'tank', label: 'Ridge by the house', lat: 52.4329, lon: -3.6393, altitudeM: 375, accuracyM: 8 },
    ],
  },
  {
    // The trough stands below the spring: the screen finds that a pipe fills it by gravity.
    visit: 'visit:hafod-lower',
    source: { name: 'Hafod lower spring', kind: 'spring' },
    flows: [
      {
        method: 'volumetric',
        season: 'dry',
        readings: {
          trials: [
            { volumeL: 10, seconds: 23.5 },
            { volumeL: 10, seconds: 24.6 },
            { volumeL: 10, seconds: 24.1 },
          ],
        },
      },
    ],
    fall: [{ method: 'level', bookings: { rows: [{ backsightM: 0.412 }, { foresightM: 3.388, backsightM: 0.505 }, { foresightM: 3.746 }] } }],
    lift: [{ method: 'level', bookings: { bookedFrom: 'pump', rows: [{ backsightM: 2.918 }, { foresightM: 0.402 }] } }],
    pipes: [
      { purpose: 'drive', lengthM: 35, diameterMm: null, material: 'hdpe' },
      { purpose: 'delivery', lengthM: 160, diameterMm: null, material: 'hdpe' },
    ],
    points: [
      { role: 'intake', label: 'Spring box under the ash', lat: 52.40455, lon: -3.60121, altitudeM: 171, accuracyM: 4 },
      { role: 'pump', label: 'Low point by the ford', lat: 52.40421, lon: -3.60079, altitudeM: 165, accuracyM: 4 },
      { role: 'tank', label: 'Trough in the lower meadow', lat: 52.40352, lon: -3.60003, altitudeM: 167, accuracyM: 5 },
    ],
  },
] as const;

/** Stores the demo's raw readings, then screens each site with the engine (as a sync would). */
export async function seedDemoReadings(transaction: Transaction): Promise<void> {
  const advisorId = demoId('user:tobias');
  for (const site of SITES) {
    const visitId = demoId(site.visit);
    const takenAt = new Date(Date.now() - 3 * 24 * 3600 * 1000);
    const sourceId = demoId(`${site.visit}:source`);
    await WaterSource.create({ id: sourceId, visitId, name: site.source.name, kind: site.source.kind, notes: '', createdById: advisorId }, { transaction });
    for (const [i, flow] of site.flows.entries()) {
      await FlowMeasurement.create(
        {
          id: demoId(`${site.visit}:flow:${i}`),
          visitId,
          sourceId,
          method: flow.method,
          season: flow.season,
          takenAt,
          readings: flow.readings,
          notes: '',
          createdById: advisorId,
        },
        { transaction },
      );
    }
    const runs = [...site.fall.map((r) => ({ ...r, purpose: 'fall' })), ...site.lift.map((r) => ({ ...r, purpose: 'lift' }))];
    for (const [seq, run] of runs.entries()) {
      await FallReading.create(
        {
          id: demoId(`${site.visit}:run:${seq}`),
          visitId,
          purpose: run.purpose,
          method: run.method,
          seq,
          takenAt,
          bookings: run.bookings,
          notes: '',
          createdById: advisorId,
        },
        { transaction },
      );
    }
    for (const pipe of site.pipes) {
      await PipeRun.create(
        {
          id: demoId(`${site.visit}:pipe:${pipe.purpose}`),
          visitId,
          purpose: pipe.purpose,
          lengthM: pipe.lengthM,
          diameterMm: pipe.diameterMm,
          material: pipe.material,
          pressureClass: null,
          createdById: advisorId,
        },
        { transaction },
      );
    }
    for (const [i, point] of site.points.entries()) {
      await Point.create(
        {
          id: demoId(`${site.visit}:point:${i}`),
          visitId,
          role: point.role,
          label: point.label,
          lat: point.lat,
          lon: point.lon,
          accuracyM: point.accuracyM,
          altitudeM: point.altitudeM,
          altitudeAccuracyM: point.accuracyM * 1.5,
          chainageM: null,
          capturedAt: takenAt,
          createdById: advisorId,
        },
        { transaction },
      );
    }
    if (site.visit === 'visit:brandt-hollow') await seedDemoProfile(advisorId, takenAt, transaction);
    const outcome = await screenVisit(visitId, advisorId, transaction);
    if (outcome.status === 'incomplete') throw new Error(`demo readings of ${site.visit} are incomplete: ${outcome.missing.join('; ')}`);
  }
}
