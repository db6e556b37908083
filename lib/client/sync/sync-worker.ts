// A dedicated worker that runs the sync loop for the page, so pushing, uploading and merging a
// pull (a first pull is hundreds of rows) never hold the page's main thread. The page's live
// queries still see every change: Dexie tells the other contexts of the origin what was written.
import { runSync, type SyncOutcome } from './runner';

export interface SyncWorkerRequest { id: number; force: boolean }
export type SyncWorkerReply =
  | { id: number; progress: [photoId: string, sentBytes: number, totalBytes: number] }
  | { id: number; outcome: SyncOutcome }
  | { id: number; error: string };

// Typed by hand: the project's TypeScript settings know the window, not a worker's global scope.
const scope = self as unknown as {
  postMessage(message: SyncWorkerReply): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<SyncWorkerRequest>) => void): void;
};

scope.addEventListener('message', (event) => {
  const { id, force } = event.data;
  runSync((photoId, sent, total) => scope.postMessage({ id, progress: [photoId, sent, total] }), force).then(
    (outcome) => scope.postMessage({ id, outcome }),
    (error: unknown) => scope.postMessage({ id, error: error instanceof Error ? error.message : String(error) }),
  );
});
