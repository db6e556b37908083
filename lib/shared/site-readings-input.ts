// The one builder of the engine's input from a visit's records, for the phone's live preview and the
// server's screen alike: the same records in the same order give the same readings on both.
import type { SiteReadingsInput } from './schemas/site-readings';
import type { EntityFields } from './schemas/sync';

type Rec<E extends 'flowMeasurement' | 'fallReading' | 'pipeRun' | 'demandLine'> = EntityFields<E> & { id: string; deletedAt?: string | null };

export interface VisitRecords {
  flows: readonly Rec<'flowMeasurement'>[];
  runs: readonly Rec<'fallReading'>[];
  pipes: readonly Rec<'pipeRun'>[];
  demand: readonly Rec<'demandLine'>[];
  /** The organisation's screen settings (from the server, or as the phone last pulled them). */
  settings: { designFractionOfLowest?: number; minProbabilityForGo?: number; demandOverrides?: Record<string, number> };
  /** Monte Carlo samples: the server's 10,000; fewer on a phone so its preview stays instant. */
  samples: number;
}

const live = <T extends { deletedAt?: string | null }>(rows: readonly T[]) => rows.filter((r) => !r.deletedAt);
const byId = (a: { id: string }, b: { id: string }) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
const time = (iso: string | null) => (iso ? Date.parse(iso) : Number.NEGATIVE_INFINITY);

export function buildSiteReadings(r: VisitRecords): SiteReadingsInput {
  const flows = live(r.flows).sort((a, b) => time(a.takenAt) - time(b.takenAt) || byId(a, b));
  const runs = live(r.runs).sort((a, b) => a.seq - b.seq || byId(a, b));
  const liftRuns = runs.filter((x) => x.purpose === 'lift');
  const direct = liftRuns.find((x) => x.run.method === 'direct');
  const lift =
    direct && direct.run.method === 'direct'
      ? { kind: 'direct' as const, staticLiftM: direct.run.staticLiftM, method: direct.run.liftMethod, uncertaintyM: direct.run.uncertaintyM }
      : { kind: 'runs' as const, bookedFrom: liftRuns[0]?.bookedFrom ?? 'pump', runs: liftRuns.map((x) => x.run) };
  const pipe = (purpose: 'drive' | 'delivery' | 'feed') => {
    const row = live(r.pipes).find((p) => p.purpose === purpose);
    return row
      ? { lengthM: row.lengthM ?? undefined, diameterMm: row.diameterMm ?? undefined, material: row.material, pressureClass: row.pressureClass ?? undefined }
      : undefined;
  };
  const feed = pipe('feed');
  return {
    flowMeasurements: flows.map((f) => ({ ...f.measurement, id: f.id, ...(f.takenAt ? { takenAt: f.takenAt } : {}) })),
    fallRuns: runs.filter((x) => x.purpose === 'fall').map((x) => x.run),
    lift,
    drivePipe: pipe('drive') ?? {},
    ...(feed?.lengthM ? { feedPipe: { lengthM: feed.lengthM, diameterMm: feed.diameterMm, material: feed.material } } : {}),
    deliveryPipe: pipe('delivery'),
    demand: live(r.demand)
      .sort(byId)
      .map((d) => ({ kind: d.kind, count: d.count, litresPerHeadPerDay: d.litresPerHeadPerDay })),
    settings: {
      ...(r.settings.designFractionOfLowest !== undefined ? { designFractionOfLowest: r.settings.designFractionOfLowest } : {}),
      ...(r.settings.minProbabilityForGo !== undefined ? { minProbabilityForGo: r.settings.minProbabilityForGo } : {}),
      ...(r.settings.demandOverrides ? { demandOverrides: r.settings.demandOverrides } : {}),
    },
    monteCarlo: { samples: r.samples, seed: 1 },
  } as SiteReadingsInput;
}
