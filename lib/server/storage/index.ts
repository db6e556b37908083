import 'server-only';
import path from 'node:path';
import { storageEnv } from '../env';
import { localFolderStorage } from './local-folder';
import { s3Storage, type S3Settings } from './s3';
import type { BlobStorage } from './types';

export type { BlobStorage } from './types';

let photoStorage: BlobStorage | undefined;

/** The S3 settings from .env (STORAGE_DRIVER=s3, S3_*). */
export function s3SettingsFromEnv(): S3Settings {
  const env = storageEnv();
  return {
    endpoint: env.S3_ENDPOINT || undefined,
    bucket: env.S3_BUCKET,
    region: env.S3_REGION,
    accessKeyId: env.S3_ACCESS_KEY_ID || undefined,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY || undefined,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    prefix: env.S3_PREFIX,
    signedUrlSeconds: env.S3_SIGNED_URLS ? env.S3_SIGNED_URL_SECONDS : 0,
  };
}

/** The local photo folder (PHOTO_DIR, default .data/photos), whatever the driver. */
export function localPhotoStorage(): BlobStorage {
  // A folder chosen at run time: the build must not trace the project's files through it.
  return localFolderStorage(path.resolve(/*turbopackIgnore: true*/ process.cwd(), storageEnv().PHOTO_DIR));
}

/** Where uploads are staged while they stream in and are checked (beside the local photos: one disk, so moving them in is a rename). */
export function uploadStagingDir(): string {
  return path.resolve(/*turbopackIgnore: true*/ process.cwd(), storageEnv().PHOTO_DIR, '.incoming');
}

/** The store for photo originals and thumbnails: the local folder (default) or an S3 bucket. */
export function getPhotoStorage(): BlobStorage {
  photoStorage ??= storageEnv().STORAGE_DRIVER === 's3' ? s3Storage(s3SettingsFromEnv()) : localPhotoStorage();
  return photoStorage;
}

/** Replaces the store for this process (tests run the same routes over both drivers). */
export function setPhotoStorage(storage: BlobStorage | undefined): void {
  photoStorage = storage;
}
