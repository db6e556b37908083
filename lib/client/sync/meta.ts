// Small key/value facts the phone keeps: cursor, signed-in user, settings, last sync, pause.
import { fieldDb } from '../db';

export async function getMeta<T>(key: string): Promise<T | undefined> {
  return (await fieldDb().meta.get(key))?.value as T | undefined;
}

export async function setMeta(key: string, value: unknown): Promise<void> {
  await fieldDb().meta.put({ key, value });
}

export interface SyncRecord {
  at: string;
  ok: boolean;
  message: string | null;
  pushed: number;
  pulled: number;
  photos: number;
}
