import { expect, test } from '@playwright/test';
import { query } from './support/db';
import { signInAs } from './support/sign-in';

// The advisor records a commissioning check at Brandt Hollow; the coordinator sees it on the predicted-vs-measured plot.

test.setTimeout(90_000);

test('an advisor records a commissioning check; the coordinator sees predicted against measured', async ({ browser }) => {
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  const page = await context.newPage();
  await signInAs(page, 'tobias@wenlow-water.test', /\/field$/);
  const link = page.getByRole('link', { name: /Brandt Hollow/ });
  await expect(link).toBeVisible({ timeout: 15_000 });
  const visitId = new URL((await link.getAttribute('href')) ?? '', 'http://x').searchParams.get('id') ?? '';
  await page.goto(`/field/visit/commission?id=${visitId}`);
  await page.getByLabel('Drive flow (waste + delivered)', { exact: true }).fill('0,9');
  await page.getByLabel('Delivered flow at the tank', { exact: true }).fill('0.06');
  await page.getByLabel('Beats per minute', { exact: true }).fill('150');
  await page.getByLabel('Lift from the ram to the outlet', { exact: true }).fill('25');
  await page.getByLabel("Fall to the ram (empty: the screening's)", { exact: true }).fill('4');
  // Shown at once from the engine on the phone: η_D = 0.06·25/(0.9·4) = 0.417.
  await expect(page.getByTestId('commission-check')).toContainText('42 %');
  await page.getByRole('button', { name: /Record the check/ }).click();
  await expect(page.getByText('Recorded: the visit is now commissioned.')).toBeVisible();
  await expect(page.getByTestId('commission-check')).toContainText('waste valve stroke');
  const [visit] = await query<{ status: string }>('SELECT status FROM visits WHERE id = ?', [visitId]);
  expect(visit?.status).toBe('commissioned');

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
