import 'server-only';
import { knownDemandFigures } from '@/lib/shared/demand-kinds';
import type { Transaction } from 'sequelize';
import { DemandLine, FallReading, FlowMeasurement, Organisation, PipeRun, Visit } from '@/lib/server/db';
import type { SiteReadingsInput } from '@/lib/shared/schemas/site-readings';

type Json = Record<string, unknown>;
const asObject = (value: unknown): Json => (value && typeof value === 'object' && !Array.isArray(value) ? (value as Json) : {});

/**
 * A visit's stored raw readings in the engine's input shape (not yet validated: the caller parses
 * with siteReadingsSchema, so missing readings come back as plain messages).
 */
export async function loadSiteReadings(visitId: string, transaction?: Transaction): Promise<SiteReadingsInput> {
  const visit = await Visit.findByPk(visitId, { transaction, rejectOnEmpty: true });
  const live = { visitId, deletedAt: null };
  const [flows, runs, pipes, demand, organisation] = await Promise.all([
    FlowMeasurement.findAll({ where: live, order: [['takenAt', 'ASC'], ['id', 'ASC']], transaction }),
    FallReading.findAll({ where: live, order: [['purpose', 'ASC'], ['seq', 'ASC'], ['id', 'ASC']], transaction }),
    PipeRun.findAll({ where: live, transaction }),
    DemandLine.findAll({ where: { farmId: visit.farmId, deletedAt: null }, order: [['id', 'ASC']], transaction }),
    Organisation.findByPk(visit.organisationId, { transaction, rejectOnEmpty: true }),
  ]);

  const fallRuns = runs.filter((r) => r.purpose === 'fall').map((r) => ({ method: r.method, ...asObject(r.bookings) }));
  const liftRows = runs.filter((r) => r.purpose === 'lift');
  const direct = liftRows.find((r) => r.method === 'direct');
  const lift = direct
    ? { kind: 'direct', ...asObject(direct.bookings) }
    : { kind: 'runs', bookedFrom: asObject(liftRows[0]?.bookings).bookedFrom ?? 'pump',
        runs: liftRows.map((r) => {
          const { bookedFrom: _ignored, ...rest } = asObject(r.bookings);
          return { method: r.method, ...rest };
        }) };
  const pipe = (purpose: string) => {
    const row = pipes.find((p) => p.purpose === purpose);
    if (!row) return undefined;
    return {
      lengthM: row.lengthM ?? undefined,
      diameterMm: row.diameterMm ?? undefined,
      material: row.material,
      pressureClass: row.pressureClass ?? undefined,
    };
  };

  return {
    flowMeasurements: flows.map((f) => ({
      id: f.id, method: f.method, season: f.season, takenAt: f.takenAt?.toISOString(), ...asObject(f.readings),
    })),
    fallRuns,
    lift,
    drivePipe: pipe('drive') ?? {},
    ...(pipe('feed')?.lengthM ? { feedPipe: { lengthM: pipe('feed')?.lengthM, diameterMm: pipe('feed')?.diameterMm, material: pipe('feed')?.material } } : {}),
    deliveryPipe: pipe('delivery'),
    demand: demand.map((d) => ({ kind: d.kind, count: d.count, litresPerHeadPerDay: d.litresPerHeadPerDay })),
    settings: {
      designFractionOfLowest: organisation.settings.designFractionOfLowest,
      ...(organisation.settings.minProbabilityForGo !== undefined ? { minProbabilityForGo: organisation.settings.minProbabilityForGo } : {}),
      demandOverrides: knownDemandFigures(organisation.settings.demandFigures),
    },
    monteCarlo: { samples: 10_000, seed: 1 },
  } as SiteReadingsInput;
}
