import { expect, test } from '@playwright/test';

// Installability (Lighthouse 12 dropped its PWA category): the page links a manifest with the fields a
// phone needs to install the app, its icons exist as PNGs of the stated sizes, and a service worker
// whose scope covers the start URL takes control of the page.

interface ManifestIcon {
  src: string;
  sizes: string;
  type?: string;
  purpose?: string;
}

/** Width and height from a PNG's IHDR chunk. */
function pngSize(bytes: Buffer): { width: number; height: number } {
  expect(bytes.subarray(1, 4).toString('latin1')).toBe('PNG');
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

test('the manifest, its icons and a controlling service worker make the app installable', async ({ page, request }) => {
  await page.goto('/login');
  const href = await page.locator('link[rel="manifest"]').getAttribute('href');
  expect(href, 'the page links a manifest').toBeTruthy();
  const res = await request.get(href ?? '');
  expect(res.status()).toBe(200);
  const manifest = await res.json();
  expect(manifest.name).toEqual(expect.any(String));
  expect(manifest.short_name.length).toBeGreaterThan(0);
  expect(manifest.short_name.length).toBeLessThanOrEqual(12);
  expect(['standalone', 'fullscreen', 'minimal-ui']).toContain(manifest.display);
  expect(manifest.start_url).toMatch(/^\//);
  expect(manifest.start_url.startsWith(manifest.scope ?? '/')).toBe(true);
  expect(manifest.theme_color).toMatch(/^#[0-9a-f]{6}$/i);
  expect(manifest.background_color).toMatch(/^#[0-9a-f]{6}$/i);

  const icons = manifest.icons as ManifestIcon[];
  for (const wanted of ['192x192', '512x512']) {
    expect(
      icons.some((i) => i.sizes === wanted && (i.purpose ?? 'any').includes('any')),
      `an "any" icon of ${wanted}`,
    ).toBe(true);
  }
  expect(
    icons.some((i) => i.purpose?.includes('maskable')),
    'a maskable icon',
  ).toBe(true);
  for (const icon of icons) {
    const got = await request.get(icon.src);
    expect(got.status(), icon.src).toBe(200);
    expect(got.headers()['content-type']).toBe('image/png');
    const [w, h] = icon.sizes.split('x').map(Number);
    expect(pngSize(await got.body()), icon.src).toEqual({ width: w, height: h });
  }

  // The worker registers on any page; after it activates, a navigation is under its control.
  await expect
    .poll(() => page.evaluate(async () => (await navigator.serviceWorker.getRegistration())?.active?.state ?? null), { timeout: 20_000 })
    .toBe('activated');
  await page.reload();
  await expect.poll(() => page.evaluate(() => navigator.serviceWorker.controller?.scriptURL ?? null), { timeout: 20_000 }).toMatch(/\/sw\.js$/);
  const scope = await page.evaluate(async () => (await navigator.serviceWorker.getRegistration())?.scope ?? '');
  expect(new URL(manifest.start_url, scope).href.startsWith(scope)).toBe(true);
});
