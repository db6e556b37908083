// The field map on a phone: it opens on the farm (never the whole world), "Use this fix" puts the pin
// in view, a saved point shows at once, the tiles around the advisor's visits are kept while online
// and drawn from the phone's cache with no signal, and a visit taken off the phone takes its tiles
// with it. The tiles come from the local fake tile server (scripts/lib/fake-tiles.mjs).
import { expect, test, type Page } from '@playwright/test';
import { query } from './support/db';
import { coordinatorApi, pressSync, waitForHooks } from './support/phone';
import { signInAs, waitForWorker } from './support/sign-in';

test.setTimeout(180_000);

// A farm of its own, 7 km from the demo farms, so its tiles are its own.
const FARM = { lat: 52.47, lon: -3.7 };
const FIX = { latitude: 52.4708, longitude: -3.6989, accuracy: 4 };

/** The tiles the map drew: zoom from the address, and whether the 256 px picture arrived (offline, past the kept area, the worker answers a 1 px blank). */
async function drawnTiles(page: Page) {
  return page.locator('.field-map img.leaflet-tile').evaluateAll((imgs) =>
    imgs.map((img) => {
      const el = img as HTMLImageElement;
      const m = /\/(\d+)\/(\d+)\/(\d+)\.png/.exec(el.src);
      return { z: Number(m?.[1] ?? -1), loaded: el.complete && el.naturalWidth === 256, src: el.src };
    }),
  );
}

/** Whether the element sits wholly inside the map, and clear of the zoom buttons. */
async function inViewClearOfControls(page: Page, testId: string) {
  const map = await page.locator('.field-map').boundingBox();
  const zoom = await page.locator('.field-map .leaflet-control-zoom').boundingBox();
  const marker = await page.getByTestId(testId).first().boundingBox();
  if (!map || !zoom || !marker) return false;
  const inside = marker.x >= map.x && marker.y >= map.y && marker.x + marker.width <= map.x + map.width && marker.y + marker.height <= map.y + map.height;
  const overlapsZoom =
    marker.x < zoom.x + zoom.width && marker.x + marker.width > zoom.x && marker.y < zoom.y + zoom.height && marker.y + marker.height > zoom.y;
  return inside && !overlapsZoom;
}

