import 'server-only';
import { Farm, Photo, Visit, getSequelize } from '@/lib/server/db';
import { MAX_PHOTO_BYTES } from '@/lib/shared/reading-limits';
import { recordAudit } from '../audit';
import { authorize, type Permission, type SessionUser } from '../auth/permissions';
import { invalid, notFound } from '../errors';
import { stageBody } from '../http/stage-body';
import { checkPhotoHead, checkPhotoImage } from '../services/photo-image';
import { getPhotoStorage, uploadStagingDir } from '../storage';
import { thumbnailKey } from '../storage/photo-keys';

export interface PhotoUploadOutcome {
  id: string;
  uploadedAt: string;
  width: number | null;
  height: number | null;
  /** False when the same bytes were already stored (a repeated upload changes nothing). */
  stored: boolean;
}

/** The photo's metadata row, if it exists and the caller holds the permission on its visit. */
async function getPhotoOrThrow(user: SessionUser, id: string, permission: Permission): Promise<Photo> {
  const photo = await Photo.findOne({ where: { id, deletedAt: null } });
  const visit = photo && (await Visit.findOne({ where: { id: photo.visitId, deletedAt: null }, include: [{ model: Farm, attributes: ['ownerId'] }] }));
  if (!photo || !visit) throw notFound('photo');
  authorize(user, permission, {
    organisationId: visit.organisationId,
    advisorIds: visit.advisorId ? [visit.advisorId] : [],
    ownerId: (visit as Visit & { Farm?: Farm }).Farm?.ownerId ?? null,
  });
  return photo;
}

/**
 * After a failed store (the bucket or the database refused half-way): removes what was written, unless
 * a parallel upload of the same photo has claimed the key meanwhile. Best effort; the phone retries.
 */
async function removeUnclaimed(id: string, key: string) {
  const row = await Photo.findByPk(id, { attributes: ['storageKey'] }).catch(() => null);
  if (row?.storageKey) return;
  const storage = getPhotoStorage();
  await Promise.all([storage.remove(key), storage.remove(thumbnailKey(key))]).catch(() => undefined);
}

/**
 * Stores the body of PUT /api/photos/:id: streamed to a staging file (memory stays flat), refused as
 * soon as it passes the size cap or its first bytes are not a photo; its size and sha-256 must match
 * the pushed metadata and its content must decode; then the original and a metadata-free thumbnail
 * go to storage and only then is the row marked uploaded. The staging file is always deleted.
 */
export async function storePhotoUpload(user: SessionUser, id: string, req: Request): Promise<PhotoUploadOutcome> {
  const photo = await getPhotoOrThrow(user, id, 'visit:capture');
  const staged = await stageBody(req, { dir: uploadStagingDir(), maxBytes: MAX_PHOTO_BYTES, what: 'The photo', checkHead: checkPhotoHead });
  try {
    if (staged.bytes !== photo.bytes || staged.sha256 !== photo.sha256) {
      throw invalid('The photo did not arrive whole — it will be sent again.', {
        body: [`Got ${staged.bytes} bytes (sha-256 ${staged.sha256.slice(0, 12)}…), expected ${photo.bytes} (${photo.sha256.slice(0, 12)}…).`],
      });
    }
    if (photo.uploadedAt && photo.storageKey) {
      return { id, uploadedAt: photo.uploadedAt.toISOString(), width: photo.width, height: photo.height, stored: false };
    }
    const image = await checkPhotoImage(staged.file);
    const key = `photos/${photo.visitId}/${photo.id}.${image.ext}`;
    const storage = getPhotoStorage();
    try {
      await storage.putFile(key, staged.file, image.mime, staged.sha256);
      await storage.put(thumbnailKey(key), image.thumbnail, 'image/jpeg');
      const uploadedAt = new Date();
      await getSequelize().transaction(async (transaction) => {
        const row = await Photo.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE, rejectOnEmpty: true });
        await row.update({ storageKey: key, uploadedAt, width: image.width, height: image.height, mime: image.mime }, { transaction });
        await recordAudit(
          {
            organisationId: user.organisationId,
            actorId: user.id,
            entity: 'photo',
            entityId: id,
            visitId: photo.visitId,
            action: 'uploaded',
            changes: { bytes: staged.bytes, mime: image.mime, width: image.width, height: image.height },
          },
          transaction,
        );
      });
      return { id, uploadedAt: uploadedAt.toISOString(), width: image.width, height: image.height, stored: true };
    } catch (error) {
      await removeUnclaimed(id, key);
      throw error;
    }
  } finally {
    await staged.discard();
  }
}

/** How a stored photo is served: its bytes as a stream, or (S3_SIGNED_URLS) a short-lived URL to the store. */
export type PhotoDownload = { kind: 'stream'; body: ReadableStream<Uint8Array>; size: number; contentType: string } | { kind: 'redirect'; url: string };

/** A stored photo after the access check: the original (staff: photo:original) or the thumbnail (visit:read). */
export async function readPhoto(user: SessionUser, id: string, variant: 'original' | 'thumbnail'): Promise<PhotoDownload> {
  const photo = await getPhotoOrThrow(user, id, variant === 'original' ? 'photo:original' : 'visit:read');
  if (!photo.storageKey) throw notFound('uploaded photo (it has not arrived from the phone yet)');
  const key = variant === 'original' ? photo.storageKey : thumbnailKey(photo.storageKey);
  const storage = getPhotoStorage();
  if (storage.signedUrl) return { kind: 'redirect', url: await storage.signedUrl(key) };
  const opened = await storage.open(key);
  if (!opened) throw notFound('stored photo');
  return { kind: 'stream', ...opened, contentType: variant === 'original' ? photo.mime : 'image/jpeg' };
}
