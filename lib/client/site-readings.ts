// The phone's records of one visit in the engine's input shape, for the live preview offline, built
// by the same function the server's screen uses.
import { buildSiteReadings } from '@/lib/shared/site-readings-input';
import type { SiteReadingsInput } from '@/lib/shared/schemas/site-readings';
import type { PullResponse } from '@/lib/shared/schemas/sync';
import { fieldDb } from './db';
import { getMeta } from './sync/meta';

/** Monte Carlo samples on the phone: fewer than the server's 10,000, so the preview stays instant on a slow handset. */
const PHONE_SAMPLES = 2000;

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
  return buildSiteReadings({
    flows,
    runs,
    pipes,
    demand,
    samples: PHONE_SAMPLES,
    settings: settings
      ? { designFractionOfLowest: settings.designFractionOfLowest, minProbabilityForGo: settings.minProbabilityForGo, demandOverrides: settings.demandFigures }
      : {},
  });
}