test('the map opens on the farm, follows a fix, shows a saved point at once, and draws its tiles offline', async ({ browser, page, context }) => {
  const baseURL = test.info().project.use.baseURL ?? '';
  const office = await coordinatorApi(browser, baseURL);
  const [tobias] = await query<{ id: string }>("SELECT id FROM users WHERE email = 'tobias@wenlow-water.test'");
  const [ines] = await query<{ id: string }>("SELECT id FROM users WHERE email = 'ines@wenlow-water.test'");
  const farm = await office.post('/api/farms', { data: { name: 'Map test upland', area: 'North ridge', ...FARM, notes: '' } });
  expect(farm.status(), await farm.text()).toBe(201);
  const farmId = ((await farm.json()) as { farm: { id: string } }).farm.id;
  const created = await office.post('/api/visits', { data: { farmId, advisorId: tobias?.id, plannedOn: new Date().toISOString().slice(0, 10), notes: '' } });
  expect(created.status(), await created.text()).toBe(201);
  const visitId = ((await created.json()) as { visit: { id: string } }).visit.id;

  await context.grantPermissions(['geolocation']);
  await context.setGeolocation(FIX);
  await signInAs(page, 'tobias@wenlow-water.test', /\/field$/);
  await waitForWorker(page);
  await waitForHooks(page);
  await pressSync(page);

  // No points yet: the map opens on the farm at a close zoom, with the farm's tiles.
  await page.goto(`/field/visit/points?id=${visitId}`);
  await expect(page.locator('.field-map img.leaflet-tile').first()).toBeVisible({ timeout: 20_000 });
  await expect.poll(async () => (await drawnTiles(page)).filter((t) => t.loaded).length, { timeout: 20_000 }).toBeGreaterThan(0);
  expect(Math.min(...(await drawnTiles(page)).map((t) => t.z))).toBeGreaterThanOrEqual(14);

  // Zoom buttons at a finger's size.
  for (const name of ['Zoom in', 'Zoom out']) {
    const box = await page.getByRole('button', { name }).boundingBox();
    expect(box?.width ?? 0, name).toBeGreaterThanOrEqual(44);
    expect(box?.height ?? 0, name).toBeGreaterThanOrEqual(44);
  }

  // A fix taken: the pin is in view at once, clear of the controls.
  await page.getByRole('button', { name: 'Tank', exact: true }).click();
  await page.getByRole('button', { name: 'Use my location' }).click();
  await page.getByRole('button', { name: 'Use this fix' }).click();
  await expect(page.getByTestId('map-draft')).toBeVisible();
  await expect.poll(() => inViewClearOfControls(page, 'map-draft')).toBe(true);

  // Saved: its marker is on the map straight away, in view, no reload.
  await page.getByRole('button', { name: 'Save point' }).click();
  await expect(page.getByText('Point saved on this phone.')).toBeVisible();
  await expect(page.getByTestId('map-point')).toHaveCount(1);
  await expect.poll(() => inViewClearOfControls(page, 'map-point')).toBe(true);

  // The sync after the save keeps the map around the new point; the page says how much.
  const note = page.getByTestId('offline-map');
  await expect(note).toHaveText(/^Map for offline: \d+ tiles, [\d.]+ (kB|MB)\.$/, { timeout: 90_000 });
  const summary = (await note.textContent()) ?? '';
  const kept = Number(/(\d+) tiles/.exec(summary)?.[1]);
  expect(kept).toBeGreaterThan(100);
  expect(kept).toBeLessThan(400);
  await page.screenshot({ path: test.info().outputPath('map-online-412.png'), fullPage: true });

  // No signal, the page opened afresh: every tile the map draws comes from the phone's cache.
  // A tile that failed to load would say so on the console; none may.
  const tileErrors: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error' && /\/\d+\/\d+\/\d+\.png/.test(message.location().url)) tileErrors.push(`${message.location().url}: ${message.text()}`);
  });
  await context.setOffline(true);
  await page.reload();
  await expect(page.getByTestId('map-point')).toHaveCount(1, { timeout: 20_000 });
  await expect
    .poll(
      async () => {
        const tiles = await drawnTiles(page);
        return tiles.length > 0 && tiles.every((t) => t.loaded);
      },
      { timeout: 20_000 },
    )
    .toBe(true);
  const offlineTiles = await drawnTiles(page);
  expect(offlineTiles.every((t) => t.z >= 14 && t.z <= 17)).toBe(true);
  await expect.poll(() => inViewClearOfControls(page, 'map-point')).toBe(true);
  await page.screenshot({ path: test.info().outputPath('map-offline-412.png'), fullPage: true });
  await page.screenshot({ path: '/tmp/fallbook-map-offline-412.png', fullPage: true });
  // The visit page says the same, offline.
  await page.goto(`/field/visit?id=${visitId}`);
  await expect(page.getByTestId('offline-map')).toHaveText(summary);
  await page.screenshot({ path: test.info().outputPath('visit-offline-412.png'), fullPage: true });

  // Wide screen, still offline.
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.goto(`/field/visit/points?id=${visitId}`);
  await expect
    .poll(
      async () => {
        const tiles = await drawnTiles(page);
        return tiles.length > 0 && tiles.every((t) => t.loaded);
      },
      { timeout: 20_000 },
    )
    .toBe(true);
  await expect.poll(() => inViewClearOfControls(page, 'map-point')).toBe(true);
  await page.screenshot({ path: test.info().outputPath('map-offline-1280.png'), fullPage: true });
  await page.screenshot({ path: '/tmp/fallbook-map-offline-1280.png', fullPage: true });
  await page.setViewportSize({ width: 412, height: 839 });

  // Zoomed out past the kept zooms with no signal: plain background, still no failed loads.
  // (One step at a time: Leaflet ignores a press while the last zoom still animates.)
  await expect
    .poll(
      async () => {
        await page.getByRole('button', { name: 'Zoom out' }).click();
        return (await drawnTiles(page)).some((t) => t.z < 12);
      },
      { timeout: 20_000, intervals: [600] },
    )
    .toBe(true);
  await page.waitForTimeout(500);
  expect(tileErrors).toEqual([]);

  // The visit goes to another advisor: the next sync takes it off this phone, and its tiles with it.
  const cached = () =>
    page.evaluate(async () => {
      const cache = await caches.open('fallbook-tiles');
      const manifest = (await (await cache.match('/~offline-tiles.json'))?.json()) as { visits: Record<string, unknown>; total: { tiles: number } } | undefined;
      return { keys: (await cache.keys()).length, visits: Object.keys(manifest?.visits ?? {}), total: manifest?.total.tiles ?? 0 };
    });
  // Read while still offline: back online, the phone syncs by itself and may drop the visit at once.
  const before = await cached();
  expect(before.visits).toContain(visitId);
  await context.setOffline(false);
  const moved = await office.put(`/api/visits/${visitId}/assignment`, {
    data: { advisorId: ines?.id, plannedOn: new Date().toISOString().slice(0, 10), confirmUnsynced: true },
  });
  expect(moved.status(), await moved.text()).toBe(200);
  await office.dispose();
  await page.goto('/field');
  await pressSync(page);
  await expect.poll(async () => (await cached()).visits.includes(visitId), { timeout: 30_000 }).toBe(false);
  const after = await cached();
  console.log(
    `[map-e2e] this visit: ${summary}; the phone's offline map: ${before.total} tiles for ${before.visits.length} visits, then ${after.total} for ${after.visits.length}`,
  );
  // Its own tiles are gone (7 km from the other farms, it shares at most a few overview tiles); the other visits' stay.
  expect(after.total).toBeLessThan(before.total - kept / 2);
  expect(after.total).toBeGreaterThan(0);
  expect(after.keys).toBe(after.total + 1);
});
