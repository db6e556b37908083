import { expect, test, type Page } from '@playwright/test';
import { query } from './support/db';
import { signInAs, waitForWorker } from './support/sign-in';

// The field book on a 412 px phone: every link and button a thumb's size, no console errors on any
// page, navigation between field pages with no signal and no full reload, and a US-units advisor who
// sees only US units on every field screen and the preview.
const shots = '/tmp/units-shots';
const SECTIONS = ['flow', 'fall', 'points', 'photos', 'demand', 'pipes', 'positions', 'commission'];

/** Every field page of one visit, and the home and sync pages. */
function fieldPages(visitId: string): string[] {
  return ['/field', '/field/sync', `/field/visit?id=${visitId}`, ...SECTIONS.map((s) => `/field/visit/${s}?id=${visitId}`)];
}

/** The id of a visit on the advisor's home, by its farm's name. */
async function visitIdOf(page: Page, farm: RegExp): Promise<string> {
  const link = page.getByRole('link', { name: farm });
  await expect(link).toBeVisible({ timeout: 15_000 });
  return new URL((await link.getAttribute('href'))!, 'http://x').searchParams.get('id')!;
}

/** Opens a field page and waits until the phone's data is drawn (no "Reading the phone…" left). */
async function openField(page: Page, path: string): Promise<void> {
  await page.goto(path);
  await expect(page.locator('main h1, main h2').first()).toBeVisible({ timeout: 15_000 });
  await expect(page.getByText('Reading the phone…')).toHaveCount(0, { timeout: 15_000 });
  await expect(page.getByTestId('sync-summary')).not.toHaveText('Checking the phone…', { timeout: 15_000 });
}

/** Links, buttons and disclosures on screen shorter than 44 px (the map's own controls excepted: the map is drawn by Leaflet). */
async function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const small: string[] = [];
    for (const el of Array.from(document.querySelectorAll<HTMLElement>('a, button, summary, [role="button"]'))) {
      if (el.closest('.leaflet-container')) continue;
      const box = el.getBoundingClientRect();
      const style = getComputedStyle(el);
      if (box.width === 0 || box.height === 0 || style.visibility === 'hidden') continue;
      if (box.height < 44 - 0.5) small.push(`${(el.textContent ?? '').trim().slice(0, 40) || el.getAttribute('aria-label')} (${Math.round(box.height)} px)`);
    }
    return small;
  });
}

test('every field page: tap targets of 44 px or more and no console errors, at 412 px', async ({ page }) => {
  test.setTimeout(120_000);
  const errors: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(`${page.url()}: ${m.text()}`);
  });
  page.on('pageerror', (e) => errors.push(`${page.url()}: ${e.message}`));
  await signInAs(page, 'tobias@wenlow-water.test', /\/field$/);
  await waitForWorker(page);
  expect(page.viewportSize()?.width).toBe(412);
  const visitId = await visitIdOf(page, /Brandt Hollow/);
  const small: string[] = [];
  for (const path of fieldPages(visitId)) {
    await openField(page, path);
    small.push(...(await smallTargets(page)).map((s) => `${path}: ${s}`));
    await page.screenshot({ path: `${shots}/phone-metric${path.replace(/[/?=]/g, '_')}.png`, fullPage: true });
  }
  await page.setViewportSize({ width: 1280, height: 900 });
  await openField(page, `/field/visit/demand?id=${visitId}`);
  await page.screenshot({ path: `${shots}/desktop-metric-demand.png`, fullPage: true });
  expect(small).toEqual([]);
  expect(errors).toEqual([]);
});

test('with no signal, in-app links move between field pages without a full reload or an error', async ({ page, context }) => {
  test.setTimeout(90_000);
  const messages: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error' || m.type() === 'warning') messages.push(m.text());
  });
  page.on('pageerror', (e) => messages.push(e.message));
  await signInAs(page, 'tobias@wenlow-water.test', /\/field$/);
  await waitForWorker(page);
  const visitId = await visitIdOf(page, /Brandt Hollow/);
  await openField(page, `/field/visit?id=${visitId}`);
  await context.setOffline(true);
  // A mark on the window survives client-side navigation and is gone after a full reload.
  await page.evaluate(() => {
    (window as unknown as { stayed?: boolean }).stayed = true;
  });
  for (const [link, heading] of [
    ['Source and flow', 'Source and flow'],
    ['Back to the visit', 'Brandt Hollow'],
    ['Water needed', 'Water needed'],
    ['Back to the visit', 'Brandt Hollow'],
    ['My visits', 'My site visits'],
  ] as const) {
    await page
      .getByRole('link', { name: new RegExp(link) })
      .first()
      .click();
    await expect(page.getByRole('heading', { level: 1, name: new RegExp(heading) })).toBeVisible({ timeout: 15_000 });
  }
  expect(await page.evaluate(() => (window as unknown as { stayed?: boolean }).stayed === true)).toBe(true);
  expect(messages.filter((m) => /RSC payload|bootstrap|Failed to fetch/i.test(m))).toEqual([]);
  await context.setOffline(false);
});

