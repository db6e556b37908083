// What a capture screen needs only to check a record: the shared schemas (zod), the resolver that
// puts their messages at the form's fields, and the "is this right?" questions. Screens load it
// through `loadRecordChecks` (lib/client/load-record-checks.ts) when the advisor first uses a form
// or saves, so a screen paints without evaluating it.
import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldValues, Resolver } from 'react-hook-form';
import type { UnitSystem } from '@/lib/shared/domain';
import { messagesByPath, plainIssueMessage } from '@/lib/shared/field-messages';
import { unusualIn, withConfirmations } from '@/lib/shared/plausibility';
import { MAX_PIPE_BORE_MM, MAX_PIPE_LENGTH_M } from '@/lib/shared/reading-limits';
import { flowMeasurementSchema } from '@/lib/shared/schemas/site-readings';
import { entityFields, recordSchemas, type EntityFields, type SyncEntity } from '@/lib/shared/schemas/sync';
import * as z from '@/lib/shared/zod';
import { RecordRefused } from './record-refused';

export { messagesByPath, unusualIn, withConfirmations, flowMeasurementSchema };

const LOCAL_ONLY = new Set(['id', 'rev', 'deletedAt', 'updatedAt']);
const VISIT_WRITABLE = ['notes', 'status', 'visitedAt'];
const changesOnly = (fields: Record<string, unknown>) => Object.fromEntries(Object.entries(fields).filter(([k]) => VISIT_WRITABLE.includes(k)));

/** Checks the whole record the save would leave (the phone's copy with these fields over it). */
export function checkRecord<E extends SyncEntity>(entity: E, record: Record<string, unknown>, units: UnitSystem = 'metric'): RecordRefused | null {
  const fields = Object.fromEntries(Object.entries(record).filter(([k]) => !LOCAL_ONLY.has(k)));
  // A visit's life is the office's (its pulled state may be any); the phone writes only notes, walked-on and surveyed.
  const schema = entity === 'visit' ? recordSchemas.visit.partial() : recordSchemas[entity];
  const parsed = schema.safeParse(entity === 'visit' ? changesOnly(fields) : fields, { error: (issue) => plainIssueMessage(issue, units) });
  if (!parsed.success) return new RecordRefused(messagesByPath(parsed.error.issues, units), []);
  const open = unusualIn(entity, parsed.data as EntityFields<E>, units).filter((u) => !u.confirmed);
  return open.length ? new RecordRefused({}, open) : null;
}

/** react-hook-form's resolver over the entity's shared schema, its messages in the advisor's units. */
export function recordResolver(entity: SyncEntity, units: UnitSystem): Resolver<FieldValues> {
  return zodResolver(recordSchemas[entity] as never, { error: (issue) => plainIssueMessage(issue, units) }) as unknown as Resolver<FieldValues>;
}

// The pipes screen edits its three runs as one form: each run's fields from the shared pipe-run schema.
const pipe = entityFields.pipeRun.pick({ material: true }).extend({
  lengthM: z
    .number({ error: (issue) => (issue.code === 'invalid_type' ? 'Measure the length along the route.' : undefined) })
    .positive('Length must be more than 0.')
    .max(MAX_PIPE_LENGTH_M),
  diameterMm: z.number().positive('Diameter must be more than 0.').max(MAX_PIPE_BORE_MM).optional(),
});
const pipeRunsSchema = z.object({ drive: pipe.partial({ lengthM: true }), delivery: pipe, feed: pipe.partial({ lengthM: true }) });
export type PipeRunsValues = z.infer<typeof pipeRunsSchema>;

/** react-hook-form's resolver for the pipes screen's drive, delivery and feed runs, in the advisor's units. */
export function pipeRunsResolver(units: UnitSystem): Resolver<PipeRunsValues> {
  return zodResolver(pipeRunsSchema, { error: (issue) => plainIssueMessage(issue, units) });
}
