// Loading a capture screen's checks (lib/client/record-checks.ts) once, on first use: the first touch,
// focus or key on the screen, or a save. The schemas then evaluate after the screen has painted,
// not during its first render. The service worker precaches the chunk, so it loads with no signal.
import { useEffect } from 'react';

type RecordChecks = typeof import('./record-checks');

let loading: Promise<RecordChecks> | null = null;
let loaded: RecordChecks | null = null;

/** The checks, loaded once; a failed load (a dropped connection) is tried again on the next call. */
export function loadRecordChecks(): Promise<RecordChecks> {
  loading ??= import('./record-checks').then(
    (checks) => (loaded = checks),
    (error: unknown) => {
      loading = null;
      throw error;
    },
  );
  return loading;
}

/** The checks when already loaded (inside a database transaction, which must not wait on a fetch), else null. */
export function loadedRecordChecks(): RecordChecks | null {
  return loaded;
}

const FIRST_USE = ['pointerdown', 'focusin', 'keydown'] as const;

/** Starts loading the checks at the first touch, focus or key anywhere on the page. */
export function useRecordChecksOnFirstUse(): void {
  useEffect(() => {
    if (loaded) return;
    const start = () => {
      stop();
      loadRecordChecks().catch(() => {
        // Tried again at the save, which tells the advisor if it still fails.
      });
    };
    const stop = () => FIRST_USE.forEach((type) => document.removeEventListener(type, start, true));
    FIRST_USE.forEach((type) => document.addEventListener(type, start, { capture: true, passive: true }));
    return stop;
  }, []);
}
