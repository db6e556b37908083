// What the field worker does for the page: it runs the sync loop, so pushing, uploading and merging
// a pull (a first pull is hundreds of rows) never hold the page's main thread, and it answers the
// named field queries (who is signed in, the sync bar's counts, the home list, a capture screen's
// records), so the frame and the home evaluate no Dexie at all. The pages' own live queries still
// see every change: Dexie tells the other contexts of the origin what was written. sync-worker.ts
// exposes this object through Comlink; the page's side is lib/client/field-host.ts.
import * as Comlink from 'comlink';
import { runFrameQuery, type FrameQuery } from '../frame-queries';
import { watchLocal } from '../live-query';
import { loadLocalSession, rememberedUser } from '../session';
import type { UploadProgress } from './photos';
import { runSync } from './runner';

const watches = new Map<number, () => void>();
let nextWatch = 1;

/** What the page may ask of the field worker. Callbacks arrive as Comlink proxies. */
export const fieldWorkerApi = {
  /** One sync run (see runner.ts); progress of photo uploads is reported as it goes. */
  async sync(force: boolean, onProgress?: UploadProgress) {
    try {
      return await runSync(onProgress ? (photoId, sent, total) => void onProgress(photoId, sent, total) : undefined, force);
    } finally {
      releaseCallback(onProgress);
    }
  },
  session: loadLocalSession,
  remembered: rememberedUser,
  /** Starts a live read of a named field query (with its argument); answers go to `onValue` until `unwatch(id)`. */
  watch(query: FrameQuery, onValue: (value: unknown) => void, onError: (message: string) => void, arg?: unknown): number {
    const id = nextWatch++;
    const stop = watchLocal(
      (db) => runFrameQuery(db, query, arg as never),
      onValue,
      (error) => onError(error instanceof Error ? error.message : String(error)),
    );
    watches.set(id, () => {
      stop();
      releaseCallback(onValue);
      releaseCallback(onError);
    });
    return id;
  },
  unwatch(id: number): void {
    watches.get(id)?.();
    watches.delete(id);
  },
};

export type FieldWorkerApi = typeof fieldWorkerApi;

/** Closes the message port behind a callback the page sent as a Comlink proxy (a plain function has none). */
function releaseCallback(callback: unknown): void {
  const release = (callback as { [Comlink.releaseProxy]?: () => void } | undefined)?.[Comlink.releaseProxy];
  if (typeof release === 'function') release.call(callback);
}
