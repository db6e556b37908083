import { expect, test } from '@playwright/test';
import { query } from './support/db';
import { signInAs, waitForWorker } from './support/sign-in';

// An advisor runs the creek profile search offline on the demo reach (Brandt spring brook), sees the top 3
// on the chart and the map, adopts the best pair, and after the sync the stored screening uses its fall.
// A station booked with the phone's location on carries its fix to the server.

test.setTimeout(120_000);

test('find the best positions offline, adopt the best pair, the server screening uses it', async ({ browser }) => {
  const context = await browser.newContext({
    baseURL: test.info().project.use.baseURL,
    geolocation: { latitude: 52.417301, longitude: -3.615702, accuracy: 4 },
    permissions: ['geolocation'],
  });
  const page = await context.newPage();
  await signInAs(page, 'tobias@wenlow-water.test', /\/field$/);
  await waitForWorker(page);
  const link = page.getByRole('link', { name: /Brandt Hollow/ });
  await expect(link).toBeVisible({ timeout: 15_000 });
  const visitId = new URL((await link.getAttribute('href')) ?? '', 'http://x').searchParams.get('id') ?? '';
  expect(visitId).toMatch(/^[0-9a-f-]{36}$/);
  await page.goto(`/field/visit/positions?id=${visitId}`);
  await expect(page.getByRole('heading', { name: 'Creek profile and best positions' })).toBeVisible();
  await expect(page.getByText('30 stations')).toBeVisible({ timeout: 15_000 });

  await context.setOffline(true);
  await page.getByLabel('Distance away from the creek', { exact: true }).fill('120');
  await page.getByRole('button', { name: 'Find the best positions' }).click();
  const best = page.getByTestId('pair-1');
  await expect(best).toBeVisible({ timeout: 30_000 });
  // By construction of the demo reach: the slate step (100 → 130 m) is the most fall a drive pipe from the intake
  // may span; a feed pipe from the top of the reach to a stand pipe at 100 m adds the bed above it (6.6 m in all).
  await expect(best).toContainText('Intake at 0.00 m, ram at 130 m');
  await expect(page.getByTestId('pair-1-stand-pipe')).toContainText('stand pipe at 100 m');
  await expect(page.getByTestId('pair-line-1')).toBeVisible();
  await expect(page.getByTestId('pair-3')).toBeVisible();
  // The same three pairs on the map, numbered as on the chart: intake ring, ram square, the run along the bank.
  for (const rank of [1, 2, 3]) {
    await expect(page.getByTestId(`map-pair-${rank}-intake`)).toBeVisible();
    await expect(page.getByTestId(`map-pair-${rank}-ram`)).toBeVisible();
    await expect(page.locator(`path.map-pair-line-${rank}`)).toHaveCount(1);
  }
  await expect(page.getByTestId('map-pair-4-intake')).toHaveCount(0);
  // Three demo stations had no fix under the alders: placed by chainage, and the map says so.
  await expect(page.getByTestId('map-note')).toContainText('3 stations have no fix of their own: placed by chainage');
  await page.screenshot({ path: test.info().outputPath('best-positions.png'), fullPage: true });

  page.once('dialog', (d) => d.accept());
  await page.getByRole('button', { name: 'Adopt pair 1' }).click();
  await expect(page.getByText('Pair 1 adopted on this phone')).toBeVisible();

  await context.setOffline(false);
  await page.goto('/field/sync');
  await page.getByRole('button', { name: 'Sync now' }).click();
  await expect(page.getByTestId('sync-summary')).toHaveText('Everything is on the server', { timeout: 30_000 });

  const [pump] = await query<{ chainageM: number; level: number }>(
    "SELECT chainage_m AS chainageM, reduced_level_m AS level FROM points WHERE visit_id = ? AND role = 'pump' AND deleted_at IS NULL",
    [visitId],
  );
  expect(pump?.chainageM).toBe(130);
  await expect
    .poll(
      async () => {
        const [s] = await query<{ result: string }>('SELECT result FROM screenings WHERE visit_id = ? ORDER BY created_at DESC LIMIT 1', [visitId]);
        const r = (typeof s?.result === 'string' ? JSON.parse(s.result) : s?.result) as
          { figures: { fallM: { value: number }; feedPipeLengthM?: { value: number } } } | undefined;
        return [r?.figures.fallM.value, r?.figures.feedPipeLengthM?.value];
      },
      { timeout: 15_000 },
    )
    .toEqual([6.6, 100]);

  // A station booked now takes the phone's fix (and its accuracy) along; removed again after, to keep the demo reach.
  await page.goto(`/field/visit/positions?id=${visitId}`);
  await expect(page.getByTestId('station-fix')).toContainText('Position from the phone', { timeout: 15_000 });
  await page.getByLabel('Distance along the bank from the top', { exact: true }).fill('295');
  await page.getByLabel('Level (reduced level)', { exact: true }).fill('232,4');
  await page.getByRole('button', { name: 'Save station' }).click();
  await expect(page.getByText('Station saved on this phone, with its position.')).toBeVisible();
  await page.goto('/field/sync');
  await page.getByRole('button', { name: 'Sync now' }).click();
  await expect(page.getByTestId('sync-summary')).toHaveText('Everything is on the server', { timeout: 30_000 });
  const [station] = await query<{ id: string; lat: number; lon: number; accuracyM: number }>(
    "SELECT id, lat, lon, accuracy_m AS accuracyM FROM points WHERE visit_id = ? AND role = 'station' AND chainage_m = 295 AND deleted_at IS NULL",
    [visitId],
  );
  expect([station?.lat, station?.lon, station?.accuracyM]).toEqual([52.417301, -3.615702, 4]);
  await page.goto(`/field/visit/positions?id=${visitId}`);
  await page.getByText(/Saved stations/).click();
  await page.getByRole('listitem').filter({ hasText: '295 m' }).getByRole('button', { name: 'Delete' }).click();
  await expect(page.getByText('30 stations')).toBeVisible();
  await context.close();
});
