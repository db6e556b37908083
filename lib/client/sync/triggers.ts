// When the page asks for a sync: at start, after each save, on `online`, when the app comes back
// to the foreground, on a timer while open, and on the button. The page's field worker runs it
// (off the main thread, see field-host.ts); where a service worker controls the page, Background
// Sync also wakes the service worker later, even with the page closed. A Web Lock keeps one run at a time.
import { runFieldSync } from '../field-host';
import type { UploadProgress } from './photos';
import type { SyncOutcome } from './runner';
import { SYNC_NAME } from './sync-name';

const TIMER_MS = 60_000;

type SyncRegistration = ServiceWorkerRegistration & { sync?: { register(tag: string): Promise<void> } };

/** Asks for a sync now; resolves when this context's run (if any) finishes. */
export async function requestSync(onProgress?: UploadProgress, force = false): Promise<SyncOutcome | null> {
  if ('serviceWorker' in navigator && navigator.serviceWorker.controller) {
    const registration = (await navigator.serviceWorker.ready) as SyncRegistration;
    // Background Sync (Chromium) retries even after the page is closed.
    await registration.sync?.register(SYNC_NAME).catch(() => undefined);
  }
  // The page's field worker runs the loop too: it reports upload progress, and the Web Lock keeps it single.
  return runFieldSync(onProgress, force);
}

/** Wires the automatic triggers; returns a function that unwires them. */
export function startSyncTriggers(onProgress?: UploadProgress): () => void {
  const go = () => void requestSync(onProgress);
  const onVisible = () => {
    if (document.visibilityState === 'visible') go();
  };
  window.addEventListener('online', go);
  document.addEventListener('visibilitychange', onVisible);
  window.addEventListener('fallbook:saved', go);
  const timer = window.setInterval(go, TIMER_MS);
  go();
  return () => {
    window.removeEventListener('online', go);
    document.removeEventListener('visibilitychange', onVisible);
    window.removeEventListener('fallbook:saved', go);
    window.clearInterval(timer);
  };
}

/** Tells the page's triggers that something was saved. */
export function announceSave(): void {
  window.dispatchEvent(new Event('fallbook:saved'));
}
