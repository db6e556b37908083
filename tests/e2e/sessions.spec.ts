// Sessions in the browser, on a coordinator account of its own (the demo accounts stay untouched):
// switching the account off ends a live session on pages and API routes at once, wrong passwords
// slow the account down for seconds (never a lockout of the owner), and signing out ends the session.
import { randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { expect, test, type Page } from '@playwright/test';
import { query } from './support/db';

const PASSWORD = 'session-test-password';

/** A fresh coordinator in the demo organisation; returns its e-mail and id. */
async function makeCoordinator(): Promise<{ id: string; email: string }> {
  const [maren] = await query<{ organisationId: string }>("SELECT organisation_id AS organisationId FROM users WHERE email = 'maren@wenlow-water.test'");
  const id = randomUUID();
  const email = `session-${id.slice(0, 8)}@wenlow-water.test`;
  await query(
    `INSERT INTO users (id, organisation_id, email, name, role, password_hash, active, units, session_version, created_at, updated_at)
     VALUES (?, ?, ?, 'Session Tester', 'coordinator', ?, 1, 'metric', 1, NOW(3), NOW(3))`,
    [id, maren?.organisationId, email, await bcrypt.hash(PASSWORD, 10)],
  );
  return { id, email };
}

async function submitSignIn(page: Page, email: string, password: string) {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

test('switching an account off ends its live session on pages and API routes', async ({ page }) => {
  const { id, email } = await makeCoordinator();
  await submitSignIn(page, email, PASSWORD);
  await expect(page).toHaveURL(/\/office$/);
  expect((await page.request.get('/api/me')).status()).toBe(200);

  await query('UPDATE users SET active = 0 WHERE id = ?', [id]);
  // The same, unexpired cookie: the pages send the person to sign in, the API answers 401.
  await page.goto('/office/people');
  await expect(page).toHaveURL(/\/login/);
  const me = await page.request.get('/api/me');
  expect(me.status()).toBe(401);
  expect((await me.json()).error.message).toMatch(/sign in/i);
  expect((await page.request.get('/api/visits?page=1&pageSize=10')).status()).toBe(401);
  // And it cannot sign in again.
  await submitSignIn(page, email, PASSWORD);
  await expect(page.getByRole('form', { name: 'Sign in' }).getByRole('alert')).toContainText('do not match an active account');
});

test('wrong passwords slow the account down, never lock the owner out: after the short wait the right one signs in', async ({ page }) => {
  // The waits themselves (up to 1 + 2 + 4 + 8 s) outlast the default test time.
  test.setTimeout(90_000);
  const { email } = await makeCoordinator();
  // Six wrong passwords that each count: one refused for its wait is sent again once the wait is over,
  // so the last failure leaves an 8 s wait (1 s doubling after three free tries), whatever the machine's speed.
  const form = page.getByRole('form', { name: 'Sign in' });
  for (let counted = 0; counted < 6;) {
    await submitSignIn(page, email, `wrong-${counted}`);
    await expect(form.getByRole('alert')).toContainText(/do not match an active account|Wait \d+ seconds?/);
    const wait = Number((await form.getByRole('alert').textContent())?.match(/Wait (\d+) second/)?.[1] ?? '0');
    if (wait > 0) await page.waitForTimeout((wait + 1) * 1000);
    else counted += 1;
  }
  await submitSignIn(page, email, PASSWORD);
  const alert = page.getByRole('form', { name: 'Sign in' }).getByRole('alert');
  await expect(alert).toContainText(/Too many failed sign-ins for this account\. Wait \d+ seconds?, then try again/);
  const seconds = Number((await alert.textContent())?.match(/Wait (\d+) second/)?.[1] ?? '0');
  expect(seconds).toBeGreaterThan(0);
  expect(seconds).toBeLessThanOrEqual(30);
  await page.waitForTimeout((seconds + 1) * 1000);
  await submitSignIn(page, email, PASSWORD);
  await expect(page).toHaveURL(/\/office$/);
});

test('signing out ends the session on the server: a copy of its cookie is refused afterwards', async ({ page, browser }) => {
  const { email } = await makeCoordinator();
  await submitSignIn(page, email, PASSWORD);
  await expect(page).toHaveURL(/\/office$/);
  const cookies = await page.context().cookies();
  await page.getByRole('button', { name: 'Sign out', exact: true }).click();
  await expect(page).toHaveURL(/\/login/);
  // Another browser holding the copied cookie (as a stolen one would be).
  const other = await browser.newContext();
  await other.addCookies(cookies);
  const me = await other.request.get(new URL('/api/me', page.url()).toString());
  expect(me.status()).toBe(401);
  await other.close();
});

test('"Sign out everywhere" ends the person\'s sessions in every browser', async ({ page, browser }) => {
  const { email } = await makeCoordinator();
  const other = await browser.newContext();
  const otherPage = await other.newPage();
  await submitSignIn(otherPage, email, PASSWORD);
  await expect(otherPage).toHaveURL(/\/office$/);
  await submitSignIn(page, email, PASSWORD);
  await expect(page).toHaveURL(/\/office$/);
  await page.getByRole('button', { name: 'Sign out everywhere' }).click();
  await expect(page).toHaveURL(/\/login/);
  expect((await otherPage.request.get('/api/me')).status()).toBe(401);
  await otherPage.goto('/office');
  await expect(otherPage).toHaveURL(/\/login/);
  await other.close();
});
