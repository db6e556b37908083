// The page's side of the field worker (sync-worker.ts): one worker per page, started on the first
// request. It runs the sync loop and answers the frame's reads; where there is no worker (or module
// workers), or it dies, the page does the same work itself with the same modules.
import type { SessionUser } from '@/lib/shared/domain';
import type { FrameAnswer, FrameQuery } from '../frame-queries';
import type { LocalSession } from '../session';
import type { UploadProgress } from './photos';
import type { SyncOutcome } from './runner';
import type { SyncWorkerReply, SyncWorkerRequest } from './sync-worker';

type Request = SyncWorkerRequest extends infer R ? (R extends SyncWorkerRequest ? Omit<R, 'id'> : never) : never;
interface Call {
  onReply: (reply: SyncWorkerReply) => void;
  onDeath: () => void;
}

let worker: Worker | null | undefined;
let nextId = 1;
const calls = new Map<number, Call>();

// Replies are handed on in batches: answers that arrive within BATCH_MS of the first (the session,
// then the sync bar's counts and the list; after a sync, its outcome and both again) reach the page
// in one task, so React draws them in one pass instead of one pass each.
const BATCH_MS = 50;
let batch: SyncWorkerReply[] = [];

function deliverSoon(reply: SyncWorkerReply) {
  batch.push(reply);
  if (batch.length > 1) return;
  setTimeout(() => {
    const replies = batch;
    batch = [];
    for (const r of replies) calls.get(r.id)?.onReply(r);
  }, BATCH_MS);
}

function startWorker(): Worker | null {
  if (typeof Worker === 'undefined') return null;
  try {
    const started = new Worker(new URL('./sync-worker.ts', import.meta.url), { type: 'module', name: 'fallbook-field' });
    started.addEventListener('message', (event: MessageEvent<SyncWorkerReply>) => deliverSoon(event.data));
    // A worker that failed to load or crashed: the page does the work itself from now on, and what
    // was waiting on the worker is done again here (its Web Lock went with it).
    started.addEventListener('error', () => {
      worker = null;
      started.terminate();
      const waiting = [...calls.values()];
      calls.clear();
      for (const call of waiting) call.onDeath();
    });
    return started;
  } catch {
    return null;
  }
}

/** Sends a request to the worker; returns its id, or null when there is no worker. */
function send(request: Request, call: Call): number | null {
  if (worker === undefined) worker = startWorker();
  if (!worker) return null;
  const id = nextId++;
  calls.set(id, call);
  worker.postMessage({ ...request, id } as SyncWorkerRequest);
  return id;
}

/** One answer from the worker under `key`, or the same work done in the page. */
function ask<T>(request: Request, key: 'outcome' | 'session' | 'user', local: () => Promise<T>, onProgress?: UploadProgress): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const inPage = () => void local().then(resolve, reject);
    const id = send(request, {
      onReply: (reply) => {
        if ('progress' in reply) return onProgress?.(...reply.progress);
        calls.delete(reply.id);
        if (key in reply) resolve((reply as unknown as Record<typeof key, T>)[key]);
        else inPage();
      },
      onDeath: inPage,
    });
    if (id === null) inPage();
  });
}

/** Runs one sync in the worker; the page runs it where there is no worker. */
export function runSyncInWorker(onProgress: UploadProgress | undefined, force: boolean): Promise<SyncOutcome> {
  return ask({ type: 'sync', force }, 'outcome', async () => (await import('./runner')).runSync(onProgress, force), onProgress);
}

/** Who is signed in (the server asked, the phone remembering): see lib/client/session.ts. */
export function sessionFromWorker(): Promise<LocalSession> {
  return ask({ type: 'session' }, 'session', async () => (await import('../session')).loadLocalSession());
}

/** The advisor remembered on this phone, without the network. */
export function rememberedFromWorker(): Promise<SessionUser | null> {
  return ask({ type: 'remembered' }, 'user', async () => (await import('../session')).rememberedUser());
}

/** A live read of the frame (see frame-queries.ts); returns the unsubscribe. */
export function watchFrame<Q extends FrameQuery>(query: Q, onValue: (value: FrameAnswer<Q>) => void, onError: (error: unknown) => void): () => void {
  let stop: (() => void) | undefined;
  let stopped = false;
  const inPage = () =>
    void Promise.all([import('../live-query'), import('../frame-queries')]).then(([{ watchLocal }, { FRAME_QUERIES }]) => {
      if (!stopped) stop = watchLocal((db) => FRAME_QUERIES[query](db) as Promise<FrameAnswer<Q>>, onValue, onError);
    });
  const id = send(
    { type: 'watch', query },
    {
      onReply: (reply) => {
        if ('value' in reply) onValue(reply.value as FrameAnswer<Q>);
        else if ('error' in reply) onError(new Error(reply.error));
      },
      onDeath: inPage,
    },
  );
  if (id === null) inPage();
  else
    stop = () => {
      calls.delete(id);
      worker?.postMessage({ id, type: 'unwatch' } satisfies SyncWorkerRequest);
    };
  return () => {
    stopped = true;
    stop?.();
  };
}
