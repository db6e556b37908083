// The demo district as a coordinator first opens it: open questions waiting, a board with visits
// in many states, two running rams compared with their predictions. On a desktop and a phone.
import { expect, test } from '@playwright/test';
import { signInAs } from './support/sign-in';

const shots = '/tmp/office-map-shots';

for (const [label, viewport] of [
  ['desktop', { width: 1280, height: 900 }],
  ['phone', { width: 412, height: 915 }],
] as const) {
  test(`the office home shows the district's morning (${label})`, async ({ page }) => {
    await page.setViewportSize(viewport);
    await signInAs(page, 'maren@wenlow-water.test', /\/office$/);
    const questions = page.getByRole('list', { name: 'Questions waiting for an answer' });
    await expect(questions).toContainText('Rowan Leys');
    await expect(questions).toContainText('Glanrhos');
    await expect(page.getByRole('table', { name: 'Visits in the district' })).toContainText('Brandt Hollow');
    await page.screenshot({ path: `${shots}/office-home-${label}.png`, fullPage: true });
    await page.goto('/office/commissioning');
    await expect(page.getByRole('table')).toContainText('Gorsedd Fach');
    await expect(page.getByRole('table')).toContainText('Pant-y-Brwyn');
    await page.screenshot({ path: `${shots}/office-commissioning-${label}.png`, fullPage: true });
  });
}
