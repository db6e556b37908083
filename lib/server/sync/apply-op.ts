import 'server-only';
import { buildRow } from '@/lib/server/db';
import { VISIT_STATUSES, type VisitStatus } from '@/lib/shared/domain';
import type { ZodError } from 'zod';
import { recordSchemas, type OpResult, type SyncOp } from '@/lib/shared/schemas/sync';
import { canMove, moveRefusal } from '@/lib/shared/visit-states';
import type { AuditInput } from '../audit';
import { SYNC_OP_PERMISSIONS } from '../auth/permissions';
import { AppError, zodFieldErrors } from '../errors';
import type { SyncAccess } from './access';
import { ENTITY_SPECS, pulledRecord, sameValue, type EntitySpec, type SyncedRow } from './entities';

type Json = Record<string, unknown>;

/** What one op did: its result, and the visit(s) whose readings it touched. */
export interface OpEffect {
  result: OpResult;
  visitId: string | null;
  farmId: string | null;
}

const rejected = (op: SyncOp, code: number, message: string, fieldErrors?: Record<string, string[]>): OpResult => ({
  opId: op.opId,
  status: 'rejected',
  rev: null,
  error: { code, message, ...(fieldErrors ? { fieldErrors } : {}) },
});

const conflicted = (op: SyncOp, spec: EntitySpec, row: SyncedRow, fields: string[]): OpResult => ({
  opId: op.opId,
  status: 'conflict',
  rev: Number(row.rev),
  conflict: { fields, server: pulledRecord(spec, row) },
});

/**
 * A record refused by `recordSchemas` (a create, or an update merged onto the server's copy), as the
 * phone's save refuses it: an uphill "fall", a 5,000 m lift or a class its material is not made in.
 */
function recordRefusal(op: SyncOp, error: ZodError): OpResult {
  const fieldErrors = Object.fromEntries(Object.entries(zodFieldErrors(error)).map(([k, v]) => [`changes.${k}`, v]));
  return rejected(op, 422, error.issues[0]?.message ?? 'This record cannot be stored.', fieldErrors);
}

const statusRank = (status: unknown) => VISIT_STATUSES.indexOf(status as (typeof VISIT_STATUSES)[number]);

/** Fields changed on the server since the phone's copy, that the op would overwrite differently. */
function conflictingFields(server: Json, changes: Json, base: Json | undefined, skip: string[]): string[] {
  return Object.keys(changes).filter(
    (field) => !skip.includes(field) && !sameValue(server[field], changes[field]) && (!base || !(field in base) || !sameValue(server[field], base[field])),
  );
}

/** The parent (visit or farm) the op belongs to, checked against the caller's access. */
async function checkParent(op: SyncOp, spec: EntitySpec, row: SyncedRow | null, access: SyncAccess) {
  if (op.entity === 'visit') {
    await access.assertOnVisit(op.entityId, SYNC_OP_PERMISSIONS.visit[op.action]);
    return { visitId: op.entityId, farmId: null };
  }
  const key = spec.parentKey as 'visitId' | 'farmId';
  const stored = row ? String(row.get(key)) : null;
  const sent = (op.changes as Json | undefined)?.[key];
  if (stored && sent !== undefined && sent !== stored) {
    throw new AppError(422, 'invalid', 'A record cannot move to another visit or farm.', { [`changes.${key}`]: ['Cannot change.'] });
  }
  const parentId = stored ?? (typeof sent === 'string' ? sent : null);
  if (!parentId) throw new AppError(422, 'invalid', `A new ${op.entity} needs its ${key}.`, { [`changes.${key}`]: ['Required.'] });
  if (key === 'farmId') {
    await access.assertCanEditDemand(parentId, SYNC_OP_PERMISSIONS.demandLine[op.action]);
    return { visitId: null, farmId: parentId };
  }
  await access.assertOnVisit(parentId, SYNC_OP_PERMISSIONS.reading[op.action]);
  return { visitId: parentId, farmId: null };
}

/** A synced row as the batch holds it: loaded (locked) or built new, changed in memory until the write. */
export interface RowState {
  spec: EntitySpec;
  row: SyncedRow;
  isNew: boolean;
  /** Fields any applied op of the batch set (the columns the write updates). */
  touched: Set<string>;
  /** An earlier op of this batch wrote it: its revision is newer than any base the phone can hold. */
  dirty: boolean;
}

/** What one applied op asks the batch writer to do: nothing (already so), or write its row once more. */
export interface OpPlan extends OpEffect {
  state: RowState | null;
  writes: boolean;
  audit: AuditInput | null;
  /** A repeated op id in the same batch: answers with that earlier applied op's outcome. */
  replayOf?: OpPlan;
  /** A conflict on a row written earlier in the batch: the writer fills in the revision it had then. */
  conflictOn?: RowState;
}

const asIso = (value: unknown) => (value instanceof Date ? value.toISOString() : value);