// Metric units and words a US reader should never meet: a number followed by a metric unit, or the unit words.
const METRIC = /\d\s?(mm|cm|km|m|L|kPa|hPa|°C)(?![\w/])|\d\s?L\/(day|min|s)\b|\b(litres?|metres?|per m²)\b|\d\s?m²/i;

test('a US-units advisor sees only US units on every field screen and the preview', async ({ page }) => {
  test.setTimeout(120_000);
  // Tobias's visits carry readings (Brandt Hollow is screened): he reads them in US units for this test.
  await query("UPDATE users SET units = 'us' WHERE email = 'tobias@wenlow-water.test'");
  try {
    await signInAs(page, 'tobias@wenlow-water.test', /\/field$/);
    await waitForWorker(page);
    const visitId = await visitIdOf(page, /Brandt Hollow/);
    const found: string[] = [];
    for (const path of fieldPages(visitId)) {
      await openField(page, path);
      if (path.startsWith('/field/visit?')) await expect(page.getByTestId('preview-verdict')).toBeVisible({ timeout: 15_000 });
      // Typed values too: what a field shows to edit.
      // The map's scale bar is the map's own (Leaflet) and is left out here.
      await page.locator('.leaflet-control-scale').evaluateAll((els) => els.forEach((e) => e.remove()));
      const text = `${await page.locator('main').innerText()}\n${(await page.locator('main input[type="text"]').evaluateAll((els) => els.map((e) => (e as HTMLInputElement).value))).join('\n')}`;
      // A saved point's name is the advisor's own text (an adopted pair names its station in the units of whoever adopted it).
      const ownText = /^(Intake|Pump site|Tank|Creek-profile station|Source|Other point) · /;
      for (const line of text.split('\n')) if (METRIC.test(line) && !ownText.test(line.trim())) found.push(`${path}: ${line.trim()}`);
      // A prefilled figure is rounded for reading: never six decimals.
      for (const value of await page.locator('main input[inputmode="decimal"]').evaluateAll((els) => els.map((e) => (e as HTMLInputElement).value))) {
        expect(value, path).not.toMatch(/\.\d{4,}/);
      }
      await page.screenshot({ path: `${shots}/phone-us${path.replace(/[/?=]/g, '_')}.png`, fullPage: true });
    }
    // A conditional go: the preview lists the engine's reasons, rendered in US units.
    await openField(page, '/field');
    const conditional = await visitIdOf(page, /Pryce's Upper Field/);
    await openField(page, `/field/visit?id=${conditional}`);
    const reasons = page.getByTestId('preview-verdict').locator('li');
    await expect(reasons.first()).toBeVisible({ timeout: 15_000 });
    for (const line of await reasons.allInnerTexts()) if (METRIC.test(line)) found.push(`preview: ${line}`);
    expect((await reasons.allInnerTexts()).join(' ')).toMatch(/\d (ft|gal\/day|gal\/min|gal|in|psi)\b/);
    await page.screenshot({ path: `${shots}/phone-us-preview-conditional.png`, fullPage: true });
    await page.setViewportSize({ width: 1280, height: 900 });
    await openField(page, `/field/visit?id=${visitId}`);
    await page.screenshot({ path: `${shots}/desktop-us-visit.png`, fullPage: true });
    expect(found).toEqual([]);
  } finally {
    await query("UPDATE users SET units = 'metric' WHERE email = 'tobias@wenlow-water.test'");
  }
});

test('the phone home flags an overdue visit', async ({ page }) => {
  await signInAs(page, 'ines@wenlow-water.test', /\/field$/);
  // Lark Spinney is booked for a day that has passed; Otieno Orchard Croft is not.
  const overdue = page.getByRole('link', { name: /Lark Spinney/ });
  await expect(overdue).toBeVisible({ timeout: 15_000 });
  await expect(overdue.getByTestId('overdue')).toHaveText(/Overdue/);
  await expect(page.getByRole('link', { name: /Otieno Orchard Croft/ }).getByTestId('overdue')).toHaveCount(0);
});
