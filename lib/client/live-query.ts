// A live read of the phone's database: the field worker's answers to the frame, and the same reads
// in the page where it has no field worker (see sync/in-worker.ts).
import { liveQuery } from 'dexie';
import { fieldDb, type FieldDatabase } from './db';

/** Runs `querier` now and again after every change it read; returns the unsubscribe. */
export function watchLocal<T>(querier: (db: FieldDatabase) => Promise<T>, onValue: (value: T) => void, onError: (error: unknown) => void): () => void {
  const subscription = liveQuery(() => querier(fieldDb())).subscribe({ next: onValue, error: onError });
  return () => subscription.unsubscribe();
}
