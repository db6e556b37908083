import 'server-only';
import { createHash } from 'node:crypto';
import type { Transaction } from 'sequelize';
import { ENGINE_VERSION, screenSite } from '@/lib/engine';
import { canonicalJson } from '@/lib/shared/canonical-json';
import { siteReadingsSchema } from '@/lib/shared/schemas/site-readings';
import { Screening, Visit } from '@/lib/server/db';
import { recordAudit } from '../audit';
import { loadSiteReadings } from '../data/site-readings';

export type ScreenVisitOutcome =
  | { status: 'screened'; screeningId: string; verdict: string }
  | { status: 'unchanged'; screeningId: string; verdict: string }
  | { status: 'incomplete'; missing: string[] };

/**
 * Runs the engine over the visit's stored readings and stores the screening, unless the same
 * inputs were already screened by this engine version. Incomplete readings are reported, not stored.
 */
export async function screenVisit(visitId: string, actorId: string | null, transaction?: Transaction): Promise<ScreenVisitOutcome> {
  const raw = await loadSiteReadings(visitId, transaction);
  const parsed = siteReadingsSchema.safeParse(raw);
  if (!parsed.success) {
    return { status: 'incomplete', missing: parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`) };
  }
  const inputsHash = createHash('sha256').update(canonicalJson(parsed.data)).digest('hex');
  const latest = await Screening.findOne({ where: { visitId }, order: [['createdAt', 'DESC']], transaction });
  if (latest && latest.inputsHash === inputsHash && latest.engineVersion === ENGINE_VERSION) {
    return { status: 'unchanged', screeningId: latest.id, verdict: latest.verdict };
  }
  const result = screenSite(parsed.data);
  const visit = await Visit.findByPk(visitId, { transaction, rejectOnEmpty: true });
  const row = await Screening.create(
    {
      id: crypto.randomUUID(),
      visitId,
      engineVersion: result.engineVersion,
      inputsHash,
      inputs: parsed.data,
      result,
      verdict: result.verdict,
      probabilityMeetsDemand: result.figures.probabilityMeetsDemand?.value ?? null,
      deliveryLpd: result.figures.deliveryLpd?.value ?? null,
      demandLpd: result.figures.demandLpd?.value ?? null,
    },
    { transaction },
  );
  await recordAudit(
    {
      organisationId: visit.organisationId,
      actorId,
      entity: 'screening',
      entityId: row.id,
      visitId,
      action: 'screened',
      changes: { verdict: result.verdict, engineVersion: result.engineVersion },
    },
    transaction,
  );
  return { status: 'screened', screeningId: row.id, verdict: result.verdict };
}

/**
 * Why the visit cannot be screened now, in the schema's own plain messages (no field paths), for
 * the office's visit page; empty when it can.
 */
export async function screeningBlockers(visitId: string): Promise<string[]> {
  const parsed = siteReadingsSchema.safeParse(await loadSiteReadings(visitId));
  return parsed.success ? [] : [...new Set(parsed.error.issues.map((i) => i.message))];
}

/** Leaves a line in the visit's history when the screen failed on the server (the office sees it). */
export async function recordScreeningFailure(visitId: string): Promise<void> {
  const visit = await Visit.findByPk(visitId);
  if (!visit) return;
  await recordAudit({
    organisationId: visit.organisationId,
    actorId: null,
    entity: 'screening',
    entityId: visitId,
    visitId,
    action: 'screening-failed',
    changes: { message: 'The screen could not run on the server. The readings are kept; it runs again on the next sync.' },
  });
}
