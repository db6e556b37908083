// The office's district map on a desktop and a phone: it fits the valley (the farm typed ~290 km
// away is left off and named), near marks gather into numbered groups, each site is labelled by
// its farm, and farms with no visit show with their own mark and a way to plan one.
import { expect, test, type Page } from '@playwright/test';
import { signInAs } from './support/sign-in';

const shots = '/tmp/office-map-shots';

async function openMap(page: Page) {
  await signInAs(page, 'maren@wenlow-water.test', /\/office$/);
  await page.goto('/office/map');
  await expect(page.locator('.fallbook-cluster, .fallbook-marker').first()).toBeVisible();
}

// The map's span in kilometres, read from Leaflet's scale bar (it shows a round length of the map).
async function scaleKm(page: Page): Promise<number> {
  const text = (await page.locator('.leaflet-control-scale-line').first().textContent()) ?? '';
  const [, n = 'NaN', unit] = /([\d.]+)\s*(km|m)/.exec(text) ?? [];
  return unit === 'km' ? Number(n) : Number(n) / 1000;
}

for (const [label, viewport] of [
  ['desktop', { width: 1280, height: 900 }],
  ['phone', { width: 412, height: 915 }],
] as const) {
  test(`the district map fits the valley and names the far stray (${label})`, async ({ page }) => {
    await page.setViewportSize(viewport);
    await openMap(page);
    const note = page.getByRole('note', { name: 'Left off the map' });
    await expect(note).toContainText('Tŷ Isaf');
    await expect(note).toContainText(/about 2\d\d km away/);
    // A valley, not a country: the scale bar stays within a few kilometres.
    expect(await scaleKm(page)).toBeLessThanOrEqual(5);
    await expect(page.locator('.fallbook-cluster').first()).toBeVisible();
    await expect(page.getByRole('list', { name: 'Legend' })).toContainText('Farm without a visit');
    await page.screenshot({ path: `${shots}/office-map-${label}.png`, fullPage: true });
  });
}

test('every site and farm is on the map, alone or counted in a group; zoomed in, marks carry their farm names', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 900 });
  await openMap(page);
  // What the map should hold, from the list beside it: one mark for each site and each farm without a visit.
  const items = await page.locator('details li').allTextContents();
  // Two farms never had a visit; Quarry Bank's only one was cancelled.
  expect(items.filter((t) => t.includes('no visit yet'))).toHaveLength(3);
  // The list keeps the stray the map leaves off.
  const expected = items.length - (await page.getByRole('note', { name: 'Left off the map' }).getByRole('listitem').count());
  expect(expected).toBeGreaterThanOrEqual(38);
  const count = async () => {
    const groups = await page.locator('.fallbook-cluster').allTextContents();
    return groups.reduce((n, t) => n + Number(t), 0) + (await page.locator('.leaflet-marker-icon.fallbook-marker').count());
  };
  await expect.poll(count).toBe(expected);
  for (let i = 0; i < 3; i++) {
    await page.locator('.leaflet-control-zoom-in').click();
    await page.waitForTimeout(400);
  }
  await expect(page.locator('.fallbook-label').first()).toBeVisible();
  await page.screenshot({ path: `${shots}/office-map-zoomed-desktop.png` });
});