/**
 * Plans one parsed op against the batch's rows in memory: access, create / update / soft delete
 * with the per-field conflict check, audit line. Changes the row state only when it returns
 * 'applied' (the result's rev is filled in by the writer). Never throws for the op's own faults:
 * they come back as 'rejected'. `rows` maps "entity:id" to the batch's row states.
 */
export async function planOp(op: SyncOp, access: SyncAccess, rows: Map<string, RowState>): Promise<OpPlan> {
  const spec = ENTITY_SPECS[op.entity];
  const key = `${op.entity}:${op.entityId}`;
  const state = rows.get(key) ?? null;
  const row = state?.row ?? null;
  let parent: { visitId: string | null; farmId: string | null };
  try {
    parent = await checkParent(op, spec, row, access);
  } catch (error) {
    if (error instanceof AppError)
      return { result: rejected(op, error.status, error.message, error.fieldErrors), visitId: null, farmId: null, state: null, writes: false, audit: null };
    throw error;
  }
  const done = (result: OpResult, target: RowState | null = null, action: string | null = null, changes: Json | null = null): OpPlan => ({
    result,
    ...parent,
    state: target,
    writes: action !== null,
    audit:
      action === null
        ? null
        : {
            organisationId: access.user.organisationId,
            actorId: access.user.id,
            entity: op.entity,
            entityId: op.entityId,
            visitId: parent.visitId,
            action,
            changes,
          },
  });
  const applied = (): OpResult => ({ opId: op.opId, status: 'applied', rev: null });

  if (!state || !row) {
    if (op.action === 'delete' || op.baseRev !== null || op.entity === 'visit') {
      return done(rejected(op, 404, `No such ${op.entity} on the server.`));
    }
    const parsed = recordSchemas[op.entity].safeParse(op.changes ?? {});
    if (!parsed.success) return done(recordRefusal(op, parsed.error));
    const now = new Date();
    const built = buildRow(spec.model, { id: op.entityId, ...spec.toRow(parsed.data as Json), createdById: access.user.id, createdAt: now, updatedAt: now });
    const created: RowState = { spec, row: built, isNew: true, touched: new Set(), dirty: true };
    rows.set(key, created);
    return done(applied(), created, 'created', parsed.data as Json);
  }

  const conflict = (fields: string[]): OpPlan => ({ ...done(conflicted(op, spec, row, fields)), ...(state.dirty ? { conflictOn: state } : {}) });
  if (op.baseRev === null) return conflict([]);
  const stale = state.dirty || Number(row.rev) > op.baseRev;
  const server = spec.toFields(row);

  if (op.action === 'delete') {
    if (row.deletedAt) return done(applied(), state);
    if (stale) {
      const base = (op.base ?? {}) as Json;
      const changed = op.base ? Object.keys(base).filter((f) => !sameValue(server[f], base[f])) : [...spec.fields];
      if (changed.length > 0 || !op.base) return conflict(changed);
    }
    row.set('deletedAt', new Date());
    state.touched.add('deletedAt');
    state.dirty = true;
    return done(applied(), state, 'deleted', null);
  }

  if (row.deletedAt) return conflict(['deletedAt']);
  const changes = (op.changes ?? {}) as Json;
  // A visit's status is never a conflict: the table below decides what a phone's state change does.
  const skip = op.entity === 'visit' ? ['status'] : [];
  if (stale) {
    const fields = conflictingFields(server, changes, op.base as Json | undefined, skip);
    if (fields.length > 0) return conflict(fields);
  }
  const merged = { ...server, ...changes };
  if (op.entity === 'visit' && changes.status !== undefined && changes.status !== server.status) {
    const from = server.status as VisitStatus;
    const to = changes.status as VisitStatus;
    // A phone behind the office (it moved the visit on meanwhile) keeps the server's state; a move
    // forward must be one the table allows a phone.
    if (statusRank(from) > statusRank(to)) merged.status = from;
    else if (!canMove(from, to, 'phone')) {
      return done(rejected(op, 409, moveRefusal(from, to), { 'changes.status': ['Not a move the phone can make.'] }));
    }
  }
  if (op.entity === 'photo' && row.get('uploadedAt') && (['sha256', 'bytes'] as const).some((f) => !sameValue(server[f], merged[f]))) {
    return done(
      rejected(op, 422, 'This photo is already uploaded; its bytes cannot change. Add it as a new photo.', {
        'changes.sha256': ['Cannot change after upload.'],
      }),
    );
  }
  if (op.entity !== 'visit') {
    const checked = recordSchemas[op.entity].safeParse(merged);
    if (!checked.success) return done(recordRefusal(op, checked.error));
  }
  const next = spec.toRow(merged);
  const differing = Object.keys(next).filter((k) => !sameValue(asIso(row.get(k)), asIso(next[k])));
  if (differing.length === 0) return done(applied(), state);
  row.set(next);
  for (const k of differing) state.touched.add(k);
  state.dirty = true;
  return done(applied(), state, 'updated', changes);
}
