// A sheet source built by running the real engine over invented readings (like the demo's Brandt Hollow).
import { screenSite } from '@/lib/engine';
import { siteReadingsSchema } from '@/lib/shared/schemas/site-readings';
import type { SheetSource } from '@/lib/shared/sheet/view-model';

export function brandtLikeSource(
  demand = [
    { kind: 'beef-cow-nursing', count: 14 },
    { kind: 'person-tap-on-plot', count: 4 },
  ],
): SheetSource {
  const readings = siteReadingsSchema.parse({
    flowMeasurements: [
      {
        id: 'f1',
        method: 'volumetric',
        season: 'dry',
        trials: [
          { volumeL: 20, seconds: 10.4 },
          { volumeL: 20, seconds: 10.9 },
          { volumeL: 20, seconds: 10.1 },
        ],
      },
    ],
    fallRuns: [
      {
        method: 'level',
        rows: [{ backsightM: 1.842 }, { foresightM: 2.618, backsightM: 0.512 }, { foresightM: 2.309, backsightM: 0.688 }, { foresightM: 2.215 }],
      },
    ],
    lift: {
      kind: 'runs',
      bookedFrom: 'pump',
      runs: [
        {
          method: 'clinometer',
          legs: [
            { slopeDistanceM: 60, angleBelowHorizontalDeg: -9 },
            { slopeDistanceM: 55, angleBelowHorizontalDeg: -12 },
            { slopeDistanceM: 70, angleBelowHorizontalDeg: -7 },
          ],
        },
      ],
    },
    drivePipe: { lengthM: 24, material: 'galvanized-steel' },
    deliveryPipe: { lengthM: 420, material: 'hdpe' },
    demand,
    settings: { designFractionOfLowest: 0.5, demandOverrides: {} },
    monteCarlo: { samples: 2000, seed: 1 },
  });
  const screening = screenSite(readings);
  return {
    visitId: '00000000-0000-4000-8000-000000000001',
    farm: { name: 'Test Hollow', area: 'Lower test valley', ownerName: 'Hallie Test' },
    advisorName: 'Tobias Test',
    visitedAt: '2026-11-20T10:00:00Z',
    screenedAt: '2026-11-21T09:00:00Z',
    screening,
    points: [
      { role: 'intake', label: 'Intake pool', lat: 52.41931, lon: -3.61702 },
      { role: 'pump', label: 'Ram site', lat: 52.41912, lon: -3.61668 },
      { role: 'tank', label: 'Meadow bench', lat: 52.41835, lon: -3.61403 },
    ],
    pipeLengthsM: { drive: 24, delivery: 420 },
    demandKinds: demand.map((d) => d.kind),
  };
}

/** The same farm where the tank stands 2.5 m below the intake: a gravity supply ("No pump needed"). */
export function gravitySource(): SheetSource {
  const screening = screenSite(
    siteReadingsSchema.parse({
      flowMeasurements: [{ method: 'volumetric', season: 'dry', trials: [{ volumeL: 20, seconds: 10 }] }],
      fallRuns: [{ method: 'hose', steps: [{ upperReadingM: 0, lowerReadingM: 4 }] }],
      lift: { kind: 'direct', staticLiftM: 1.5, method: 'level' },
      deliveryPipe: { lengthM: 300, material: 'hdpe' },
      demand: [{ kind: 'person-tap-on-plot', count: 4 }],
      monteCarlo: { samples: 500, seed: 1 },
    }),
  );
  return { ...brandtLikeSource(), screening };
}
