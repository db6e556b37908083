// A photo the server refuses (a 4xx) is not silently retried for ever: the sync bar says so, the sync
// page gives the server's reason, the bytes stay on the phone, and "Try again now" sends it once the
// server takes it (here the refusal is staged by the test in front of the real server).
import { expect, test } from '@playwright/test';
import { query } from './support/db';
import { coordinatorApi, newVisit, phoneState, pressSync, waitForHooks } from './support/phone';
import { gpsJpeg } from './support/photos';
import { signInAs, waitForWorker } from './support/sign-in';

test.setTimeout(120_000);

const REASON = 'That file is not a photo this server can read.';

test('a refused photo shows the reason, stays on the phone, and goes up when tried again', async ({ browser }) => {
  const baseURL = test.info().project.use.baseURL ?? '';
  const office = await coordinatorApi(browser, baseURL);
  const [tobias] = await query<{ id: string }>("SELECT id FROM users WHERE email = 'tobias@wenlow-water.test'");
  const visitId = await newVisit(office, tobias?.id ?? '', 'Refused-photo farm');
  await office.dispose();

  const context = await browser.newContext({ baseURL });
  const page = await context.newPage();
  await signInAs(page, 'tobias@wenlow-water.test', /\/field$/);
  await waitForWorker(page);
  await waitForHooks(page);
  await pressSync(page);

  // The server refuses the bytes (as it would a file it cannot read) for as long as this route stands:
  // set before the photo is taken, since saving it starts a sync at once.
  const refuse = /\/api\/photos\/[0-9a-f-]{36}$/;
  await context.route(refuse, (route) =>
    route.request().method() === 'PUT'
      ? route.fulfill({ status: 415, contentType: 'application/json', body: JSON.stringify({ error: { code: 'unsupported', message: REASON } }) })
      : route.continue(),
  );
  const photo = await gpsJpeg(52.41, -3.61, '#6a8caf');
  await page.goto(`/field/visit/photos?id=${visitId}`);
  await page.getByTestId('photo-input').setInputFiles([{ name: 'pool.jpg', mimeType: 'image/jpeg', buffer: photo.buffer }]);
  await expect(page.getByText('1 photo kept on this phone.')).toBeVisible({ timeout: 20_000 });

  await pressSync(page);
  expect((await phoneState(page)).photosWaiting).toBe(1);
  const seeWhy = page.getByRole('link', { name: 'The server did not take 1 photo: see why' });
  await expect(seeWhy).toBeVisible();
  await seeWhy.click();
  await expect(page).toHaveURL(/\/field\/sync$/);
  const refused = page.getByRole('listitem').filter({ hasText: REASON });
  await expect(refused).toHaveCount(1);
  // Nothing was stored on the server, and the phone still has the bytes.
  const [metadata] = await query<{ uploadedAt: Date | null }>('SELECT uploaded_at AS uploadedAt FROM photos WHERE visit_id = ?', [visitId]);
  expect(metadata?.uploadedAt ?? null).toBeNull();
  // The photos page agrees: the photo's metadata is on the server, its bytes are not.
  await page.goto(`/field/visit/photos?id=${visitId}`);
  await expect(page.getByText('Waiting to upload', { exact: true })).toBeVisible();
  await expect(page.getByText('On the server', { exact: true })).toHaveCount(0);
  await page.goto('/field/sync');

  await context.unroute(refuse);
  await refused.getByRole('button', { name: 'Try again now' }).click();
  await expect.poll(async () => (await phoneState(page)).photosWaiting, { timeout: 30_000 }).toBe(0);
  await expect(page.getByRole('listitem').filter({ hasText: REASON })).toHaveCount(0);
  const [stored] = await query<{ sha256: string; uploadedAt: Date | null }>('SELECT sha256, uploaded_at AS uploadedAt FROM photos WHERE visit_id = ?', [
    visitId,
  ]);
  expect(stored?.sha256).toBe(photo.sha256);
  expect(stored?.uploadedAt).not.toBeNull();
  await page.goto(`/field/visit/photos?id=${visitId}`);
  await expect(page.getByText('On the server', { exact: true })).toBeVisible();
  await context.close();
});
