import 'server-only';
import type { Transaction } from 'sequelize';
import { AuditEntry, batchInsert } from '@/lib/server/db';

export interface AuditInput {
  organisationId: string;
  actorId: string | null;
  entity: string;
  entityId: string;
  visitId?: string | null;
  action: string;
  changes?: Record<string, unknown> | null;
}

/** Appends one line to the audit log (who changed what, and when); in the caller's transaction. */
export async function recordAudit(entry: AuditInput, transaction?: Transaction): Promise<void> {
  await AuditEntry.create({ ...entry, visitId: entry.visitId ?? null, changes: entry.changes ?? null }, { transaction });
}

/** Appends many audit lines in one statement (a push batch's applied ops); in the caller's transaction. */
export async function recordAudits(entries: AuditInput[], transaction: Transaction): Promise<void> {
  if (entries.length === 0) return;
  const createdAt = new Date();
  await batchInsert(
    AuditEntry,
    entries.map((entry) => ({ ...entry, visitId: entry.visitId ?? null, changes: entry.changes ?? null, createdAt })),
    transaction,
  );
}
