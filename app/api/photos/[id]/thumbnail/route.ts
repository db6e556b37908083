// GET /api/photos/:id/thumbnail – a ≤ 480 px JPEG of the photo without metadata, for anyone who may read the visit.
import { readPhoto } from '@/lib/server/data/photos';
import { photoResponse } from '@/lib/server/http/photo-response';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';

export const runtime = 'nodejs';

// Streamed from the store, or a 302 to a short-lived signed URL (S3_SIGNED_URLS) after the access check.
export const GET = withAuth<{ id: string }>('visit:read', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  return photoResponse(await readPhoto(user, id, 'thumbnail'));
});
