import { expect, test, type Browser, type Page } from '@playwright/test';
import { query } from './support/db';
import { coordinatorApi, newVisit } from './support/phone';
import { signInAs, waitForWorker } from './support/sign-in';

// Impossible readings get a message at the field where they were typed and are never saved; unusual
// ones are saved only once confirmed; unsaved trials are not lost to a stray link; a delete can be
// undone. On a 412 px phone (the Pixel 7 project), as Ines, who works in US units (feet, gallons,
// inches): limits are told in her units. The messages must never be schema text.
const SCHEMA_TEXT = /Invalid input|expected .* received|Too (big|small)|\w+\.\d+\.\w+/;

/** A visit of its own (a new farm planned for Ines today), so no other spec's visit is touched. */
async function openVisit(page: Page, browser: Browser, baseURL: string): Promise<string> {
  const office = await coordinatorApi(browser, baseURL);
  const [ines] = await query<{ id: string }>("SELECT id FROM users WHERE email = 'ines@wenlow-water.test'");
  const id = await newVisit(office, ines?.id ?? '', 'Bad-input farm');
  await office.dispose();
  await signInAs(page, 'ines@wenlow-water.test', /\/field$/);
  await waitForWorker(page);
  await expect(page.getByRole('link', { name: /Bad-input farm/ })).toBeVisible({ timeout: 30_000 });
  return id;
}

async function expectFieldAlert(page: Page, pattern: RegExp) {
  const alert = page.getByRole('alert').filter({ hasText: pattern });
  await expect(alert.first()).toBeVisible();
  expect(await alert.first().textContent()).not.toMatch(SCHEMA_TEXT);
}

test('bad readings are refused at their field, unusual ones need a yes, nothing is lost', async ({ page, browser, baseURL }) => {
  test.setTimeout(120_000);
  const id = await openVisit(page, browser, baseURL ?? '');

  // Fall: a 500 m foresight, then an uphill run.
  await page.goto(`/field/visit/fall?id=${id}`);
  await page.getByLabel('Backsight').fill('0');
  await page.getByLabel('Foresight').fill('500');
  await page.getByRole('button', { name: 'Save this run' }).click();
  await expectFieldAlert(page, /Foresight must be at most 19\.7\d? ft/);
  await page.getByLabel('Backsight').fill('2.5');
  await page.getByLabel('Foresight').fill('0.5');
  await page.getByRole('button', { name: 'Save this run' }).click();
  await expectFieldAlert(page, /climbs 2\.00 ft from the intake to the ram/);
  await expect(page.getByRole('region', { name: 'Saved runs' }).getByText('None yet.')).toBeVisible();

  // Flow: a negative bucket, a zero-second trial, a negative notch head.
  await page.goto(`/field/visit/flow?id=${id}`);
  await page.getByLabel('Name of the source (spring, creek…)').fill('Spinney brook');
  await page.getByRole('button', { name: 'Start measuring this source' }).click();
  await page.getByLabel('Or type the seconds').fill('0');
  await page.getByRole('button', { name: 'Add typed trial' }).click();
  await expectFieldAlert(page, /Seconds must be more than 0/);
  await page.getByLabel('Bucket volume').fill('-20');
  await page.getByLabel('Or type the seconds').fill('12');
  await page.getByRole('button', { name: 'Add typed trial' }).click();
  await page.getByRole('button', { name: 'Save flow measurement' }).click();
  await expectFieldAlert(page, /Bucket volume must be more than 0/);
  await expect(page.getByRole('region', { name: 'Saved measurements' }).getByText('None yet.')).toBeVisible();

  // The unsaved trial is not lost to "← Back to the visit": the phone asks, and staying keeps it.
  let asked = '';
  page.once('dialog', (dialog) => {
    asked = dialog.message();
    void dialog.dismiss();
  });
  await page.getByRole('link', { name: '← Back to the visit' }).click();
  await expect.poll(() => asked).toMatch(/not saved yet/);
  await expect(page).toHaveURL(/\/field\/visit\/flow\?/);
  await expect(page.getByText('1. 12.0 s')).toBeVisible();

  await page.getByRole('button', { name: 'V-notch weir' }).click();
  await page.getByLabel(/Head over the notch/).fill('-0.1');
  await page.getByRole('button', { name: 'Add head reading' }).click();
  await expectFieldAlert(page, /Head over the notch must be more than 0/);

  // Pipes: a 5,000 mm bore.
  await page.goto(`/field/visit/pipes?id=${id}`);
  await page
    .getByLabel(/Inside diameter/)
    .first()
    .fill('5000');
  await page.getByRole('button', { name: 'Save pipe runs' }).click();
  await expectFieldAlert(page, /Inside diameter must be at most 23\.6\d? in/);

  // Water needed: 100,001 people is refused; 450 asks "is this right?" and saves once confirmed.
  await page.goto(`/field/visit/demand?id=${id}`);
  const total = page.getByTestId('demand-total');
  await expect(total).toHaveText(/^0(\.0+)? gal\/day$/);
  await page.getByLabel(/^How many/).fill('100001');
  await page.getByRole('button', { name: 'Add line' }).click();
  await expectFieldAlert(page, /How many must be at most 100,?000/);
  await page.getByLabel(/^How many/).fill('450');
  await page.getByRole('button', { name: 'Add line' }).click();
  await expectFieldAlert(page, /450 people is a village/);
  await expect(total).toHaveText(/^0(\.0+)? gal\/day$/);
  await page.getByRole('button', { name: 'Yes, this is right' }).click();
  await page.getByRole('button', { name: 'Add line' }).click();
  await expect(page.getByText(/^450 × /)).toBeVisible();

  // Delete, undo, and the line is back; delete again and it stays gone.
  const line = page.getByRole('listitem').filter({ hasText: /^450 × / });
  await line.getByRole('button', { name: 'Delete' }).click();
  await expect(page.getByTestId('undo-bar')).toContainText('Deleted');
  await expect(page.getByText(/^450 × /)).toHaveCount(0);
  await page.getByRole('button', { name: 'Undo' }).click();
  await expect(page.getByText(/^450 × /)).toBeVisible();
  await line.getByRole('button', { name: 'Delete' }).click();
  await expect(page.getByText(/^450 × /)).toHaveCount(0);
  await expect(total).toHaveText(/^0(\.0+)? gal\/day$/);

  // Stations: a station at −20 m along the bank.
  await page.goto(`/field/visit/positions?id=${id}`);
  await page.getByLabel('Distance along the bank from the top').fill('-20');
  await page.getByLabel('Level (reduced level)', { exact: true }).fill('10');
  await page.getByRole('button', { name: 'Save station' }).click();
  await expectFieldAlert(page, /must not be negative/);
});
