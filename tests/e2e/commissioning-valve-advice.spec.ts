import { expect, test } from '@playwright/test';
import { signInAs, waitForWorker } from './support/sign-in';

// At Brandt Hollow with no signal the phone compares the counted beats with the ram model's at the measured fall and
// lift, and says which way to move the waste valve. Nothing is recorded: the check stays a preview on the phone.

test.setTimeout(90_000);

test('commissioning on a phone: the waste-valve suggestion follows the counted beats', async ({ page, context }) => {
  await signInAs(page, 'tobias@wenlow-water.test', /\/field$/);
  const link = page.getByRole('link', { name: /Brandt Hollow/ });
  await expect(link).toBeVisible({ timeout: 15_000 });
  const visitId = new URL((await link.getAttribute('href')) ?? '', 'http://x').searchParams.get('id') ?? '';
  await waitForWorker(page);
  await page.goto(`/field/visit/commission?id=${visitId}`);
  await expect(page.getByRole('heading', { name: 'Commissioning check' })).toBeVisible();
  expect(page.viewportSize()?.width).toBe(412);

  await context.setOffline(true);
  await page.getByLabel('Drive flow (waste + delivered)', { exact: true }).fill('1.2');
  await page.getByLabel('Delivered flow at the tank', { exact: true }).fill('0.05');
  await page.getByLabel('Lift from the ram to the outlet', { exact: true }).fill('29');
  await page.getByLabel("Fall to the ram (empty: the screening's)", { exact: true }).fill('4.1');
  await page.getByLabel('Beats per minute', { exact: true }).fill('200');
  const advice = page.getByTestId('valve-advice');
  await expect(advice).toContainText('beats faster (200 a minute)');
  await expect(advice).toContainText('Lengthen its stroke or add weight');
  await advice.scrollIntoViewIfNeeded();
  await page.screenshot({ path: test.info().outputPath('valve-advice-fast.png'), fullPage: true });

  await page.getByLabel('Beats per minute', { exact: true }).fill('15');
  await expect(advice).toContainText('beats slower (15 a minute)');
  await expect(advice).toContainText('Shorten its stroke or take weight off');
  // The stroke as measured replaces the assumed 15 mm: a longer travel, a slower design beat.
  await expect(page.getByText('Without it the advice assumes 15 mm')).toBeVisible();
  const assumedAdvice = await advice.innerText();
  await page.getByLabel('Waste valve stroke (empty: not measured)', { exact: true }).fill('25');
  await expect.poll(async () => advice.innerText()).not.toBe(assumedAdvice);
  await expect(advice).toContainText('Shorten its stroke or take weight off');
  // No developer text on the phone.
  await expect(page.locator('body')).not.toContainText(/closureVelocity|NaN|undefined/);
  await page.screenshot({ path: test.info().outputPath('valve-advice-slow.png'), fullPage: true });
  await context.setOffline(false);
});
