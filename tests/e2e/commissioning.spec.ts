import { expect, test } from '@playwright/test';
import { query } from './support/db';
import { signInAs, waitForWorker } from './support/sign-in';

// The advisor records a commissioning check at Brandt Hollow with no signal: it waits on the phone,
// goes with the sync, and the coordinator sees it on the predicted-vs-measured plot.

test.setTimeout(90_000);

test('an advisor records a commissioning check offline; after the sync the coordinator sees predicted against measured', async ({ browser }) => {
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  const page = await context.newPage();
  await signInAs(page, 'tobias@wenlow-water.test', /\/field$/);
  const link = page.getByRole('link', { name: /Brandt Hollow/ });
  await expect(link).toBeVisible({ timeout: 15_000 });
  const visitId = new URL((await link.getAttribute('href')) ?? '', 'http://x').searchParams.get('id') ?? '';
  await waitForWorker(page);
  const count = async () => (await query<{ n: number }>('SELECT COUNT(*) AS n FROM commissionings WHERE visit_id = ?', [visitId]))[0]?.n ?? 0;
  const before = await count();
  await page.goto(`/field/visit/commission?id=${visitId}`);
  await expect(page.getByRole('heading', { name: 'Commissioning check' })).toBeVisible();

  await context.setOffline(true);
  await page.getByLabel('Drive flow (waste + delivered)', { exact: true }).fill('0,9');
  await page.getByLabel('Delivered flow at the tank', { exact: true }).fill('0.06');
  await page.getByLabel('Beats per minute', { exact: true }).fill('150');
  await page.getByLabel('Lift from the ram to the outlet', { exact: true }).fill('25');
  await page.getByLabel("Fall to the ram (empty: the screening's)", { exact: true }).fill('4');
  // Shown at once from the engine on the phone: η_D = 0.06·25/(0.9·4) = 0.417.
  await expect(page.getByTestId('commission-check')).toContainText('42 %');
  await page.getByRole('button', { name: 'Record the check' }).click();
  await expect(page.getByText('Check saved on this phone')).toBeVisible();
  const recorded = page.getByTestId('recorded-check').first();
  await expect(recorded.getByTestId('send-state')).toContainText('Not yet sent');
  await expect(recorded).toContainText('42 %');
  await expect(recorded).toContainText('waste valve stroke');
  // The recorded check says which way to set the waste valve, as the preview did.
  await expect(recorded.getByTestId('valve-advice')).toContainText('Waste valve');
  // The page reloads from the phone with no signal and the check is still there, still waiting.
  await page.reload();
  await expect(page.getByTestId('recorded-check').first().getByTestId('send-state')).toContainText('Not yet sent');
  expect(await count()).toBe(before);
  await page.screenshot({ path: test.info().outputPath('commission-offline.png'), fullPage: true });

  await context.setOffline(false);
  await page.goto('/field/sync');
  await page.getByRole('button', { name: 'Sync now' }).click();
  await expect(page.getByTestId('sync-summary')).toHaveText('Everything is on the server', { timeout: 30_000 });
  expect(await count()).toBe(before + 1);
  const [visit] = await query<{ status: string }>('SELECT status FROM visits WHERE id = ?', [visitId]);
  expect(visit?.status).toBe('commissioned');
  const [row] = await query<{ lift: number; beats: number; recordedBy: string }>(
    'SELECT c.lift_m AS lift, c.beats_per_minute AS beats, u.email AS recordedBy FROM commissionings c JOIN users u ON u.id = c.recorded_by_id WHERE c.visit_id = ? ORDER BY c.created_at DESC LIMIT 1',
    [visitId],
  );
  expect([row?.lift, row?.beats, row?.recordedBy]).toEqual([25, 150, 'tobias@wenlow-water.test']);
  await page.goto(`/field/visit/commission?id=${visitId}`);
  await expect(page.getByTestId('recorded-check').first().getByTestId('send-state')).toContainText('Sent');

  const office = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  const op = await office.newPage();
  await signInAs(op, 'maren@wenlow-water.test', /\/office$/);
  await op.goto('/office/commissioning');
  await expect(op.getByRole('img', { name: /Predicted against measured delivery/ })).toBeVisible();
  await expect(op.getByRole('table')).toContainText('Brandt Hollow');
  await op.screenshot({ path: test.info().outputPath('office-commissioning.png'), fullPage: true });
  await context.close();
  await office.close();
});
