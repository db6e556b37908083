// Rules about a visit's state that the office pages and the server share.
import type { VisitStatus } from './domain';
import { formatDay, isoDay } from './display/dates';

export interface VisitTiming {
  status: VisitStatus;
  plannedOn: string | null;
  advisorId?: string | null;
  lastSyncedAt: string | Date | null;
}

/** Today as YYYY-MM-DD (UTC), the form planned dates are stored in. */
export function todayIso(now = new Date()): string {
  return isoDay(now);
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

/** The earliest planned date the office may enter: older ones are typing slips. */
export const EARLIEST_PLANNED_DAY = '2000-01-01';

/** The latest planned date: two years from today (a season's plan, with room to spare). */
export function latestPlannedDay(today = todayIso()): string {
  const d = new Date(`${today}T00:00:00Z`);
  d.setUTCFullYear(d.getUTCFullYear() + 2);
  return d.toISOString().slice(0, 10);
}

/** Why a planned date is refused (not a real day, before 2000, more than two years ahead), or null. */
export function plannedDayProblem(day: string, today = todayIso()): string | null {
  const d = new Date(`${day}T00:00:00Z`);
  if (Number.isNaN(d.getTime()) || d.toISOString().slice(0, 10) !== day) return 'Pick a real date.';
  if (day < EARLIEST_PLANNED_DAY) return `Pick a date from ${formatDay(EARLIEST_PLANNED_DAY)} on.`;
  const latest = latestPlannedDay(today);
  if (day > latest) return `Plan at most two years ahead: ${formatDay(latest)} at the latest.`;
  return null;
}

/** The field message for a past planned date that was not confirmed. */
export const PAST_DAY_UNCONFIRMED = 'That day has passed. Tick “Yes, the date is in the past” to keep it.';

/** Whether a planned date lies before today (it then needs the person's confirmation). */
export function isPastDay(day: string | null | undefined, today = todayIso()): boolean {
  return !!day && day < today;
}
