import 'server-only';

/** Where photo bytes live. Drivers: the local folder (`local-folder.ts`) and S3-compatible buckets (`s3.ts`). */
export interface BlobStorage {
  /** Stores the bytes under the key, replacing what was there (written whole or not at all). */
  put(key: string, data: Buffer, contentType: string): Promise<void>;
  /** The bytes under the key, or null when there are none. */
  get(key: string): Promise<Buffer | null>;
  /** Removes the key; no error when it is missing. */
  remove(key: string): Promise<void>;
}

const KEY = /^[a-z0-9][a-z0-9._-]*(\/[a-z0-9][a-z0-9._-]*)*$/;

/** Refuses keys that could escape the store (`..`, absolute paths, odd characters). */
export function assertSafeKey(key: string): void {
  if (!KEY.test(key) || key.includes('..')) throw new Error(`unsafe storage key: ${key}`);
}
