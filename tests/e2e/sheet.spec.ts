import { readFileSync } from 'node:fs';
import { expect, test, type Page } from '@playwright/test';

const PASSWORD = 'fallbook-demo';
const shots = process.env.SHEET_SCREENSHOTS_DIR; // set by hand to look at the pages

async function signIn(page: Page, email: string) {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).not.toHaveURL(/\/login/);
}

test('a farmer enters needs, and the advisor gets them as demand lines from the server', async ({ page, browser }) => {
  await signIn(page, 'gwen@wenlow-water.test');
  await page.getByRole('link', { name: "Water needs for Pryce's Upper Field" }).click();
  await expect(page.getByRole('heading', { level: 1 })).toContainText("Pryce's Upper Field");
  const farmId = page.url().match(/farms\/([0-9a-f-]{36})\/needs/)?.[1];
  expect(farmId).toBeTruthy();
  await page.getByLabel('People in the household').fill('5');
  // The demo farm has goats; change their number and add hens.
  const counts = page.getByLabel('How many');
  await counts.first().fill('46');
  await page.getByRole('button', { name: 'Add animals' }).click();
  await page.getByLabel('Kind').last().selectOption({ label: 'Laying hen' });
  await counts.last().fill('12');
  await page.getByLabel('Garden to water').fill('80');
  await page.getByLabel('Where should the tank be?').fill('Ridge behind the house');
  await page.getByRole('button', { name: 'Save my needs' }).click();
  await expect(page.getByRole('status')).toContainText('Saved');

  const advisor = await browser.newContext();
  const advisorPage = await advisor.newPage();
  await signIn(advisorPage, 'tobias@wenlow-water.test');
  const res = await advisorPage.request.get(`/api/farms/${farmId}/demand`);
  expect(res.status()).toBe(200);
  const { needs } = await res.json();
  const counted = Object.fromEntries(needs.lines.map((l: { kind: string; count: number }) => [l.kind, l.count]));
  expect(counted).toMatchObject({ goat: 46, 'laying-hen': 12, 'garden-m2': 80, 'person-tap-on-plot': 5 });
  expect(needs.tankSite).toBe('Ridge behind the house');
  await advisor.close();
});

