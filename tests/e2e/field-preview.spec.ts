import { expect, test } from '@playwright/test';
import { signInAs, waitForWorker } from './support/sign-in';

// A new visit's preview says what is still needed in the advisor's words, each item linking to its page;
// no schema text ("Invalid input", paths, codes) reaches the screen.
test('a visit with nothing captured lists what the screen still needs, by record, linked, in plain words', async ({ page }) => {
  await signInAs(page, 'ines@wenlow-water.test', /\/field$/);
  await waitForWorker(page);
  // Lark Spinney: no other spec captures readings there, so the visit is still empty whatever ran before.
  const link = page.getByRole('link', { name: /Lark Spinney/ });
  await expect(link).toBeVisible({ timeout: 15_000 });
  await link.click();
  const missing = page.getByTestId('preview-missing');
  await expect(missing).toBeVisible({ timeout: 15_000 });
  await expect(missing.getByRole('link', { name: 'Delivery pipe' })).toHaveAttribute('href', /\/field\/visit\/pipes\?id=/);
  const text = (await missing.textContent()) ?? '';
  expect(text).not.toMatch(/Invalid input|expected|received|\.\d|flowMeasurements|deliveryPipe/);
});
