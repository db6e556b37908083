import 'server-only';
import { getSequelize } from '@/lib/server/db';
import { recordScreeningFailure, screenVisit } from './screening';
import { visitQueue } from './visit-queue';

// Screening after a push is the office's bookkeeping, not the phone's answer: it runs after the
// push has answered, one visit at a time, half a second after the first push of a burst, so a
// phone's batches (and a burst of phones) are not slowed by it, and a visit pushed again before its
// turn is screened once, from the readings stored by then. A restart drops the queue: those visits
// are screened on their next push (their readings are safe).
const SCREENING_DELAY_MS = 500;

const queue = visitQueue(
  (visitId, actorId) => getSequelize().transaction((transaction) => screenVisit(visitId, actorId, transaction)),
  // The readings are committed; a failed screening is logged, shown in the visit's history, and
  // retried on the next push.
  (visitId, error) => {
    console.error('[fallbook] screening after sync failed', visitId, error);
    recordScreeningFailure(visitId).catch((e) => console.error('[fallbook] screening failure not recorded', visitId, e));
  },
  SCREENING_DELAY_MS,
);

/** Queues the visits for screening after the current request. */
export const screenSoon = (visitIds: string[], actorId: string | null) => queue.add(visitIds, actorId);

/** Runs the queued screenings now and resolves once they are done (the tests wait on it). */
export const flushScreenings = () => queue.flush();
