import 'server-only';
import path from 'node:path';
import { storageEnv } from '../env';
import { localFolderStorage } from './local-folder';
import type { BlobStorage } from './types';

export type { BlobStorage } from './types';

let photoStorage: BlobStorage | undefined;

/** The store for photo originals and thumbnails (the local folder PHOTO_DIR, default .data/photos). */
export function getPhotoStorage(): BlobStorage {
  photoStorage ??= localFolderStorage(path.resolve(process.cwd(), storageEnv().PHOTO_DIR));
  return photoStorage;
}
