import { describe, expect, it } from 'vitest';
import { refusalMessage } from '@/lib/client/sync/photos';

describe('refusalMessage', () => {
  it("reads the server's JSON error message", () => {
    expect(refusalMessage(415, JSON.stringify({ error: { code: 'unsupported', message: 'That file is not a JPEG, PNG or WebP photo.' } }))).toBe(
      'That file is not a JPEG, PNG or WebP photo.',
    );
  });
  it('falls back to the status for a page that is not JSON or has no message', () => {
    expect(refusalMessage(413, '<html>Request Entity Too Large</html>')).toBe('The server refused the photo (413).');
    expect(refusalMessage(422, JSON.stringify({ error: {} }))).toBe('The server refused the photo (422).');
  });
});
