import 'server-only';

/** A queue of visits worked one at a time a moment after they were queued; see screening-queue.ts. */
export interface VisitQueue {
  /** Queues the visits (a visit already waiting is not queued twice; the latest actor wins). */
  add(visitIds: string[], actorId: string | null): void;
  /** Starts the work at once (no more waiting) and resolves once every queued visit has been worked. */
  flush(): Promise<void>;
}

/**
 * Runs `work` for each queued visit in turn, `delayMs` after the first of a burst was queued (at
 * least after the current I/O turn), so a phone's batches in quick succession cost one run. A visit
 * queued again while it waits runs once; queued again while it runs, it runs once more after (so
 * the last readings are always the ones worked on). A failing run is reported and the queue goes on.
 */
export function visitQueue(
  work: (visitId: string, actorId: string | null) => Promise<unknown>,
  onError: (visitId: string, error: unknown) => void,
  delayMs = 0,
): VisitQueue {
  const due = new Map<string, string | null>();
  let draining: Promise<void> | null = null;
  let startNow: (() => void) | null = null;

  async function drain() {
    await new Promise<void>((resolve) => {
      const timer = setTimeout(resolve, delayMs);
      startNow = () => {
        clearTimeout(timer);
        resolve();
      };
    });
    startNow = null;
    for (let next = due.entries().next(); !next.done; next = due.entries().next()) {
      const [visitId, actorId] = next.value;
      due.delete(visitId);
      try {
        await work(visitId, actorId);
      } catch (error) {
        onError(visitId, error);
      }
    }
  }

  return {
    add(visitIds, actorId) {
      for (const id of visitIds) due.set(id, actorId);
      if (due.size > 0 && !draining)
        draining = drain().finally(() => {
          draining = null;
        });
    },
    async flush() {
      while (draining) {
        startNow?.();
        await draining;
      }
    },
  };
}
