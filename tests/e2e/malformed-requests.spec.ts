// A malformed percent-encoding in a dynamic segment, which Next itself would answer with a bare
// 500, gets a plain 400 with a message; well-formed addresses are untouched.
import { expect, test } from '@playwright/test';

test('a malformed percent-encoding in a dynamic segment is a 400 with a plain message, on API routes and pages', async ({ request }) => {
  for (const path of ['/api/visits/%E0%A4%A', '/api/photos/%ZZ', '/api/invitations/%E0%A4%A/accept', '/sheets/%E0%A4%A', '/welcome/%ZZ']) {
    const method = path.endsWith('/accept') ? 'POST' : 'GET';
    const res = await request.fetch(path, { method, maxRedirects: 0 });
    expect(res.status(), path).toBe(400);
    expect((await res.json()).error.message).toMatch(/not valid/);
  }
});

test('well-formed addresses still reach the app (a signed-out API call is a 401, the office a sign-in redirect)', async ({ request }) => {
  expect((await request.get('/api/me')).status()).toBe(401);
  const office = await request.get('/office', { maxRedirects: 0 });
  expect([302, 307]).toContain(office.status());
  expect(office.headers().location).toMatch(/\/login/);
});

test('TRACE is a 405 naming the method, and TRACK a 400 from Node\u2019s parser: never a 500', async ({ baseURL }) => {
  const http = await import('node:http');
  for (const method of ['TRACE', 'TRACK']) {
    const { status, body } = await new Promise<{ status: number; body: string }>((resolve, reject) => {
      const req = http.request(new URL('/api/health', baseURL), { method }, (res) => {
        let text = '';
        res.on('data', (c) => {
          text += c;
        });
        res.on('end', () => resolve({ status: res.statusCode ?? 0, body: text }));
      });
      req.on('error', reject);
      req.end();
    });
    if (method === 'TRACK') {
      // Node's HTTP parser does not know TRACK and answers 400 before any handler runs.
      expect(status, method).toBe(400);
      continue;
    }
    expect(status, method).toBe(405);
    expect(JSON.parse(body).error.message).toBe(`${method} is not allowed here.`);
  }
});
