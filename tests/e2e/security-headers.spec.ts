// The app passes its own Content-Security-Policy on every kind of page (sign-in, the static field
// pages with the map, the office with the Leaflet district map, the farmer's sheet), every
// response carries the security headers, and the session cookie has the flags we configured.
import { expect, test, type BrowserContext, type Page } from '@playwright/test';
import { signInAs } from './support/sign-in';

/** Collects CSP violations (the DOM event and Chromium's console errors) from every page of a context. */
async function watchCsp(context: BrowserContext): Promise<string[]> {
  const violations: string[] = [];
  await context.exposeFunction('__reportCspViolation', (text: string) => violations.push(text));
  await context.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window as unknown as { __reportCspViolation: (t: string) => void }).__reportCspViolation(
        `${e.violatedDirective} blocked ${e.blockedURI || 'inline'} on ${location.pathname}`,
      );
    });
  });
  context.on('console', (message) => {
    // Also a Permissions-Policy the browser cannot parse (it says so on the console).
    if (/Content Security Policy|Permissions-Policy|Refused to (load|execute|apply|connect|frame|create)/i.test(message.text())) {
      violations.push(`console: ${message.text()}`);
    }
  });
  return violations;
}

async function newWatchedPage(context: BrowserContext): Promise<{ page: Page; violations: string[] }> {
  const violations = await watchCsp(context);
  return { page: await context.newPage(), violations };
}

// Three people, three contexts: each test asserts zero violations on the pages it visited.
test('sign-in, the field home, a capture page and the points map: zero CSP violations', async ({ browser }) => {
  test.setTimeout(60_000);
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  const { page, violations } = await newWatchedPage(context);
  // The field home hydrates: the visits come from the phone's database after the first sync.
  await signInAs(page, 'tobias@wenlow-water.test', /\/field$/);
  const link = page.getByRole('link', { name: /Brandt Hollow/ });
  await expect(link).toBeVisible({ timeout: 15_000 });
  const visitId = new URL((await link.getAttribute('href')) ?? '', 'http://x').searchParams.get('id') ?? '';
  expect(visitId).toMatch(/^[0-9a-f-]{36}$/);
  await page.goto(`/field/visit/flow?id=${visitId}`);
  await expect(page.getByRole('heading', { level: 1, name: 'Source and flow' })).toBeVisible();
  await expect(page.getByText('Brandt spring brook')).toBeVisible();
  await page.goto(`/field/visit/points?id=${visitId}`);
  await expect(page.locator('.leaflet-container')).toBeVisible();
  await expect(page.locator('.leaflet-marker-icon').first()).toBeVisible();
  await page.screenshot({ path: '/tmp/fallbook-security-points-map.png', fullPage: true });
  await context.close();
  expect(violations).toEqual([]);
});

test('the office table and the Leaflet district map: zero CSP violations', async ({ browser }) => {
  test.setTimeout(60_000);
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  const { page, violations } = await newWatchedPage(context);
  // The table loads its rows through the API; the map draws a marker per site.
  await signInAs(page, 'maren@wenlow-water.test', /\/office$/);
  await expect(page.getByRole('table', { name: 'Visits in the district' })).toContainText('Brandt Hollow');
  await page.goto('/office/map');
  await expect(page.locator('.fallbook-marker').first()).toBeVisible();
  await page.screenshot({ path: '/tmp/fallbook-security-office-map.png', fullPage: true });
  await context.close();
  expect(violations).toEqual([]);
});

test("a farmer's home and sheet: zero CSP violations", async ({ browser }) => {
  test.setTimeout(60_000);
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  const { page, violations } = await newWatchedPage(context);
  await signInAs(page, 'hallie@wenlow-water.test', /\/farm$/);
  await page.getByRole('link', { name: 'Read the sheet for Brandt Hollow' }).click();
  await expect(page.getByTestId('verdict')).toHaveText(/Go/);
  await expect(page.getByRole('img', { name: /Elevation profile/ })).toBeVisible();
  await page.screenshot({ path: '/tmp/fallbook-security-sheet.png' });
  await context.close();
  expect(violations).toEqual([]);
});

test('a page that breaks the policy is reported (the watcher can fail)', async ({ browser }) => {
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  const { page, violations } = await newWatchedPage(context);
  await page.goto('/login');
  // An image from another origin is outside img-src: the browser must refuse and report it.
  await page.evaluate(() => {
    const img = document.createElement('img');
    img.src = 'https://tiles.example.invalid/0/0/0.png';
    document.body.append(img);
  });
  await expect.poll(() => violations.length).toBeGreaterThan(0);
  expect(violations.join('\n')).toMatch(/img-src/);
  await context.close();
});

const EXPECTED = {
  'x-content-type-options': /^nosniff$/,
  'referrer-policy': /^strict-origin-when-cross-origin$/,
  'x-frame-options': /^DENY$/,
  'permissions-policy': /geolocation=\(self\), camera=\(self\)/,
  'content-security-policy': /default-src 'self'.*frame-ancestors 'none'.*object-src 'none'/,
};

test('an API route, a page, a static asset and the service worker carry the security headers', async ({ request, page }) => {
  await page.goto('/login');
  const script = await page.locator('script[src^="/_next/static/"]').first().getAttribute('src');
  expect(script).toBeTruthy();
  for (const path of ['/api/health', '/login', script ?? '', '/sw.js', '/icons/icon-192.png']) {
    const res = await request.get(path);
    expect(res.status(), path).toBe(200);
    const headers = res.headers();
    for (const [name, pattern] of Object.entries(EXPECTED)) expect(headers[name], `${name} on ${path}`).toMatch(pattern);
    // The test profile serves plain http: no HSTS.
    expect(headers['strict-transport-security'], path).toBeUndefined();
  }
});

test('signing in sets an HttpOnly, SameSite=Lax session cookie (not Secure over plain http)', async ({ page, context }) => {
  const setCookies: string[] = [];
  page.on('response', async (res) => {
    if (!res.url().includes('/api/auth/callback/credentials')) return;
    for (const h of await res.headersArray()) if (h.name.toLowerCase() === 'set-cookie') setCookies.push(...h.value.split('\n'));
  });
  await signInAs(page, 'ines@wenlow-water.test', /\/field$/);
  const session = setCookies.find((c) => c.startsWith('next-auth.session-token='));
  expect(session, setCookies.join('\n')).toBeDefined();
  expect(session).toMatch(/;\s*HttpOnly/i);
  expect(session).toMatch(/;\s*SameSite=Lax/i);
  expect(session).toMatch(/;\s*Path=\//i);
  expect(session).not.toMatch(/;\s*Secure/i);
  const stored = (await context.cookies()).find((c) => c.name === 'next-auth.session-token');
  expect(stored?.httpOnly).toBe(true);
  expect(stored?.sameSite).toBe('Lax');
  // Scripts on the page cannot read it.
  expect(await page.evaluate(() => document.cookie)).not.toContain('session-token');
});
