// The page's side of the sync worker: one worker per page, started on the first request, with a
// fallback to running the loop in the page where workers (or module workers) are not available.
import type { UploadProgress } from './photos';
import type { SyncOutcome } from './runner';
import type { SyncWorkerReply, SyncWorkerRequest } from './sync-worker';

interface Pending { resolve: (outcome: SyncOutcome) => void; reject: (error: Error) => void; onProgress?: UploadProgress }

let worker: Worker | null | undefined;
let nextId = 1;
const pending = new Map<number, Pending>();

function failAll(error: Error): void {
  for (const call of pending.values()) call.reject(error);
  pending.clear();
}

function startWorker(): Worker | null {
  if (typeof Worker === 'undefined') return null;
  try {
    const started = new Worker(new URL('./sync-worker.ts', import.meta.url), { type: 'module', name: 'fallbook-sync' });
    started.addEventListener('message', (event: MessageEvent<SyncWorkerReply>) => {
      const reply = event.data;
      const call = pending.get(reply.id);
      if (!call) return;
      if ('progress' in reply) call.onProgress?.(...reply.progress);
      else {
        pending.delete(reply.id);
        if ('outcome' in reply) call.resolve(reply.outcome);
        else call.reject(new Error(reply.error));
      }
    });
    // A worker that failed to load or crashed: the page runs the loop itself from now on.
    started.addEventListener('error', () => {
      worker = null;
      started.terminate();
      failAll(new Error('The sync worker stopped.'));
    });
    return started;
  } catch {
    return null;
  }
}

/** Runs one sync in the worker; falls back to the page when there is no worker. */
export async function runSyncInWorker(onProgress: UploadProgress | undefined, force: boolean): Promise<SyncOutcome> {
  if (worker === undefined) worker = startWorker();
  if (!worker) {
    const { runSync } = await import('./runner');
    return runSync(onProgress, force);
  }
  const id = nextId++;
  const reply = new Promise<SyncOutcome>((resolve, reject) => pending.set(id, { resolve, reject, onProgress }));
  worker.postMessage({ id, force } satisfies SyncWorkerRequest);
  try {
    return await reply;
  } catch {
    // The worker died under this run: whatever it had not finished is still on the phone, and the
    // Web Lock it held is gone with it, so the page can run the loop itself at once.
    const { runSync } = await import('./runner');
    return runSync(onProgress, force);
  }
}
