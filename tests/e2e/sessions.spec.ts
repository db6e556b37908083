// Sessions in the browser, on a coordinator account of its own (the demo accounts stay untouched):
// switching the account off ends a live session on pages and API routes at once, and five wrong
// passwords lock the account even against the right one, with a message on the form.
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

test('five wrong passwords lock the account: the right one is then refused with a wait message', async ({ page }) => {
  const { email } = await makeCoordinator();
  for (let i = 0; i < 5; i++) {
    await submitSignIn(page, email, `wrong-${i}`);
    await expect(page.getByRole('form', { name: 'Sign in' }).getByRole('alert')).toContainText('do not match an active account');
  }
  await submitSignIn(page, email, PASSWORD);
  await expect(page.getByRole('form', { name: 'Sign in' }).getByRole('alert')).toContainText('Too many failed sign-ins for this account. Wait 15 minutes');
  await expect(page).toHaveURL(/\/login/);
  expect((await page.request.get('/api/me')).status()).toBe(401);
});
