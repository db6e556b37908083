// The phone's records of one visit in the engine's input shape, for the live preview offline.
// Mirrors lib/server/data/site-readings.ts (the server recomputes the same screen on sync).
import type { SiteReadingsInput } from '@/lib/shared/schemas/site-readings';
import type { PullResponse } from '@/lib/shared/schemas/sync';
import { fieldDb } from './db';
import { getMeta } from './sync/meta';

const live = <T extends { deletedAt: string | null }>(rows: T[]) => rows.filter((r) => !r.deletedAt);

export async function localSiteReadings(visitId: string): Promise<SiteReadingsInput | null> {
  const db = fieldDb();
  const visit = await db.visits.get(visitId);
  if (!visit) return null;
  const [flows, runs, pipes, demand, settings] = await Promise.all([
    db.flowMeasurements.where('visitId').equals(visitId).toArray(),
    db.fallReadings.where('visitId').equals(visitId).toArray(),
    db.pipeRuns.where('visitId').equals(visitId).toArray(),
    db.demandLines.where('farmId').equals(visit.farmId).toArray(),
    getMeta<PullResponse['settings']>('settings'),
  ]);
  const ordered = live(runs).sort((a, b) => a.seq - b.seq);
  const liftRuns = ordered.filter((r) => r.purpose === 'lift');
  const direct = liftRuns.find((r) => r.run.method === 'direct');
  const lift = direct && direct.run.method === 'direct'
    ? { kind: 'direct' as const, staticLiftM: direct.run.staticLiftM, method: direct.run.liftMethod, uncertaintyM: direct.run.uncertaintyM }
    : { kind: 'runs' as const, bookedFrom: liftRuns[0]?.bookedFrom ?? 'pump', runs: liftRuns.map((r) => r.run) };
  const pipe = (purpose: 'drive' | 'delivery' | 'feed') => {
    const row = live(pipes).find((p) => p.purpose === purpose);
    return row ? { lengthM: row.lengthM ?? undefined, diameterMm: row.diameterMm ?? undefined, material: row.material, pressureClass: row.pressureClass ?? undefined } : undefined;
  };
  return {
    flowMeasurements: live(flows).map((f) => f.measurement),
    fallRuns: ordered.filter((r) => r.purpose === 'fall').map((r) => r.run),
    lift,
    drivePipe: pipe('drive') ?? {},
    ...(pipe('feed')?.lengthM ? { feedPipe: { lengthM: pipe('feed')?.lengthM, diameterMm: pipe('feed')?.diameterMm, material: pipe('feed')?.material } } : {}),
    deliveryPipe: pipe('delivery'),
    demand: live(demand).map((d) => ({ kind: d.kind, count: d.count, litresPerHeadPerDay: d.litresPerHeadPerDay })),
    settings: settings
      ? { designFractionOfLowest: settings.designFractionOfLowest, demandOverrides: settings.demandFigures, ...(settings.minProbabilityForGo !== undefined ? { minProbabilityForGo: settings.minProbabilityForGo } : {}) }
      : {},
    // Fewer samples than the server's 10,000: the phone's preview stays instant on a slow handset.
    monteCarlo: { samples: 2000, seed: 1 },
  } as SiteReadingsInput;
}
