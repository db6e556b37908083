import { expect, test, type Browser, type Page } from '@playwright/test';

const PASSWORD = 'fallbook-demo';

async function signIn(page: Page, email: string, password = PASSWORD) {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

async function newPage(browser: Browser) {
  const context = await browser.newContext();
  return { context, page: await context.newPage() };
}

test('a coordinator assigns a visit to an advisor; the advisor sees it on their own list', async ({ browser }) => {
  const office = await newPage(browser);
  await signIn(office.page, 'maren@wenlow-water.test');
  await expect(office.page).toHaveURL(/\/office$/);
  const table = office.page.getByRole('table', { name: 'Visits in the district' });
  // The district's 40-odd visits fill more than a page; an unplanned one is found by its name.
  await office.page.getByRole('search', { name: 'Filter visits' }).getByLabel('Farm or farmer').fill('Cwm Rhyd');
  await expect(table).toContainText('Cwm Rhyd paddock');
  // Cwm Rhyd paddock is requested and unassigned in the demo; it goes to Tobias.
  await table.getByRole('link', { name: 'Cwm Rhyd paddock' }).click();
  await expect(office.page.getByRole('heading', { level: 1, name: 'Cwm Rhyd paddock' })).toBeVisible();
  const form = office.page.getByRole('form', { name: 'Assign the visit' });
  await form.getByRole('button', { name: /Assign|Save assignment/ }).click();
  await expect(form.getByText('Choose an advisor.')).toBeVisible();
  await form.getByLabel('Advisor').selectOption({ label: 'Tobias Kerr' });
  // A date within the two years ahead the office may plan.
  await form.getByLabel('Planned date').fill(new Date(Date.now() + 40 * 86_400_000).toISOString().slice(0, 10));
  await form.getByRole('button', { name: /Assign|Save assignment/ }).click();
  await expect(form.getByRole('status')).toContainText('Saved');
  await expect(office.page.getByRole('list', { name: 'Change history' })).toContainText('Tobias Kerr');
  await office.page.screenshot({ path: '/tmp/office-visit.png', fullPage: true });

  const field = await newPage(browser);
  await signIn(field.page, 'tobias@wenlow-water.test');
  await expect(field.page).toHaveURL(/\/field$/);
  // The field book pulls the new assignment into the phone's database at its first sync.
  await expect(field.page.getByRole('link', { name: /Cwm Rhyd paddock/ })).toBeVisible({ timeout: 15_000 });
  await office.context.close();
  await field.context.close();
});

test('the visits table filters through the URL and the filter survives a reload', async ({ page }) => {
  await signIn(page, 'maren@wenlow-water.test');
  const table = page.getByRole('table', { name: 'Visits in the district' });
  await expect(table).toContainText('Brandt Hollow');
  await page.getByRole('search', { name: 'Filter visits' }).getByLabel('Farm or farmer').fill('Otieno');
  await expect(page).toHaveURL(/q=Otieno/);
  await expect(table).not.toContainText('Brandt Hollow');
  await expect(table).toContainText('Otieno Orchard Croft');
  await page.reload();
  await expect(page.getByRole('table', { name: 'Visits in the district' })).toContainText('Otieno Orchard Croft');
  await expect(page.getByRole('table', { name: 'Visits in the district' })).not.toContainText('Brandt Hollow');
  await page.goto('/office');
  await page.screenshot({ path: '/tmp/office-home.png', fullPage: true });
  await page.goto('/office/map');
  await expect(page.getByRole('list', { name: 'Legend' })).toContainText('No-go');
  await expect(page.locator('.fallbook-marker').first()).toBeVisible();
  await page.screenshot({ path: '/tmp/office-map.png', fullPage: true });
});

test('an invited person sets a password from the e-mailed link and signs in', async ({ page, browser, request }) => {
  const email = `e2e-${Date.now().toString(36)}@wenlow-water.test`;
  await signIn(page, 'maren@wenlow-water.test');
  await expect(page).toHaveURL(/\/office$/);
  await page.goto('/office/people');
  const form = page.getByRole('form', { name: 'Invite someone' });
  await form.getByLabel('Name').fill('Rowan Ellery');
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Role').selectOption('advisor');
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await expect(form.getByRole('status')).toContainText(`Invitation sent to ${email}`);
  await page.screenshot({ path: '/tmp/office-people.png', fullPage: true });

  const inbox = await request.get(`http://127.0.0.1:${process.env.MAIL_INBOX_PORT}/messages`);
  const messages = (await inbox.json()).messages as { to: string; raw: string }[];
  const raw = messages.filter((m) => m.to.includes(email)).at(-1)?.raw ?? '';
  const link = raw.replace(/=\r?\n/g, '').match(/https?:\/\/\S+\/welcome\/[A-Za-z0-9_-]+/)?.[0];
  expect(link).toBeTruthy();
  const path = new URL(link!).pathname;

  const guest = await browser.newContext();
  const welcome = await guest.newPage();
  await welcome.goto(path);
  await expect(welcome.getByRole('heading', { name: 'Welcome to Fallbook' })).toBeVisible();
  await welcome.getByLabel('New password').fill('short');
  await welcome.getByLabel('The same password again').fill('short');
  await welcome.getByRole('button', { name: 'Set my password' }).click();
  await expect(welcome.getByText('Use at least 10 characters.')).toBeVisible();
  await welcome.getByLabel('New password').fill('rowan walks the creek');
  await welcome.getByLabel('The same password again').fill('rowan walks the creek');
  await welcome.getByRole('button', { name: 'Set my password' }).click();
  await expect(welcome.getByText('Your password is set.')).toBeVisible();
  await welcome.getByRole('link', { name: 'Sign in' }).click();
  await welcome.getByLabel('E-mail').fill(email);
  await welcome.getByLabel('Password').fill('rowan walks the creek');
  await welcome.getByRole('button', { name: 'Sign in' }).click();
  await expect(welcome).toHaveURL(/\/field$/);

  await welcome.goto(path);
  await expect(welcome.getByText(/already been used/)).toBeVisible();
  await guest.close();
});
