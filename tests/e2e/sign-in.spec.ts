import { expect, test } from '@playwright/test';

const PASSWORD = 'fallbook-demo';

// Each demo account lands on its own home page (issue: foundation, e2e).
const accounts = [
  { email: 'maren@wenlow-water.test', home: '/office', heading: 'District office' },
  { email: 'tobias@wenlow-water.test', home: '/field', heading: 'My site visits' },
  { email: 'ines@wenlow-water.test', home: '/field', heading: 'My site visits' },
  { email: 'gwen@wenlow-water.test', home: '/farm', heading: 'My farm' },
  { email: 'hallie@wenlow-water.test', home: '/farm', heading: 'My farm' },
  { email: 'samuel@wenlow-water.test', home: '/farm', heading: 'My farm' },
];

async function signIn(page: import('@playwright/test').Page, email: string, password: string) {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

for (const account of accounts) {
  test(`${account.email} signs in and lands on ${account.home}`, async ({ page }) => {
    await signIn(page, account.email, PASSWORD);
    await expect(page).toHaveURL(new RegExp(`${account.home}$`));
    await expect(page.getByRole('heading', { level: 1, name: account.heading })).toBeVisible();
  });
}

test('a wrong password is refused with a message, and the user stays on the sign-in page', async ({ page }) => {
  await signIn(page, 'tobias@wenlow-water.test', 'not-the-password');
  await expect(page.getByRole('form', { name: 'Sign in' }).getByRole('alert')).toContainText('do not match an active account');
  await expect(page).toHaveURL(/\/login/);
});

test('an empty form shows what is missing without asking the server', async ({ page }) => {
  await page.goto('/login');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByText('Enter the e-mail address you were invited with.')).toBeVisible();
  await expect(page.getByText('Enter your password.')).toBeVisible();
});

test('an advisor opening a coordinator page gets the 403 page', async ({ page }) => {
  await signIn(page, 'ines@wenlow-water.test', PASSWORD);
  await expect(page).toHaveURL(/\/field$/);
  const response = await page.goto('/office');
  expect(response?.status()).toBe(403);
  await expect(page.getByRole('heading', { name: 'This page is not for your account' })).toBeVisible();
});

test('a signed-out visitor of a home page is sent to sign in, then back', async ({ page }) => {
  await page.goto('/office');
  await expect(page).toHaveURL(/\/login\?callbackUrl=/);
  await page.getByLabel('E-mail').fill('maren@wenlow-water.test');
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/office$/);
});

test('an off-site return address is dropped: signing in, or opening it signed in, stays on Fallbook', async ({ page, baseURL }) => {
  const origin = new URL(baseURL ?? page.url()).origin;
  for (const evil of ['%2F%5Cevil.example%2Fphish', '%2F%09%2Fevil.example']) {
    await page.context().clearCookies();
    await page.goto(`/login?callbackUrl=${evil}`);
    await page.getByLabel('E-mail').fill('maren@wenlow-water.test');
    await page.getByLabel('Password').fill(PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page).toHaveURL(new RegExp(`^${origin}/office$`));
    // Signed in, the page redirects at once: to the home page, never off-site.
    const seen: string[] = [];
    page.on('request', (r) => seen.push(new URL(r.url()).host));
    await page.goto(`/login?callbackUrl=${evil}`);
    await expect(page).toHaveURL(new RegExp(`^${origin}/office$`));
    expect(seen.filter((h) => h.includes('evil.example'))).toEqual([]);
  }
});

test('a same-origin return address keeps its whole path and query string through sign-in', async ({ page }) => {
  await page.goto(`/login?callbackUrl=${encodeURIComponent('/office?status=scheduled&sort=plannedOn')}`);
  await page.getByLabel('E-mail').fill('maren@wenlow-water.test');
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/office\?status=scheduled&sort=plannedOn$/);
});

test('sign-out ends the session', async ({ page }) => {
  await signIn(page, 'gwen@wenlow-water.test', PASSWORD);
  await expect(page).toHaveURL(/\/farm$/);
  await page.getByRole('button', { name: 'Sign out', exact: true }).click();
  await expect(page).toHaveURL(/\/login/);
  await page.goto('/farm');
  await expect(page).toHaveURL(/\/login/);
});

test('the coordinator home reads the district from the database', async ({ page }) => {
  await signIn(page, 'maren@wenlow-water.test', PASSWORD);
  await expect(page.getByRole('table', { name: 'Visits in the district' })).toContainText('Brandt Hollow');
  // The district's 40-odd visits fill more than a page; an unplanned one is found by its name.
  await page.getByRole('search', { name: 'Filter visits' }).getByLabel('Farm or farmer').fill('Cwm Rhyd');
  await expect(page.getByRole('table', { name: 'Visits in the district' })).toContainText('Cwm Rhyd paddock');
});
