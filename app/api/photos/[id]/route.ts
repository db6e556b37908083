// PUT /api/photos/:id – the raw bytes of a photo whose metadata was pushed; GET – the original (staff only).
import { readPhoto, storePhotoUpload } from '@/lib/server/data/photos';
import { photoResponse } from '@/lib/server/http/photo-response';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';

export const runtime = 'nodejs';

export const PUT = withAuth<{ id: string }>('visit:capture', async ({ req, user, params }) => {
  const { id } = idParam.parse(params);
  return Response.json({ photo: await storePhotoUpload(user, id, req) });
});

// Farmers get 403 here: originals keep the camera's GPS; they see /thumbnail (no metadata).
// Streamed from the store, or a 302 to a short-lived signed URL (S3_SIGNED_URLS) after the same check.
export const GET = withAuth<{ id: string }>('visit:read', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  return photoResponse(await readPhoto(user, id, 'original'));
});
