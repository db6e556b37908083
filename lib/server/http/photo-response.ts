import 'server-only';
import type { PhotoDownload } from '../data/photos';

/** The Response for a photo download: the stream with its length, or a 302 to the signed URL (never cached: it expires). */
export function photoResponse(download: PhotoDownload): Response {
  if (download.kind === 'redirect') {
    return new Response(null, { status: 302, headers: { location: download.url, 'cache-control': 'private, no-store' } });
  }
  return new Response(download.body, {
    headers: {
      'content-type': download.contentType,
      'content-length': String(download.size),
      'cache-control': 'private, no-store',
      'x-content-type-options': 'nosniff',
    },
  });
}
