// Signing in as a demo account from the sign-in page, as a person would.
import { expect, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'fallbook-demo';

/** Signs in and waits for the role's home page (e.g. /\/field$/). */
export async function signInAs(page: Page, email: string, home: RegExp): Promise<void> {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(home);
}

/** Waits until the service worker controls the page (the field pages then open offline). */
export async function waitForWorker(page: Page): Promise<void> {
  await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller).catch(() => false), { timeout: 20_000 }).toBe(true);
}
