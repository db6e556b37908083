// The one table of a visit's allowed moves, and who may make each. The office's route handlers, the
// farmer's sheet, the sheet send, the commissioning check and the sync push all ask it; the office
// page offers only what it allows. A coordinator may still jump outside it, with a stated reason
// that is audited.
import { VISIT_STATUS_LABELS, VISIT_STATUSES, type VisitStatus } from './domain';

/**
 * Who makes a move:
 * - office: a coordinator by hand (the visit page, or booking an advisor and a date);
 * - phone: the assigned advisor's phone (a synced change of the visit);
 * - farmer: the farmer on the sheet (read it, go ahead, not now);
 * - app: the app itself when something happens (readings synced, sheet sent, ram commissioned).
 */
export type MoveBy = 'office' | 'phone' | 'farmer' | 'app';

type Moves = Partial<Record<VisitStatus, readonly MoveBy[]>>;

export const VISIT_MOVES: Record<VisitStatus, Moves> = {
  requested: { scheduled: ['office'], cancelled: ['office'] },
  scheduled: { surveyed: ['phone', 'app', 'office'], requested: ['office'], cancelled: ['office'] },
  surveyed: { screened: ['office', 'app'], sent: ['app'], scheduled: ['office'], cancelled: ['office'] },
  screened: { sent: ['app'], surveyed: ['office'], commissioned: ['app'], cancelled: ['office'] },
  sent: { acknowledged: ['farmer'], agreed: ['farmer'], declined: ['farmer'], commissioned: ['app'], cancelled: ['office'] },
  acknowledged: { agreed: ['farmer'], declined: ['farmer'], commissioned: ['app'], cancelled: ['office'] },
  agreed: { installed: ['office'], declined: ['farmer'], commissioned: ['app'], cancelled: ['office'] },
  declined: { agreed: ['farmer'], scheduled: ['office'], cancelled: ['office'] },
  installed: { commissioned: ['app'], cancelled: ['office'] },
  commissioned: {},
  cancelled: { requested: ['office'] },
};

/** Whether `by` may move a visit from `from` to `to` (staying put is not a move). */
export function canMove(from: VisitStatus, to: VisitStatus, by: MoveBy): boolean {
  return VISIT_MOVES[from]?.[to]?.includes(by) ?? false;
}

/** The states `by` may move a visit to from `from`, in the life's order. */
export function nextStates(from: VisitStatus, by: MoveBy): VisitStatus[] {
  return VISIT_STATUSES.filter((to) => canMove(from, to, by));
}

/** The shortest a coordinator's reason for a jump outside the table may be. */
export const JUMP_REASON_MIN = 5;

/** A person's sentence for a refused move. */
export function moveRefusal(from: VisitStatus, to: VisitStatus): string {
  return `A visit cannot go from “${VISIT_STATUS_LABELS[from]}” to “${VISIT_STATUS_LABELS[to]}” in one step.`;
}

/** The states in which the farmer may read the sheet: once it has been sent. */
export const SHEET_RELEASED: readonly VisitStatus[] = ['sent', 'acknowledged', 'agreed', 'declined', 'installed', 'commissioned'];

/** Visits still under way for their farm (a second one for the same farm is warned about). */
export const ACTIVE_STATUSES: readonly VisitStatus[] = ['requested', 'scheduled', 'surveyed', 'screened', 'sent', 'acknowledged', 'agreed', 'installed'];
