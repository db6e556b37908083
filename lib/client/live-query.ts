// The Dexie side of useLocalQuery, loaded on demand: a field page draws and hydrates without
// evaluating Dexie or opening the phone's database first (on a slow phone each is a long task).
import { liveQuery } from 'dexie';
import { fieldDb, type FieldDatabase } from './db';

/** Runs `querier` now and again after every change it read; returns the unsubscribe. */
export function watchLocal<T>(querier: (db: FieldDatabase) => Promise<T>, onValue: (value: T) => void,
  onError: (error: unknown) => void): () => void {
  const subscription = liveQuery(() => querier(fieldDb())).subscribe({ next: onValue, error: onError });
  return () => subscription.unsubscribe();
}
