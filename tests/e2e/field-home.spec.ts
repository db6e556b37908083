import { expect, test } from '@playwright/test';
import { demoSession } from './support/session';

// The field home draws its frame, heading and storage caution from the static HTML (a slow phone shows
// them before any script runs); the advisor's name, counts and visits follow once the session is known,
// and the first sync is waited for rather than announced as "no visits".

test("the static field home holds the frame and nobody's data", async ({ request }) => {
  const res = await request.get('/field');
  expect(res.status()).toBe(200);
  const html = await res.text();
  expect(html).toContain('My site visits');
  expect(html).toContain('The browser may clear what the field book keeps on this phone');
  expect(html).toContain('Checking the phone…');
  expect(html).toMatch(/<button[^>]*disabled[^>]*>Sync now<\/button>/);
  // No person is known to a static page: no demo advisor's name, no visit.
  for (const name of ['Tobias', 'Ines', 'Farm']) expect(html).not.toContain(name);
});

test('a first open waits for the session, then for the first pull, without a false "no visits"', async ({ browser }) => {
  const baseURL = test.info().project.use.baseURL ?? '';
  // A phone that never opened the field book: a fresh browser profile with a signed-in session. The
  // worker is kept out so the held answers below are the page's own requests.
  const context = await browser.newContext({ baseURL, serviceWorkers: 'block' });
  const [name, value = ''] = (await demoSession('tobias@wenlow-water.test')).cookie.split(/=(.*)/s);
  await context.addCookies([{ name: name ?? '', value, url: baseURL }]);
  const page = await context.newPage();
  let releaseMe: () => void = () => {};
  let releasePull: () => void = () => {};
  const meHeld = new Promise<void>((resolve) => {
    releaseMe = resolve;
  });
  const pullHeld = new Promise<void>((resolve) => {
    releasePull = resolve;
  });
  await page.route('**/api/me', async (route) => {
    await meHeld;
    await route.continue();
  });
  await page.route('**/api/sync/pull**', async (route) => {
    await pullHeld;
    await route.continue();
  });
  await page.goto('/field');

  // Before the server answers: the frame and heading, no name, and sync waits.
  await expect(page.getByRole('heading', { name: 'My site visits' })).toBeVisible();
  await expect(page.getByTestId('sync-summary')).toHaveText('Checking the phone…');
  await expect(page.getByRole('button', { name: 'Sync now' })).toBeDisabled();
  await expect(page.getByText('Tobias Kerr')).toHaveCount(0);
  await expect(page.locator('a[href^="/field/visit?id="]')).toHaveCount(0);

  // Session confirmed, first pull still on its way: the page says so, not "no visits".
  releaseMe();
  await expect(page.getByText('Tobias Kerr')).toBeVisible();
  await expect(page.getByText('Fetching your visits from the server…')).toBeVisible();
  await expect(page.getByText(/No visits on this phone yet/)).toHaveCount(0);

  releasePull();
  await expect(page.locator('a[href^="/field/visit?id="]').first()).toBeVisible({ timeout: 15_000 });
  await expect(page.getByText('Fetching your visits from the server…')).toHaveCount(0);
  await expect(page.getByTestId('sync-summary')).toHaveText('Everything is on the server');
  await expect(page.getByText(/^Stored on this phone: [\d.,]+ [kMG]B of [\d.,]+ [kMG]B$/)).toBeVisible();
  await context.close();
});
