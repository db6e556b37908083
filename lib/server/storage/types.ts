import 'server-only';

/** A stored blob opened for reading: its bytes as a stream and its length. */
export interface BlobStream {
  body: ReadableStream<Uint8Array>;
  size: number;
}

/** Where photo bytes live. Drivers: the local folder (`local-folder.ts`) and S3-compatible buckets (`s3.ts`). */
export interface BlobStorage {
  /** Stores the bytes under the key, replacing what was there (written whole or not at all). */
  put(key: string, data: Buffer, contentType: string): Promise<void>;
  /**
   * Stores a file's bytes under the key, streamed (never read whole into memory), written whole or
   * not at all. `sha256` (hex) is the file's hash when known: a store that can verify it does.
   */
  putFile(key: string, file: string, contentType: string, sha256?: string): Promise<void>;
  /** The bytes under the key, or null when there are none. */
  get(key: string): Promise<Buffer | null>;
  /** The bytes under the key as a stream, or null when there are none (downloads: never buffered). */
  open(key: string): Promise<BlobStream | null>;
  /** Removes the key; no error when it is missing. */
  remove(key: string): Promise<void>;
  /**
   * A short-lived URL that fetches the key straight from the store, when the driver offers them
   * (S3 with S3_SIGNED_URLS); the caller must have checked access first.
   */
  signedUrl?(key: string): Promise<string>;
}

const KEY = /^[a-z0-9][a-z0-9._-]*(\/[a-z0-9][a-z0-9._-]*)*$/;

/** Refuses keys that could escape the store (`..`, absolute paths, odd characters). */
export function assertSafeKey(key: string): void {
  if (!KEY.test(key) || key.includes('..')) throw new Error(`unsafe storage key: ${key}`);
}
