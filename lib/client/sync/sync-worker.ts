// A dedicated worker for the field pages: it runs the sync loop, so pushing, uploading and merging
// a pull (a first pull is hundreds of rows) never hold the page's main thread, and it answers the
// frame's own reads (who is signed in, the sync bar's counts, the home list), so the frame and the
// home evaluate no Dexie at all. The pages' other live queries still see every change: Dexie tells
// the other contexts of the origin what was written.
import type { FieldDatabase } from '../db';
import { FRAME_QUERIES, type FrameQuery } from '../frame-queries';
import { watchLocal } from '../live-query';
import { loadLocalSession, rememberedUser, type LocalSession } from '../session';
import type { SessionUser } from '@/lib/shared/domain';
import { runSync, type SyncOutcome } from './runner';

export type SyncWorkerRequest =
  | { id: number; type: 'sync'; force: boolean }
  | { id: number; type: 'watch'; query: FrameQuery }
  | { id: number; type: 'unwatch' }
  | { id: number; type: 'session' }
  | { id: number; type: 'remembered' };

export type SyncWorkerReply =
  | { id: number; progress: [photoId: string, sentBytes: number, totalBytes: number] }
  | { id: number; outcome: SyncOutcome }
  | { id: number; value: unknown }
  | { id: number; session: LocalSession }
  | { id: number; user: SessionUser | null }
  | { id: number; error: string };

// Typed by hand: the project's TypeScript settings know the window, not a worker's global scope.
const scope = self as unknown as {
  postMessage(message: SyncWorkerReply): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<SyncWorkerRequest>) => void): void;
};

const watches = new Map<number, () => void>();
const failed = (id: number) => (error: unknown) => scope.postMessage({ id, error: error instanceof Error ? error.message : String(error) });

scope.addEventListener('message', (event) => {
  const request = event.data;
  const { id } = request;
  switch (request.type) {
    case 'sync':
      runSync((photoId, sent, total) => scope.postMessage({ id, progress: [photoId, sent, total] }), request.force).then(
        (outcome) => scope.postMessage({ id, outcome }),
        failed(id),
      );
      break;
    case 'watch': {
      const query = FRAME_QUERIES[request.query] as (db: FieldDatabase) => Promise<unknown>;
      watches.set(
        id,
        watchLocal(query, (value) => scope.postMessage({ id, value }), failed(id)),
      );
      break;
    }
    case 'unwatch':
      watches.get(id)?.();
      watches.delete(id);
      break;
    case 'session':
      loadLocalSession().then((session) => scope.postMessage({ id, session }), failed(id));
      break;
    case 'remembered':
      rememberedUser().then((user) => scope.postMessage({ id, user }), failed(id));
      break;
  }
});
