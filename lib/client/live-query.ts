// A live read in the page itself, loaded on demand: the frame's reads where the page has no field
// worker (see sync/in-worker.ts).
import { liveQuery } from 'dexie';
import { fieldDb, type FieldDatabase } from './db';

/** Runs `querier` now and again after every change it read; returns the unsubscribe. */
export function watchLocal<T>(querier: (db: FieldDatabase) => Promise<T>, onValue: (value: T) => void,
  onError: (error: unknown) => void): () => void {
  const subscription = liveQuery(() => querier(fieldDb())).subscribe({ next: onValue, error: onError });
  return () => subscription.unsubscribe();
}
