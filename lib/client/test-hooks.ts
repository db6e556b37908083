// Hooks for the end-to-end fault tests: the app's own save and sync modules on `window`, so a test
// can put a day's worth of records into the phone's database exactly as the field pages would.
// Loaded only in builds made with NEXT_PUBLIC_FALLBOOK_TEST_HOOKS=1 (the `npm test` profile).
import { fieldDb } from './db';
import { savePhoto, saveRecord } from './outbox';
import { runSync } from './sync/runner';

export interface FallbookTestHooks {
  saveRecord: typeof saveRecord;
  savePhoto: typeof savePhoto;
  runSync: typeof runSync;
  fieldDb: typeof fieldDb;
}

declare global {
  interface Window {
    __fallbookTest?: FallbookTestHooks;
  }
}

/** Puts the hooks on `window.__fallbookTest`. */
export function installTestHooks(): void {
  window.__fallbookTest = { saveRecord, savePhoto, runSync, fieldDb };
}
