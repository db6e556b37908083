import 'server-only';
import { createHash, randomUUID } from 'node:crypto';
import { mkdir, open, readdir, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import { tooLarge } from '../errors';

/** A request body written to a staging file: its length and sha-256, and how to throw it away. */
export interface StagedBody {
  file: string;
  bytes: number;
  sha256: string;
  /** Deletes the staging file (always call it, stored or refused). */
  discard(): Promise<void>;
}

/** A staging file this old belongs to an upload whose server died mid-way: nothing will finish it. */
const STALE_MS = 60 * 60 * 1000;
const lastSweep = new Map<string, number>();

/** Deletes staging files left by a crashed server, at most every 10 minutes per folder (never awaited). */
async function sweepStale(dir: string, now = Date.now()) {
  if (now - (lastSweep.get(dir) ?? 0) < 10 * 60 * 1000) return;
  lastSweep.set(dir, now);
  for (const name of await readdir(dir).catch(() => [] as string[])) {
    if (!name.endsWith('.upload')) continue;
    const file = path.join(dir, name);
    const info = await stat(file).catch(() => null);
    if (info && now - info.mtimeMs > STALE_MS) await rm(file, { force: true });
  }
}

/** How many leading bytes `checkHead` sees (enough for every photo format's signature). */
export const HEAD_BYTES = 16;

/**
 * Streams the body into a new file in `dir`, chunk by chunk, so memory stays flat whatever its size:
 * past `maxBytes` it stops with a 413 (Content-Length is checked first when sent); the sha-256 is
 * computed on the way; `checkHead` sees the first bytes as soon as they arrive and may throw to refuse
 * the upload at once. On any refusal or failure the file is deleted before the error is rethrown.
 */
export async function stageBody(
  req: Request,
  options: { dir: string; maxBytes: number; what: string; checkHead?: (head: Buffer) => void },
): Promise<StagedBody> {
  const { dir, maxBytes, what, checkHead } = options;
  const tooBig = () => tooLarge(`${what} is larger than ${Math.round(maxBytes / 1024 / 1024)} MB.`);
  const declared = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > maxBytes) throw tooBig();
  await mkdir(dir, { recursive: true });
  void sweepStale(dir).catch(() => undefined);
  const file = path.join(dir, `${randomUUID()}.upload`);
  const discard = () => rm(file, { force: true });
  const handle = await open(file, 'wx');
  const reader = req.body?.getReader();
  const hash = createHash('sha256');
  let head: Buffer | null = Buffer.alloc(0);
  let total = 0;
  try {
    for (;;) {
      const next = reader ? await reader.read() : { done: true as const, value: undefined };
      if (next.done) break;
      const chunk = next.value;
      total += chunk.byteLength;
      if (total > maxBytes) throw tooBig();
      if (head) {
        head = Buffer.concat([head, chunk.subarray(0, HEAD_BYTES)]).subarray(0, HEAD_BYTES);
        if (head.length === HEAD_BYTES) {
          checkHead?.(head);
          head = null;
        }
      }
      hash.update(chunk);
      // Awaiting each write is the back-pressure: the next chunk is read only once this one is on disk.
      await handle.write(chunk);
    }
    if (head && head.length > 0) checkHead?.(head);
    await handle.close();
  } catch (error) {
    await reader?.cancel().catch(() => undefined);
    await handle.close().catch(() => undefined);
    await discard();
    throw error;
  }
  return { file, bytes: total, sha256: hash.digest('hex'), discard };
}
