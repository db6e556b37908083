// Where the field pages' shared work runs: the sync loop, who is signed in, and the shared field
// queries (frame-queries.ts). One dedicated worker per page (sync/sync-worker.ts, reached through
// Comlink) does it off the main thread; where there is no Worker (or no module workers), or it
// dies, the page does the same work itself with the same modules. Pages never call this directly:
// they read through useFieldQuery, and sync through sync/triggers.ts.
import * as Comlink from 'comlink';
import type { SessionUser } from '@/lib/shared/domain';
import type { FrameAnswer, FrameArg, FrameQuery } from './frame-queries';
import type { LocalSession } from './session';
import type { UploadProgress } from './sync/photos';
import type { SyncOutcome } from './sync/runner';
import type { FieldWorkerApi } from './sync/worker-api';

interface Host {
  api: Comlink.Remote<FieldWorkerApi>;
  /** Settles when the worker failed to load or crashed: what waited on it is done in the page. */
  died: Promise<void>;
}

let host: Host | null | undefined;

function startHost(): Host | null {
  if (typeof Worker === 'undefined') return null;
  try {
    const worker = new Worker(new URL('./sync/sync-worker.ts', import.meta.url), { type: 'module', name: 'fallbook-field' });
    const died = new Promise<void>((resolve) =>
      worker.addEventListener(
        'error',
        () => {
          // Its Web Lock went with it; from now on the page does the work itself.
          host = null;
          worker.terminate();
          resolve();
        },
        { once: true },
      ),
    );
    return { api: Comlink.wrap<FieldWorkerApi>(worker), died };
  } catch {
    return null;
  }
}

function currentHost(): Host | null {
  if (host === undefined) host = startHost();
  return host;
}

// Answers are handed on in batches: those that arrive within BATCH_MS of the first (the session,
// then the sync bar's counts and the list; after a sync, its outcome and both again) reach the page
// in one task, so React draws them in one pass instead of one pass each. Each Comlink callback
// arrives as a message of its own, in a task of its own.
const BATCH_MS = 50;
let batch: (() => void)[] = [];

function deliverSoon(deliver: () => void): void {
  batch.push(deliver);
  if (batch.length > 1) return;
  setTimeout(() => {
    const due = batch;
    batch = [];
    for (const d of due) d();
  }, BATCH_MS);
}

const DIED = Symbol('worker died');

/** One answer from the worker, or the same work done in the page where there is none or it fails. */
async function ask<T>(inWorker: (api: Comlink.Remote<FieldWorkerApi>) => Promise<T>, inPage: () => Promise<T>): Promise<T> {
  const h = currentHost();
  if (!h) return inPage();
  const answer = await Promise.race([inWorker(h.api).catch(() => DIED), h.died.then(() => DIED)]);
  if (answer === DIED) return inPage();
  return new Promise<T>((resolve) => deliverSoon(() => resolve(answer as T)));
}

/** Runs one sync (see sync/runner.ts): in the worker, or in the page where there is none. */
export function runFieldSync(onProgress: UploadProgress | undefined, force: boolean): Promise<SyncOutcome> {
  return ask(
    (api) => api.sync(force, onProgress && Comlink.proxy(onProgress)),
    async () => (await import('./sync/runner')).runSync(onProgress, force),
  );
}

/** Who is signed in (the server asked, the phone remembering): see session.ts. */
export function fieldSession(): Promise<LocalSession> {
  return ask(
    (api) => api.session(),
    async () => (await import('./session')).loadLocalSession(),
  );
}

/** The advisor remembered on this phone, without the network. */
export function rememberedOnPhone(): Promise<SessionUser | null> {
  return ask(
    (api) => api.remembered(),
    async () => (await import('./session')).rememberedUser(),
  );
}

/** A live read of a named field query (frame-queries.ts) with its argument, if it takes one; returns the unsubscribe. */
export function watchFieldQuery<Q extends FrameQuery>(
  query: Q,
  onValue: (value: FrameAnswer<Q>) => void,
  onError: (error: unknown) => void,
  arg?: FrameArg<Q>,
): () => void {
  let stop: (() => void) | undefined;
  let stopped = false;
  const inPage = () =>
    void Promise.all([import('./live-query'), import('./frame-queries')]).then(([{ watchLocal }, { runFrameQuery }]) => {
      if (!stopped) stop = watchLocal((db) => runFrameQuery(db, query, arg as FrameArg<Q>), onValue, onError);
    });
  const h = currentHost();
  if (!h) {
    inPage();
  } else {
    const watching = h.api.watch(
      query,
      Comlink.proxy((value: unknown) => deliverSoon(() => !stopped && onValue(value as FrameAnswer<Q>))),
      Comlink.proxy((message: string) => deliverSoon(() => !stopped && onError(new Error(message)))),
      arg,
    );
    void Promise.race([watching.catch(() => DIED), h.died.then(() => DIED)]).then((id) => {
      if (id === DIED) return inPage();
      if (stopped) return void h.api.unwatch(id as number);
      stop = () => void h.api.unwatch(id as number);
      // A worker that dies later leaves the read to the page.
      void h.died.then(() => {
        if (!stopped) inPage();
      });
    });
  }
  return () => {
    stopped = true;
    stop?.();
  };
}