test('a farmer opens their sheet, downloads the PDF and acknowledges it', async ({ page }) => {
  await signIn(page, 'hallie@wenlow-water.test');
  await page.getByRole('link', { name: 'Read the sheet for Brandt Hollow' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Brandt Hollow' })).toBeVisible();
  await expect(page.getByTestId('verdict')).toHaveText(/Go/);
  await expect(page.getByText(/This site can deliver [\d,]+ litres a day/)).toBeVisible();
  await expect(page.getByRole('img', { name: /Elevation profile/ })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Cautions' })).toBeVisible();
  // Where the numbers come from: a source with an address opens its document in a new tab; one without is plain text.
  const sources = page.locator('h3:text-is("Where the numbers come from") + ul > li');
  const links = sources.locator('a');
  expect(await links.count()).toBeGreaterThan(0);
  for (const link of await links.all()) {
    await expect(link).toHaveAttribute('href', /^https:\/\//);
    await expect(link).toHaveAttribute('target', '_blank');
    await expect(link).toHaveAttribute('rel', 'noopener noreferrer');
  }
  expect(await sources.filter({ hasNot: page.locator('a') }).count()).toBeGreaterThan(0);
  if (shots) {
    await page.screenshot({ path: `${shots}/sheet-phone.png`, fullPage: true });
    await page.emulateMedia({ media: 'print' });
    await page.screenshot({ path: `${shots}/sheet-print.png`, fullPage: true });
    await page.emulateMedia({ media: 'screen' });
  }

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download PDF (A4)' }).click()]);
  const pdf = readFileSync(await download.path());
  expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  expect(download.suggestedFilename()).toMatch(/\.pdf$/);

  await page.getByRole('button', { name: 'I have read this sheet' }).click();
  await expect(page.getByText('You have told us you read this sheet. That is not a yes')).toBeVisible();
  await page.getByLabel('Ask your advisor a question').fill('Could the tank sit nearer the yard?');
  await page.getByRole('button', { name: 'Send question' }).click();
  await expect(page.getByRole('region', { name: 'Questions and answers' })).toContainText('Could the tank sit nearer the yard?');
});

test("another farmer cannot open someone else's sheet: the not-found page, as if there were none", async ({ page, browser }) => {
  await signIn(page, 'hallie@wenlow-water.test');
  await page.getByRole('link', { name: 'Read the sheet for Brandt Hollow' }).click();
  await expect(page).toHaveURL(/\/sheets\//);
  const other = await browser.newContext();
  const otherPage = await other.newPage();
  await signIn(otherPage, 'gwen@wenlow-water.test');
  const response = await otherPage.goto(page.url());
  expect(response?.status()).toBe(404);
  await expect(otherPage.getByRole('heading', { name: 'Nothing here' })).toBeVisible();
  await other.close();
});

test('the coordinator sends a demo sheet to the farmer and sees it recorded', async ({ page }) => {
  await signIn(page, 'maren@wenlow-water.test');
  const list = await (await page.request.get('/api/visits?pageSize=100')).json();
  const visit = list.items.find((v: { farm: { name: string } }) => v.farm.name === "Pryce's Upper Field");
  await page.goto(`/sheets/${visit.id}`);
  await expect(page.getByRole('heading', { level: 1, name: "Pryce's Upper Field" })).toBeVisible();
  await page.getByRole('button', { name: /Send to Gwen Pryce/ }).click();
  await expect(page.getByRole('list', { name: 'Sends of this sheet' })).toContainText('Sent to gwen@wenlow-water.test');
});

test('the drawings fit the screen from 320 to 1440 px: no sideways scroll, every label inside its frame, the tank in view', async ({ page }) => {
  await signIn(page, 'gwen@wenlow-water.test');
  const list = await (await page.request.get('/api/visits?pageSize=100')).json();
  const visit = list.items.find((v: { farm: { name: string } }) => v.farm.name === "Pryce's Upper Field");
  for (const width of [320, 412, 1440]) {
    await page.setViewportSize({ width, height: 900 });
    await page.goto(`/sheets/${visit.id}`);
    await expect(page.getByRole('img', { name: /Elevation profile/ })).toBeVisible();
    const measured = await page.evaluate(() => {
      const out: string[] = [];
      if (document.documentElement.scrollWidth > window.innerWidth + 1)
        out.push(`page scrolls sideways: ${document.documentElement.scrollWidth} > ${window.innerWidth}`);
      const drawings = [...document.querySelectorAll<SVGSVGElement>('[data-testid="profile-drawing"], [data-testid="site-map-drawing"]')].filter(
        (svg) => svg.getBoundingClientRect().width > 0,
      );
      for (const svg of drawings) {
        const frame = svg.getBoundingClientRect();
        if (frame.right > window.innerWidth + 1) out.push(`${svg.dataset.testid} runs past the screen`);
        for (const text of svg.querySelectorAll('text')) {
          const r = text.getBoundingClientRect();
          if (r.left < frame.left - 1 || r.right > frame.right + 1 || r.top < frame.top - 1 || r.bottom > frame.bottom + 1)
            out.push(`"${text.textContent}" outside ${svg.dataset.testid}`);
        }
        const tank = svg.querySelector('[data-node="tank"] rect')?.getBoundingClientRect();
        if (svg.dataset.testid === 'profile-drawing' && (!tank || tank.right > frame.right + 1 || tank.left < frame.left)) out.push('tank out of view');
      }
      return { problems: out, drawings: drawings.length };
    });
    expect(measured.drawings, `at ${width} px`).toBe(2);
    expect(measured.problems, `at ${width} px`).toEqual([]);
    if (shots) await page.screenshot({ path: `${shots}/sheet-${width}.png`, fullPage: true });
  }
});

test('the coordinator previews the e-mail with a personal note before sending, from the link at the top', async ({ page }) => {
  await signIn(page, 'maren@wenlow-water.test');
  const list = await (await page.request.get('/api/visits?pageSize=100')).json();
  const visit = list.items.find((v: { farm: { name: string } }) => v.farm.name === "Pryce's Upper Field");
  await page.goto(`/sheets/${visit.id}`);
  await page.getByRole('link', { name: 'Send this sheet' }).click();
  await expect(page).toHaveURL(/#send-sheet$/);
  await page.getByLabel('A personal note (optional)').fill('I will call round on Tuesday.');
  await page.getByRole('button', { name: 'Preview the e-mail' }).click();
  const preview = page.getByRole('region', { name: 'E-mail preview' });
  await expect(preview).toContainText('To: gwen@wenlow-water.test');
  await expect(preview).toContainText("Subject: Your water sheet: Pryce's Upper Field");
  await expect(preview).toContainText('I will call round on Tuesday.');
});

test("a deferred part with links or buttons is no taller than its stand-in, on the narrowest screens (a farmer's sheet with a conversation)", async ({
  page,
}) => {
  // Laid out by a checker before the reader scrolls near, the part's content stays inside the
  // stand-in's height; taller, it would run over the targets that follow.
  await signIn(page, 'hallie@wenlow-water.test');
  await page.getByRole('link', { name: 'Read the sheet for Brandt Hollow' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Brandt Hollow' })).toBeVisible();
  await page.getByLabel('Ask your advisor a question').fill('Could the ram sit lower down, by the ford, so the drive pipe is shorter?');
  await page.getByRole('button', { name: 'Send question' }).click();
  await expect(page.getByRole('list', { name: 'Conversation about this sheet' })).toContainText('by the ford');
  const url = page.url();
  for (const width of [320, 640]) {
    await page.setViewportSize({ width, height: 800 });
    await page.goto(url);
    await expect(page.getByRole('heading', { level: 1, name: 'Brandt Hollow' })).toBeVisible();
    const parts = await page.evaluate((wide) => {
      const rem = parseFloat(getComputedStyle(document.documentElement).fontSize);
      return [...document.querySelectorAll<HTMLElement>('main section, main div')]
        .filter((el) => getComputedStyle(el).contentVisibility === 'auto')
        .map((el) => ({
          name: el.querySelector('h2')?.textContent ?? '?',
          targets: el.querySelectorAll('a, button, input, textarea, select').length,
          standIn: parseFloat(el.style.getPropertyValue(wide ? '--stand-in-wide' : '--stand-in-narrow')) * rem,
        }));
    }, width >= 640);
    const withTargets = parts.filter((p) => p.targets > 0);
    expect(withTargets.map((p) => p.name)).toEqual(expect.arrayContaining(['How we worked this out', 'Your answer']));
    for (const part of withTargets) {
      const section = page
        .locator('main section, main div')
        .filter({ has: page.getByRole('heading', { level: 2, name: part.name, exact: true }) })
        .last();
      await section.scrollIntoViewIfNeeded();
      // Laid out now: its height is its content's.
      await expect.poll(async () => section.evaluate((el) => el.getBoundingClientRect().height)).toBeGreaterThan(0);
      const height = await section.evaluate((el) => (el.closest('[style*="--stand-in-narrow"]') as HTMLElement).getBoundingClientRect().height);
      expect(height, `${part.name} at ${width} px`).toBeLessThanOrEqual(part.standIn);
    }
  }
});
