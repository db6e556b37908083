// Two phones of one advisor edit the same field of the same visit with no signal, then sync: the
// first wins, the second is told (the sync bar, then the mine/theirs screen), nothing is silently
// overwritten; the advisor keeps theirs knowingly through the screen and MariaDB ends with it.
import { expect, test, type BrowserContext, type Page } from '@playwright/test';
import { query } from './support/db';
import { coordinatorApi, newVisit, phoneState, pressSync, syncUntilDone, waitForHooks } from './support/phone';
import { signInAs, waitForWorker } from './support/sign-in';

test.setTimeout(180_000);

const FT = 0.3048;

async function openPhone(browser: import('@playwright/test').Browser, baseURL: string): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ baseURL });
  const page = await context.newPage();
  await signInAs(page, 'ines@wenlow-water.test', /\/field$/);
  await waitForWorker(page);
  return { context, page };
}

async function setDelivery(page: Page, visitId: string, feet: string) {
  await page.goto(`/field/visit/pipes?id=${visitId}`);
  await page.getByLabel('Length along the route', { exact: true }).nth(1).fill(feet);
  await page.getByRole('button', { name: 'Save pipe runs' }).click();
  await expect(page.getByText('Pipe runs saved on this phone.')).toBeVisible();
}

const deliveryM = async (visitId: string) =>
  await query<{ lengthM: number }>("SELECT length_m AS lengthM FROM pipe_runs WHERE visit_id = ? AND purpose = 'delivery' AND deleted_at IS NULL", [visitId]);

test('two phones edit the same pipe length offline: the second sees a conflict and decides', async ({ browser }) => {
  const baseURL = test.info().project.use.baseURL ?? '';
  const office = await coordinatorApi(browser, baseURL);
  const [ines] = await query<{ id: string }>("SELECT id FROM users WHERE email = 'ines@wenlow-water.test'");
  const visitId = await newVisit(office, ines?.id ?? '', 'Two-phone farm');
  await office.dispose();

  // Phone A measures the delivery pipe (900 ft) and syncs; phone B then pulls it.
  const a = await openPhone(browser, baseURL);
  await setDelivery(a.page, visitId, '900');
  await syncUntilDone(a.page);
  expect((await deliveryM(visitId)).map((r) => r.lengthM)).toEqual([expect.closeTo(900 * FT, 6)]);
  const b = await openPhone(browser, baseURL);
  await waitForHooks(b.page);
  await syncUntilDone(b.page);
  await b.page.goto(`/field/visit/pipes?id=${visitId}`);
  await expect(b.page.getByLabel('Length along the route', { exact: true }).nth(1)).toHaveValue('900');

  // No signal on either: each re-measures the same pipe.
  await a.context.setOffline(true);
  await b.context.setOffline(true);
  await setDelivery(a.page, visitId, '950');
  await setDelivery(b.page, visitId, '1000');

  // A comes back first and wins.
  await a.context.setOffline(false);
  await syncUntilDone(a.page);
  expect((await deliveryM(visitId))[0]?.lengthM).toBeCloseTo(950 * FT, 6);

  // B comes back: its change is parked as a conflict, the server still holds A's value.
  await b.context.setOffline(false);
  await pressSync(b.page);
  expect(await phoneState(b.page)).toMatchObject({ outbox: 1, parked: 1, pending: 0 });
  expect((await deliveryM(visitId))[0]?.lengthM).toBeCloseTo(950 * FT, 6);
  // The bar does not claim everything is on the server while a change waits for a decision.
  await expect(b.page.getByTestId('sync-summary')).toHaveText('Nothing waiting to send');
  await expect(b.page.getByText('Field advisor', { exact: true })).toBeVisible();
  const decision = b.page.getByRole('link', { name: '1 change needs your decision' });
  await expect(decision).toBeVisible();
  await decision.click();
  await expect(b.page).toHaveURL(/\/field\/sync$/);
  const conflict = b.page.getByRole('listitem').filter({ hasText: 'Changed on the server while you were out' });
  await expect(conflict).toHaveCount(1);
  await b.page.screenshot({ path: test.info().outputPath('conflict.png'), fullPage: true });
  // Both values, in the advisor's units (Ines works in feet).
  await expect(conflict.getByRole('row', { name: /Length/ })).toContainText('1,000 ft');
  await expect(conflict.getByRole('row', { name: /Length/ })).toContainText('950 ft');

  // Keep mine, knowingly: it goes up on top of A's revision.
  await conflict.getByRole('button', { name: 'Keep mine' }).click();
  await expect(b.page.getByText('Nothing to decide.')).toBeVisible();
  await syncUntilDone(b.page);
  const final = await deliveryM(visitId);
  expect(final).toHaveLength(1);
  expect(final[0]?.lengthM).toBeCloseTo(1000 * FT, 6);
  // The decision is in the history: two updates of the pipe run, the last one B's.
  const updates = await query<{ n: number }>("SELECT COUNT(*) AS n FROM audit_log WHERE visit_id = ? AND entity = 'pipeRun' AND action = 'updated'", [visitId]);
  expect(Number(updates[0]?.n)).toBe(2);

  // Phone A hears about it on its next sync.
  await syncUntilDone(a.page).catch(() => undefined);
  await pressSync(a.page);
  await a.page.goto(`/field/visit/pipes?id=${visitId}`);
  await expect(a.page.getByLabel('Length along the route', { exact: true }).nth(1)).toHaveValue('1000');
  const parked = await query<{ n: number }>('SELECT COUNT(*) AS n FROM pipe_runs WHERE visit_id = ?', [visitId]);
  console.log(
    `[conflict-e2e] 2 phones edited one pipe length offline: 1 conflict surfaced and decided on the screen; ${Number(parked[0]?.n)} pipe runs on the visit, delivery ${final[0]?.lengthM} m`,
  );
  await a.context.close();
  await b.context.close();
});
