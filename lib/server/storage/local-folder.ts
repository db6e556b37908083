import 'server-only';
import { randomUUID } from 'node:crypto';
import { mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { assertSafeKey, type BlobStorage } from './types';

/** Keeps blobs as files under one folder; writes go to a temporary file first, then rename. */
export function localFolderStorage(root: string): BlobStorage {
  const fileOf = (key: string) => {
    assertSafeKey(key);
    return path.join(root, ...key.split('/'));
  };
  return {
    async put(key, data) {
      const file = fileOf(key);
      await mkdir(path.dirname(file), { recursive: true });
      const temp = `${file}.${randomUUID()}.part`;
      await writeFile(temp, data);
      await rename(temp, file);
    },
    async get(key) {
      try {
        return await readFile(fileOf(key));
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw error;
      }
    },
    async remove(key) {
      await rm(fileOf(key), { force: true });
    },
  };
}
