// As a person sees them: an invitation link that a newer one replaced says so in a plain sentence
// on the welcome page (the newest link shows the form), and a coordinator brings back a deleted
// visit from the office home with its Restore button.
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { expect, test, type Page } from '@playwright/test';
import { query } from './support/db';

const sha = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

async function signIn(page: Page, email: string) {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('fallbook-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
}

test('a superseded invitation link shows a plain sentence; the newest one shows the password form', async ({ page }) => {
  const [maren] = await query<{ id: string; organisationId: string }>(
    "SELECT id, organisation_id AS organisationId FROM users WHERE email = 'maren@wenlow-water.test'",
  );
  const userId = randomUUID();
  const email = `welcome-${userId.slice(0, 8)}@wenlow-water.test`;
  await query(
    `INSERT INTO users (id, organisation_id, email, name, role, password_hash, active, units, session_version, created_at, updated_at)
    VALUES (?, ?, ?, 'Wren Invitee', 'farmer', NULL, 1, 'metric', 1, NOW(3), NOW(3))`,
    [userId, maren?.organisationId, email],
  );
  const [older, newer] = [randomBytes(32).toString('base64url'), randomBytes(32).toString('base64url')];
  for (const [token, superseded] of [
    [older, true],
    [newer, false],
  ] as const) {
    await query(
      `INSERT INTO invitations (id, organisation_id, email, name, role, token_hash, invited_by_id, user_id, expires_at, used_at, superseded_at, withdrawn_at, created_at)
      VALUES (?, ?, ?, 'Wren Invitee', 'farmer', ?, ?, ?, NOW() + INTERVAL 7 DAY, NULL, ?, NULL, NOW())`,
      [randomUUID(), maren?.organisationId, email, sha(token), maren?.id, userId, superseded ? new Date() : null],
    );
  }
  await page.goto(`/welcome/${older}`);
  await expect(page.getByRole('main').getByRole('alert')).toHaveText(
    'A newer invitation was sent to this address, so this link no longer works. Use the link in the latest e-mail.',
  );
  await expect(page.getByRole('form', { name: 'Choose a password' })).toHaveCount(0);
  await page.screenshot({ path: 'test-results/welcome-superseded.png' });
  await page.goto(`/welcome/${newer}`);
  await expect(page.getByRole('form', { name: 'Choose a password' })).toBeVisible();
});

test('a coordinator restores a deleted visit from the office home', async ({ page }) => {
  await signIn(page, 'maren@wenlow-water.test');
  await expect(page).toHaveURL(/\/office$/);
  const farms = (await (await page.request.get('/api/farms?page=1&pageSize=10')).json()) as { items: { id: string; name: string }[] };
  const farm = farms.items[0]!;
  const created = await page.request.post('/api/visits', {
    data: { farmId: farm.id, notes: 'to be deleted and restored', confirmDuplicate: true },
    headers: { origin: new URL(page.url()).origin },
  });
  expect(created.status()).toBe(201);
  const visitId = (await created.json()).visit.id as string;
  await query('UPDATE visits SET deleted_at = NOW(3) WHERE id = ?', [visitId]);

  await page.reload();
  const section = page.getByRole('region', { name: 'Deleted visits' });
  await expect(section).toBeVisible();
  const row = section.getByRole('listitem').filter({ hasText: farm.name });
  await expect(row).toHaveCount(1);
  await page.screenshot({ path: 'test-results/office-deleted-visits.png', fullPage: true });
  await row.getByRole('button', { name: 'Restore' }).click();
  await expect(section.getByRole('status')).toContainText(`The visit to ${farm.name} is back`);
  expect((await page.request.get(`/api/visits/${visitId}`)).status()).toBe(200);
  const [stored] = await query<{ deletedAt: Date | null }>('SELECT deleted_at AS deletedAt FROM visits WHERE id = ?', [visitId]);
  expect(stored?.deletedAt).toBeNull();
});
