// What a refused upload must leave behind: nothing.
import { expect } from 'vitest';
import { AuditEntry, Photo } from '@/lib/server/db';
import { getPhotoStorage } from '@/lib/server/storage';

/** The photo's metadata row is still not uploaded, no original is in the store, no `uploaded` audit line. */
export async function expectNoPhotoStored(id: string, visitId: string): Promise<void> {
  const row = await Photo.findByPk(id, { rejectOnEmpty: true });
  expect([row.storageKey, row.uploadedAt]).toEqual([null, null]);
  for (const ext of ['jpg', 'png', 'webp']) expect(await getPhotoStorage().get(`photos/${visitId}/${id}.${ext}`)).toBeNull();
  expect(await AuditEntry.count({ where: { entityId: id, action: 'uploaded' } })).toBe(0);
}
