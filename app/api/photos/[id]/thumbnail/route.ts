// GET /api/photos/:id/thumbnail – a ≤ 480 px JPEG of the photo without metadata, for anyone who may read the visit.
import { readPhoto } from '@/lib/server/data/photos';
import { withAuth } from '@/lib/server/http/with-auth';
import { idParam } from '@/lib/shared/schemas/list-query';

export const runtime = 'nodejs';

export const GET = withAuth<{ id: string }>('visit:read', async ({ user, params }) => {
  const { id } = idParam.parse(params);
  const { data, contentType } = await readPhoto(user, id, 'thumbnail');
  return new Response(new Uint8Array(data), {
    headers: { 'content-type': contentType, 'content-length': String(data.length), 'cache-control': 'private, max-age=86400', 'x-content-type-options': 'nosniff' },
  });
});
