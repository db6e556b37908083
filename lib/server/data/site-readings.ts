import 'server-only';
import type { Transaction } from 'sequelize';
import { DemandLine, FallReading, FlowMeasurement, Organisation, PipeRun, Visit } from '@/lib/server/db';
import { knownDemandFigures } from '@/lib/shared/demand-kinds';
import type { SiteReadingsInput } from '@/lib/shared/schemas/site-readings';
import type { SyncEntity } from '@/lib/shared/schemas/sync';
import { buildSiteReadings } from '@/lib/shared/site-readings-input';
import { ENTITY_SPECS, pulledRecord, type SyncedRow } from '../sync/entities';

/** Rows in the protocol's shape, the one the phone holds (the pull's own conversion). */
function records<T>(entity: keyof typeof ENTITY_SPECS, rows: readonly unknown[]): T[] {
  return rows.map((row) => pulledRecord(ENTITY_SPECS[entity], row as SyncedRow) as T);
}

/** The synced records loadSiteReadings reads: a change to any other (a point, a photo) leaves the screening as it is. */
export const SCREENING_INPUTS: ReadonlySet<SyncEntity> = new Set<SyncEntity>(['flowMeasurement', 'fallReading', 'pipeRun', 'demandLine']);

/**
 * A visit's stored raw readings in the engine's input shape (not yet validated: the caller parses
 * with siteReadingsSchema, so missing readings come back as plain messages).
 */
export async function loadSiteReadings(visitId: string, transaction?: Transaction): Promise<SiteReadingsInput> {
  const visit = await Visit.findByPk(visitId, { transaction, rejectOnEmpty: true });
  const live = { visitId, deletedAt: null };
  const [flows, runs, pipes, demand, organisation] = await Promise.all([
    FlowMeasurement.findAll({ where: live, transaction }),
    FallReading.findAll({ where: live, transaction }),
    PipeRun.findAll({ where: live, transaction }),
    DemandLine.findAll({ where: { farmId: visit.farmId, deletedAt: null }, transaction }),
    Organisation.findByPk(visit.organisationId, { transaction, rejectOnEmpty: true }),
  ]);
  return buildSiteReadings({
    flows: records('flowMeasurement', flows),
    runs: records('fallReading', runs),
    pipes: records('pipeRun', pipes),
    demand: records('demandLine', demand),
    samples: 10_000,
    settings: {
      designFractionOfLowest: organisation.settings.designFractionOfLowest,
      minProbabilityForGo: organisation.settings.minProbabilityForGo,
      demandOverrides: knownDemandFigures(organisation.settings.demandFigures),
    },
  });
}
