import 'server-only';
import { createHash } from 'node:crypto';
import { Op } from 'sequelize';
import { Photo } from '@/lib/server/db';
import { thumbnailKey } from './photo-keys';
import type { BlobStorage } from './types';

export interface CopyReport {
  /** Photos looked at (those with stored bytes). */
  photos: number;
  /** Objects written and read back with the same sha-256. */
  copied: number;
  /** Objects already in the target with the same sha-256 (a resumed run skips them). */
  present: number;
  /** Keys missing from the source, or whose bytes do not match the recorded sha-256: left alone. */
  problems: string[];
}

const sha256 = (data: Buffer) => createHash('sha256').update(data).digest('hex');

/** Copies one key unless the target already holds the same bytes; verifies by reading it back. */
async function copyKey(source: BlobStorage, target: BlobStorage, key: string, contentType: string, expected: string | null, report: CopyReport) {
  const data = await source.get(key);
  if (!data) return void report.problems.push(`${key}: missing in the source`);
  const hash = sha256(data);
  if (expected && hash !== expected) return void report.problems.push(`${key}: sha-256 ${hash} differs from the recorded ${expected}`);
  const existing = await target.get(key);
  if (existing && sha256(existing) === hash) return void report.present++;
  await target.put(key, data, contentType);
  const back = await target.get(key);
  if (!back || sha256(back) !== hash) throw new Error(`${key}: the copy read back does not match (sha-256 ${hash})`);
  report.copied++;
}

/**
 * Copies every stored photo (original and thumbnail) from one store to another, in id order.
 * Resumable: what is already there with the right hash is skipped. `limit` stops after that many photos;
 * `visitIds` copies only those visits' photos (one district first).
 */
export async function copyPhotos(
  source: BlobStorage,
  target: BlobStorage,
  options: { limit?: number; visitIds?: string[]; onPhoto?: (n: number) => void } = {},
): Promise<CopyReport> {
  const report: CopyReport = { photos: 0, copied: 0, present: 0, problems: [] };
  let after = '';
  for (;;) {
    const page = await Photo.findAll({
      where: { storageKey: { [Op.ne]: null }, id: { [Op.gt]: after }, ...(options.visitIds ? { visitId: options.visitIds } : {}) },
      attributes: ['id', 'storageKey', 'sha256', 'mime'],
      order: [['id', 'ASC']],
      limit: 200,
    });
    for (const photo of page) {
      if (options.limit !== undefined && report.photos >= options.limit) return report;
      const key = photo.storageKey as string;
      await copyKey(source, target, key, photo.mime, photo.sha256, report);
      await copyKey(source, target, thumbnailKey(key), 'image/jpeg', null, report);
      report.photos++;
      options.onPhoto?.(report.photos);
    }
    const last = page.at(-1);
    if (!last) return report;
    after = last.id;
  }
}
