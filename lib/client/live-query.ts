// A live read of the phone's database, wherever it runs: the field worker's shared queries, and the
// page's own reads (app/(field)/field/_components/use-field-query.ts).
import { liveQuery } from 'dexie';
import { fieldDb, type FieldDatabase } from './db';

/** Runs `querier` now and again after every change it read; returns the unsubscribe. */
export function watchLocal<T>(querier: (db: FieldDatabase) => T | Promise<T>, onValue: (value: T) => void, onError: (error: unknown) => void): () => void {
  const subscription = liveQuery(() => querier(fieldDb())).subscribe({ next: onValue, error: onError });
  return () => subscription.unsubscribe();
}
