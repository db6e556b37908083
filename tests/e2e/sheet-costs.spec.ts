import { writeFileSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { expect, test } from '@playwright/test';
import { signInAs } from './support/sign-in';

// The farmer's sheet prices the bill of materials from the organisation's list and compares ten years of the ram
// with a solar and a petrol pump; the bill is a five-column table that fits a 412 px phone with no sideways scroll.

test('the sheet shows the priced bill and the ten-year comparison, fitting a 412 px phone and a desktop', async ({ page }) => {
  await signInAs(page, 'maren@wenlow-water.test', /\/office$/);
  const list = await (await page.request.get('/api/visits?pageSize=100')).json();
  const visit = list.items.find((v: { farm: { name: string } }) => v.farm.name === 'Brandt Hollow');
  expect(visit).toBeTruthy();
  for (const width of [412, 1440]) {
    await page.setViewportSize({ width, height: 900 });
    await page.goto(`/sheets/${visit.id}`);
    const bill = page.getByTestId('bill-table');
    await expect(bill.getByRole('columnheader')).toHaveText(['Item', 'Size', 'Quantity', 'Basis', 'Price']);
    await expect(page.getByTestId('bill-total')).toHaveText(/^£[\d,]+$/);
    await expect(bill).toContainText('Comes with a bought ram');
    await expect(bill).toContainText('Labour');
    const ten = page.getByTestId('ten-year-table');
    await expect(ten).toContainText('Small solar pump with panels');
    await expect(ten).toContainText('Petrol pump');
    await expect(page.getByText(/W of panels at £/)).toBeVisible();
    const overflow = await page.evaluate(() => {
      const out: string[] = [];
      if (document.documentElement.scrollWidth > window.innerWidth + 1) out.push(`page scrolls sideways: ${document.documentElement.scrollWidth}`);
      for (const id of ['bill-table', 'ten-year-table']) {
        const t = document.querySelector(`[data-testid="${id}"]`)?.getBoundingClientRect();
        if (!t || t.right > window.innerWidth + 1) out.push(`${id} runs past the screen`);
      }
      return out;
    });
    expect(overflow, `at ${width} px`).toEqual([]);
    await page.getByRole('heading', { name: 'Bill of materials' }).scrollIntoViewIfNeeded();
    await page.screenshot({ path: test.info().outputPath(`sheet-costs-${width}.png`), fullPage: true });
  }
  const pdf = await page.request.get(`/api/visits/${visit.id}/sheet/pdf?paper=a4`);
  const bytes = await pdf.body();
  expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  writeFileSync(test.info().outputPath('sheet-costs.pdf'), bytes);
  expect((await readFile(test.info().outputPath('sheet-costs.pdf'))).length).toBeGreaterThan(1000);
});

test('the coordinator sets the currency and a price in the settings, and the sheet reprices at once', async ({ page }) => {
  await signInAs(page, 'maren@wenlow-water.test', /\/office$/);
  await page.setViewportSize({ width: 1280, height: 900 });
  const list = await (await page.request.get('/api/visits?pageSize=100')).json();
  const visit = list.items.find((v: { farm: { name: string } }) => v.farm.name === 'Brandt Hollow');
  await page.goto('/office/settings');
  const form = page.getByRole('form', { name: 'Organisation settings' });
  const currency = form.getByLabel(/^Currency/);
  await expect(currency).toHaveValue('GBP');
  const save = async () => {
    await form.getByRole('button', { name: 'Save settings' }).click();
    await expect(form.getByRole('status')).toHaveText('Settings saved. New screenings use them.');
  };
  try {
    await currency.fill('XQZ');
    await form.getByRole('button', { name: 'Save settings' }).click();
    await expect(form.getByText('Not a currency code this app knows.')).toBeVisible();
    await currency.fill('eur');
    await form.getByLabel('Tank, per litre').fill('1');
    await save();
    await page.screenshot({ path: test.info().outputPath('settings-prices.png'), fullPage: true });
    await page.goto(`/sheets/${visit.id}`);
    const tank = page.getByTestId('bill-table').getByRole('row', { name: /Storage tank/ });
    await expect(tank).toContainText('€1.00 a litre');
    await expect(page.getByTestId('bill-total')).toHaveText(/^€[\d,]+$/);
  } finally {
    await page.goto('/office/settings');
    await currency.fill('GBP');
    await form.getByLabel('Tank, per litre').fill('0.2');
    await save();
  }
});
