import { expect, test, type Page } from '@playwright/test';
import { query } from './support/db';
import { gpsJpeg } from './support/photos';

// A whole site walk captured in airplane mode, the page closed and reopened offline, then synced:
// everything arrives in MariaDB exactly once, photos intact, and the screening is stored.
// Ines works in US customary units, so the unit layer is exercised end to end.

test.describe.configure({ mode: 'serial' });
test.setTimeout(120_000);

async function signInOnline(page: Page) {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill('ines@wenlow-water.test');
  await page.getByLabel('Password').fill('fallbook-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/field$/);
  // The worker must control the page before going offline (the shell then comes from its cache).
  await expect(page.getByRole('heading', { name: 'My site visits' })).toBeVisible();
  await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller).catch(() => false), { timeout: 20_000 }).toBe(true);
}

async function typeInto(page: Page, label: string, value: string, nth = 0) {
  await page.getByLabel(label, { exact: true }).nth(nth).fill(value);
}

test('capture a site walk offline, reopen offline, sync once online', async ({ browser }) => {
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  let page = await context.newPage();
  await signInOnline(page);
  const link = page.getByRole('link', { name: /Otieno Orchard Croft/ });
  await expect(link).toBeVisible({ timeout: 15_000 });
  const visitId = new URL((await link.getAttribute('href')) ?? '', 'http://x').searchParams.get('id') ?? '';
  expect(visitId).toMatch(/^[0-9a-f-]{36}$/);
  const farmId = (await query<{ farmId: string }>('SELECT farm_id AS farmId FROM visits WHERE id = ?', [visitId]))[0]?.farmId ?? '';
  const demandBefore = (await query<{ n: number }>('SELECT COUNT(*) AS n FROM demand_lines WHERE farm_id = ?', [farmId]))[0]?.n ?? 0;

  // Warm the field routes while online (they are precached too; this also checks they render).
  await page.goto(`/field/visit?id=${visitId}`);
  await expect(page.getByRole('heading', { name: 'Otieno Orchard Croft' })).toBeVisible();

  await context.setOffline(true);

  // Source and flow: three bucket trials typed (gallons, seconds).
  await page.goto(`/field/visit/flow?id=${visitId}`);
  await page.getByLabel('Name of the source (spring, creek…)').fill('Hafod spring');
  await page.getByRole('button', { name: 'Start measuring this source' }).click();
  await typeInto(page, 'Bucket volume', '5');
  for (const s of ['9,8', '10.1', '9.6']) {
    await typeInto(page, 'Or type the seconds', s);
    await page.getByRole('button', { name: 'Add typed trial' }).click();
  }
  await expect(page.getByTestId('flow-live')).toContainText('3 trials');
  await page.getByRole('button', { name: 'Save flow measurement' }).click();
  await expect(page.getByText('Saved 3 trials on this phone.')).toBeVisible();

  // Fall: a level book with one change point (feet); lift as one figure.
  await page.goto(`/field/visit/fall?id=${visitId}`);
  await page.getByRole('button', { name: 'Add a change point' }).click();
  await typeInto(page, 'Backsight', '4.10', 0);
  await typeInto(page, 'Foresight', '9.55', 0);
  await typeInto(page, 'Backsight', '3.20', 1);
  await typeInto(page, 'Foresight', '8.40', 1);
  await expect(page.getByTestId('fall-live')).toContainText('agrees');
  await page.getByRole('button', { name: 'Save this run' }).click();
  await expect(page.getByText('Run saved on this phone.')).toBeVisible();
  await page.getByRole('button', { name: 'Lift: pump → tank' }).click();
  await page.getByRole('button', { name: 'One figure' }).click();
  await typeInto(page, 'Height of the tank above the pump', '60');
  await page.getByRole('button', { name: 'Save this run' }).click();
  await expect(page.getByText('Run saved on this phone.')).toBeVisible();

  // Three points, typed coordinates.
  await page.goto(`/field/visit/points?id=${visitId}`);
  for (const [role, lat, lon] of [
    ['Intake', '52.40612', '-3.59901'],
    ['Pump site', '52.40598', '-3.59880'],
    ['Tank', '52.40571', '-3.59822'],
  ] as const) {
    await page.getByRole('button', { name: role, exact: true }).click();
    await typeInto(page, 'Latitude', lat);
    await typeInto(page, 'Longitude', lon);
    await page.getByRole('button', { name: 'Save point' }).click();
    await expect(page.getByText('Point saved on this phone.')).toBeVisible();
  }
  await expect(page.getByRole('listitem').filter({ hasText: /^Intake/ })).toHaveCount(1);

  // Two photos with EXIF GPS made by the test.
  const photos = [await gpsJpeg(52.40612, -3.59901, '#6b8e23'), await gpsJpeg(52.40571, -3.59822, '#4682b4')];
  await page.goto(`/field/visit/photos?id=${visitId}`);
  await page.getByTestId('photo-input').setInputFiles(photos.map((p, i) => ({ name: `site-${i}.jpg`, mimeType: 'image/jpeg', buffer: p.buffer })));
  await expect(page.getByText('2 photos kept on this phone.')).toBeVisible();
  await expect(page.getByText('52.40612, -3.59901')).toBeVisible();

  // Demand and pipes.
  await page.goto(`/field/visit/demand?id=${visitId}`);
  await typeInto(page, 'How many people', '2');
  await page.getByRole('button', { name: 'Add line' }).click();
  await expect(page.getByText('Line saved on this phone.')).toBeVisible();
  await page.goto(`/field/visit/pipes?id=${visitId}`);
  await typeInto(page, 'Length along the route', '900', 1);
  await page.getByRole('button', { name: 'Save pipe runs' }).click();
  await expect(page.getByText('Pipe runs saved on this phone.')).toBeVisible();

  await expect(page.getByTestId('sync-summary')).toContainText('2 photos waiting');

  // Close the page and reopen it, still offline: everything is there.
  await page.close();
  page = await context.newPage();
  await page.goto(`/field/visit?id=${visitId}`);
  await expect(page.getByRole('heading', { name: 'Otieno Orchard Croft' })).toBeVisible();
  await expect(page.getByTestId('count-flow')).toHaveText('1');
  await expect(page.getByTestId('count-fall')).toHaveText('2');
  await expect(page.getByTestId('count-points')).toHaveText('3');
  await expect(page.getByTestId('count-photos')).toHaveText('2');
  await expect(page.getByTestId('preview-verdict')).toBeVisible();

  // Online again: sync, and everything is in MariaDB exactly once.
  await context.setOffline(false);
  await page.getByRole('button', { name: 'Sync now' }).click();
  await expect(page.getByTestId('sync-summary')).toHaveText('Everything is on the server', { timeout: 30_000 });

  const count = async (table: string) =>
    (await query<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table} WHERE visit_id = ? AND deleted_at IS NULL`, [visitId]))[0]?.n;
  expect(await count('water_sources')).toBe(1);
  expect(await count('flow_measurements')).toBe(1);
  expect(await count('fall_readings')).toBe(2);
  expect(await count('points')).toBe(3);
  expect(await count('pipe_runs')).toBe(2);
  const stored = await query<{ sha256: string; uploaded: number }>(
    'SELECT sha256, uploaded_at IS NOT NULL AS uploaded FROM photos WHERE visit_id = ? ORDER BY sha256',
    [visitId],
  );
  expect(stored.map((p) => p.sha256)).toEqual(photos.map((p) => p.sha256).sort());
  expect(stored.every((p) => Number(p.uploaded) === 1)).toBe(true);
  const demandAfter = (await query<{ n: number }>('SELECT COUNT(*) AS n FROM demand_lines WHERE farm_id = ?', [farmId]))[0]?.n ?? 0;
  expect(demandAfter).toBe(demandBefore + 1);
  // 900 ft typed on the phone arrives as 274.32 m (1 ft = 0.3048 m exactly).
  const [delivery] = await query<{ lengthM: number }>("SELECT length_m AS lengthM FROM pipe_runs WHERE visit_id = ? AND purpose = 'delivery'", [visitId]);
  expect(delivery?.lengthM).toBeCloseTo(274.32, 6);
  // The server screens the visit just after answering the push.
  await expect
    .poll(async () => (await query<{ n: number }>('SELECT COUNT(*) AS n FROM screenings WHERE visit_id = ?', [visitId]))[0]?.n, { timeout: 15_000 })
    .toBeGreaterThanOrEqual(1);

  // A reload in the middle of a sync loses nothing and doubles nothing.
  await context.setOffline(true);
  await page.goto(`/field/visit/points?id=${visitId}`);
  await page.getByRole('button', { name: 'Station', exact: true }).click();
  await typeInto(page, 'Latitude', '52.40590');
  await typeInto(page, 'Longitude', '-3.59860');
  await page.getByRole('button', { name: 'Save point' }).click();
  await expect(page.getByText('Point saved on this phone.')).toBeVisible();
  await context.setOffline(false);
  await page.getByRole('button', { name: 'Sync now' }).click();
  await page.reload();
  await page.getByRole('button', { name: 'Sync now' }).click();
  await expect(page.getByTestId('sync-summary')).toHaveText('Everything is on the server', { timeout: 30_000 });
  expect(await count('points')).toBe(4);
  const labels = await query<{ n: number }>("SELECT COUNT(*) AS n FROM points WHERE visit_id = ? AND role = 'station'", [visitId]);
  expect(labels[0]?.n).toBe(1);
  await context.close();
});
