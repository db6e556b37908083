import 'server-only';
import { randomUUID } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { copyFile, link, mkdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { Readable } from 'node:stream';
import { assertSafeKey, type BlobStorage } from './types';

const isMissing = (error: unknown) => (error as NodeJS.ErrnoException).code === 'ENOENT';

/** Keeps blobs as files under one folder; writes go to a temporary file first, then rename. */
export function localFolderStorage(root: string): BlobStorage {
  const fileOf = (key: string) => {
    assertSafeKey(key);
    return path.join(root, ...key.split('/'));
  };
  /** Puts the bytes under the key through a `.part` file renamed into place (atomic on one disk). */
  const place = async (key: string, write: (temp: string) => Promise<void>) => {
    const file = fileOf(key);
    await mkdir(path.dirname(file), { recursive: true });
    const temp = `${file}.${randomUUID()}.part`;
    try {
      await write(temp);
      await rename(temp, file);
    } catch (error) {
      await rm(temp, { force: true });
      throw error;
    }
  };
  return {
    async put(key, data) {
      await place(key, (temp) => writeFile(temp, data));
    },
    async putFile(key, source) {
      // A hard link costs nothing when the upload was staged on the same disk; otherwise the kernel copies.
      await place(key, (temp) =>
        link(source, temp).catch((error: NodeJS.ErrnoException) => {
          if (error.code !== 'EXDEV' && error.code !== 'EPERM') throw error;
          return copyFile(source, temp);
        }),
      );
    },
    async get(key) {
      try {
        return await readFile(fileOf(key));
      } catch (error) {
        if (isMissing(error)) return null;
        throw error;
      }
    },
    async open(key) {
      const file = fileOf(key);
      try {
        const { size } = await stat(file);
        return { size, body: Readable.toWeb(createReadStream(file)) as ReadableStream<Uint8Array> };
      } catch (error) {
        if (isMissing(error)) return null;
        throw error;
      }
    },
    async remove(key) {
      await rm(fileOf(key), { force: true });
    },
  };
}
