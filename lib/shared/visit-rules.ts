// Rules about a visit's state that the office pages and the server share.
import type { VisitStatus } from './domain';

export interface VisitTiming {
  status: VisitStatus;
  plannedOn: string | null;
  advisorId?: string | null;
  lastSyncedAt: string | Date | null;
}

/** Today as YYYY-MM-DD (UTC), the form planned dates are stored in. */
export function todayIso(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/** Overdue: still waiting for the walk (requested or booked) and the planned day has passed. */
export function isOverdue(v: VisitTiming, today = todayIso()): boolean {
  return (v.status === 'requested' || v.status === 'scheduled') && !!v.plannedOn && v.plannedOn < today;
}

/**
 * Whether the advisor's phone may hold readings the server has not seen: the walk could have
 * happened (booked or walked, planned day reached) and nothing has synced since the planned day.
 * Reassigning such a visit warns first, because the new advisor would start without that data.
 */
export function mayHoldUnsyncedData(v: VisitTiming, today = todayIso()): boolean {
  if (!v.advisorId || !v.plannedOn) return false;
  if (v.status !== 'scheduled' && v.status !== 'surveyed') return false;
  if (v.plannedOn > today) return false;
  if (!v.lastSyncedAt) return true;
  const synced = typeof v.lastSyncedAt === 'string' ? v.lastSyncedAt : v.lastSyncedAt.toISOString();
  return synced.slice(0, 10) < v.plannedOn;
}
