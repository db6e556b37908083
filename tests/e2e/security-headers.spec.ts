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
        `${e.violatedDirective} blocked ${e.blockedURI || 'inline'} on ${location.pathname}`);
    });
  });
  context.on('console', (message) => {
    if (/Content Security Policy|Refused to (load|execute|apply|connect|frame|create)/i.test(message.text())) {
      violations.push(`console: ${message.text()}`);
    }
  });
  return violations;
}

async function newWatchedPage(context: BrowserContext): Promise<{ page: Page; violations: string[] }> {
  const violations = await watchCsp(context);
  return { page: await context.newPage(), violations };
}

test('sign-in, the field pages with the map, the office map and a sheet run with zero CSP violations', async ({ browser }) => {
  const baseURL = test.info().project.use.baseURL;

  // Advisor: sign-in page, field home (hydrated: the visits come from the phone's database), a
  // capture page and the points map.
  const field = await browser.newContext({ baseURL });
  const { page, violations } = await newWatchedPage(field);
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
  await field.close();

  // Coordinator: the office table loads its rows through the API, the district map draws markers.
  const office = await browser.newContext({ baseURL });
  const officeWatch = await newWatchedPage(office);
  await signInAs(officeWatch.page, 'maren@wenlow-water.test', /\/office$/);
  await expect(officeWatch.page.getByRole('table', { name: 'Visits in the district' })).toContainText('Brandt Hollow');
  await officeWatch.page.goto('/office/map');
  await expect(officeWatch.page.locator('.fallbook-marker').first()).toBeVisible();
  await office.close();

  // Farmer: the sheet with its profile drawing.
  const farm = await browser.newContext({ baseURL });
  const farmWatch = await newWatchedPage(farm);
  await signInAs(farmWatch.page, 'hallie@wenlow-water.test', /\/farm$/);
  await farmWatch.page.getByRole('link', { name: 'Read the sheet for Brandt Hollow' }).click();
  await expect(farmWatch.page.getByTestId('verdict')).toHaveText(/Go/);
  await expect(farmWatch.page.getByRole('img', { name: /Elevation profile/ })).toBeVisible();
  await farm.close();

  expect([...violations, ...officeWatch.violations, ...farmWatch.violations]).toEqual([]);
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
