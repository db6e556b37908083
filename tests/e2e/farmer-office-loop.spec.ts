// The loop between farmer, advisor and office, walked in the browser: the sheet is sent, the farmer
// reads it (not a yes), asks, the advisor and the coordinator are told by e-mail and see the open
// question, the advisor answers on the sheet, the answer reaches the farmer, the farmer decides.
// Also: the office offers only allowed state moves (and the API refuses others), and settings save
// with blank per-head boxes.
import { randomUUID } from 'node:crypto';
import { expect, test, type APIRequestContext, type Browser, type Page } from '@playwright/test';
import { signInAs } from './support/sign-in';

const shots = '/tmp/loop-shots';
const DESKTOP = { width: 1280, height: 900 };

async function person(browser: Browser, email: string, home: RegExp): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  await signInAs(page, email, home);
  return page;
}

/** The text of the newest caught message to `to` whose subject starts with `subject` (soft line breaks joined). */
async function mailFor(request: APIRequestContext, to: string, subject: string): Promise<string> {
  let found = '';
  await expect
    .poll(
      async () => {
        const inbox = await request.get(`http://127.0.0.1:${process.env.MAIL_INBOX_PORT}/messages`);
        const messages = (await inbox.json()).messages as { to: string; subject: string; raw: string }[];
        found =
          messages
            .filter((m) => m.to.includes(to) && m.subject.startsWith(subject))
            .at(-1)
            ?.raw.replace(/=\r?\n/g, '') ?? '';
        return found;
      },
      { timeout: 10_000 },
    )
    .not.toBe('');
  return found;
}

test('farmer asks, advisor and coordinator are told, the answer reaches the farmer; reading is not deciding', async ({ browser, request }) => {
  test.setTimeout(90_000);
  const tag = randomUUID().slice(0, 6);
  const question = `Could the tank sit by the yard gate instead? (${tag})`;
  const answer = `Yes: by the gate the lift is 4 m less, so more water reaches it. (${tag})`;

  // The office sends the screened sheet; before that the farmer has no sheet to read.
  const gwen = await person(browser, 'gwen@wenlow-water.test', /\/farm$/);
  await expect(gwen.getByRole('link', { name: "Read the sheet for Pryce's Upper Field" })).toHaveCount(0);
  const maren = await person(browser, 'maren@wenlow-water.test', /\/office$/);
  const list = await (await maren.request.get('/api/visits?pageSize=100')).json();
  const visitId = list.items.find((v: { farm: { name: string } }) => v.farm.name === "Pryce's Upper Field").id as string;
  const before = await gwen.goto(`/sheets/${visitId}`);
  expect(before?.status()).toBe(404);
  await maren.goto(`/sheets/${visitId}`);
  await maren.getByRole('button', { name: /Send to Gwen Pryce/ }).click();
  await expect(maren.getByRole('list', { name: 'Sends of this sheet' })).toContainText('Sent to gwen@wenlow-water.test');

  // The farmer reads it: that is a record of its own, and not a yes.
  await gwen.goto('/farm');
  await gwen.getByRole('link', { name: "Read the sheet for Pryce's Upper Field" }).click();
  await gwen.getByRole('button', { name: 'I have read this sheet' }).click();
  await expect(gwen.getByText('You have told us you read this sheet. That is not a yes')).toBeVisible();
  const afterRead = await (await maren.request.get(`/api/visits/${visitId}`)).json();
  expect(afterRead.visit.status).toBe('acknowledged');

  // She asks; the assigned advisor and the coordinator are e-mailed.
  await gwen.getByLabel('Ask your advisor a question').fill(question);
  await gwen.getByRole('button', { name: 'Send question' }).click();
  const thread = gwen.getByRole('region', { name: 'Questions and answers' });
  await expect(thread).toContainText(question);
  await expect(thread).toContainText('waiting for an answer');
  for (const to of ['tobias@wenlow-water.test', 'maren@wenlow-water.test']) {
    const mail = await mailFor(request, to, "Question from Gwen Pryce about Pryce's Upper Field");
    expect(mail).toContain(question);
    expect(mail).toContain(`/sheets/${visitId}#conversation`);
  }
  await maren.goto('/office');
  await expect(maren.getByRole('list', { name: 'Questions waiting for an answer' })).toContainText(question);
  await maren.setViewportSize(DESKTOP);
  await maren.screenshot({ path: `${shots}/office-open-questions-desktop.png`, fullPage: true });

  // The advisor sees it on the field home and answers on the sheet.
  const tobias = await person(browser, 'tobias@wenlow-water.test', /\/field$/);
  const open = tobias.getByRole('list', { name: 'Questions waiting for an answer' });
  await expect(open).toContainText(question, { timeout: 15_000 });
  await tobias.screenshot({ path: `${shots}/field-home-open-questions-phone.png`, fullPage: true });
  await open.getByRole('link', { name: "Answer on the sheet for Pryce's Upper Field" }).click();
  const form = tobias.getByRole('form', { name: 'Answer this question' });
  await form.getByRole('button', { name: 'Send answer to the farmer' }).click();
  await expect(form.getByRole('alert')).toHaveText('Write your answer (at least a few words).');
  await form.getByLabel('Your answer').fill(answer);
  await form.getByRole('button', { name: 'Send answer to the farmer' }).click();
  await expect(tobias.getByRole('region', { name: 'Questions and answers' })).toContainText(answer);
  await tobias.screenshot({ path: `${shots}/sheet-answered-advisor-phone.png`, fullPage: true });

  // The farmer is e-mailed the answer and reads it in the thread, with who said it.
  const mail = await mailFor(request, 'gwen@wenlow-water.test', "Answer to your question about Pryce's Upper Field");
  expect(mail).toContain(answer);
  expect(mail).toContain(question);
  await gwen.reload();
  await expect(thread).toContainText(answer);
  await expect(thread).toContainText('Tobias Kerr (advisor)');

  // Her decision is separate: "not now" needs a reason.
  const decision = gwen.getByRole('form', { name: 'Your decision' });
  await decision.getByLabel('Not now').check();
  await decision.getByRole('button', { name: 'Send my decision' }).click();
  await expect(decision.getByText('Say in a few words why not now, so your advisor knows.')).toBeVisible();
  await decision.getByLabel('Why not now?').fill('We wait for the grant decision in spring.');
  await decision.getByRole('button', { name: 'Send my decision' }).click();
  await expect(gwen.getByText('You said: not now.')).toBeVisible();
  await expect(thread).toContainText('Not now: We wait for the grant decision in spring.');
  await gwen.screenshot({ path: `${shots}/sheet-farmer-decided-phone.png`, fullPage: true });
  const afterDecision = await (await maren.request.get(`/api/visits/${visitId}`)).json();
  expect(afterDecision.visit.status).toBe('declined');

  await maren.goto('/office');
  await expect(maren.getByText(question)).toHaveCount(0);
  await maren.goto(`/office/visits/${visitId}`);
  await expect(maren.getByText('Farmer said not now').first()).toBeVisible();
  // The history says in words what changed, with no stored codes.
  const history = maren.getByRole('list', { name: 'Change history' });
  await expect(history).toContainText('Farmer said: not now');
  await expect(history).toContainText('Sheet e-mailed');
  await expect(history).toContainText('Farmer has read the sheet');
  await expect(history).not.toContainText(/sheet_sent|sheet_question|\bcreated\b|acknowledged/);
  await maren.screenshot({ path: `${shots}/office-visit-declined-desktop.png`, fullPage: true });
});

test('the office is offered only allowed state moves; a jump needs a reason; the API refuses a forbidden move', async ({ browser }) => {
  const maren = await person(browser, 'maren@wenlow-water.test', /\/office$/);
  const list = await (await maren.request.get('/api/visits?pageSize=100')).json();
  const visitId = list.items.find((v: { farm: { name: string } }) => v.farm.name === 'Otieno Orchard Croft').id as string;
  await maren.goto(`/office/visits/${visitId}`);
  const next = maren.getByRole('form', { name: 'Change the state' }).getByLabel('Next state');
  await expect(next.locator('option')).toHaveText(['Needs requested', 'Site walked', 'Cancelled']);
  await maren.getByText('Move outside the usual order…').click();
  const jump = maren.getByRole('form', { name: 'Move outside the usual order' });
  await jump.getByLabel('Move to').selectOption({ label: 'Running, checked' });
  await jump.getByRole('button', { name: 'Move with this reason' }).click();
  await expect(maren.getByRole('alert').filter({ hasText: 'Say in a few words' })).toHaveText(
    'Say in a few words why the visit moves outside the usual order.',
  );
  await maren.screenshot({ path: `${shots}/office-state-moves-phone.png`, fullPage: true });

  const refused = await maren.evaluate(async (id) => {
    const res = await fetch(`/api/visits/${id}`, {
      method: 'PATCH',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ status: 'commissioned' }),
    });
    return { status: res.status, message: (await res.json()).error.message as string };
  }, visitId);
  expect(refused.status).toBe(409);
  expect(refused.message).toContain('A visit cannot go from “Visit booked” to “Running, checked” in one step.');
  const still = await (await maren.request.get(`/api/visits/${visitId}`)).json();
  expect(still.visit.status).toBe('scheduled');
});

test('settings save with the per-head boxes left blank', async ({ browser }) => {
  const maren = await person(browser, 'maren@wenlow-water.test', /\/office$/);
  await maren.goto('/office/settings');
  const form = maren.getByRole('form', { name: 'Organisation settings' });
  await form.getByLabel('Design share of the lowest flow').fill('0.6');
  await form.getByRole('button', { name: 'Save settings' }).click();
  await expect(form.getByRole('status')).toHaveText('Settings saved. New screenings use them.');
  await expect(form.getByText('A per-head figure must be a number.')).toHaveCount(0);
  await form.getByLabel('Design share of the lowest flow').fill('0.5');
  await form.getByRole('button', { name: 'Save settings' }).click();
  await expect(form.getByRole('status')).toHaveText('Settings saved. New screenings use them.');
});

test('board counts open the filtered table; farms are searched; a farm page shows its visits, needs and "Plan a visit"', async ({ browser }) => {
  const maren = await person(browser, 'maren@wenlow-water.test', /\/office$/);
  await maren.getByRole('link', { name: /visits: Visit booked$/ }).click();
  await expect(maren).toHaveURL(/status=scheduled/);
  const table = maren.getByRole('table', { name: 'Visits in the district' });
  await expect(table).toContainText('Otieno Orchard Croft');
  await expect(table).not.toContainText('Brandt Hollow');

  await maren.goto('/office/farms');
  const search = maren.getByRole('search', { name: 'Find farms' });
  await search.getByLabel('Farm, area or farmer').fill('Otieno');
  await search.getByRole('button', { name: 'Show' }).click();
  const farms = maren.getByRole('table', { name: 'Farms' });
  await expect(farms).toContainText('Lark Spinney');
  await expect(farms).not.toContainText('Brandt Hollow');
  await maren.screenshot({ path: `${shots}/office-farms-search-phone.png`, fullPage: true });
  await farms.getByRole('link', { name: 'Otieno Orchard Croft' }).click();
  await expect(maren.getByRole('heading', { level: 1, name: 'Otieno Orchard Croft' })).toBeVisible();
  await expect(maren.getByRole('list', { name: 'Visits to this farm' })).toContainText('Visit booked');
  await expect(maren.getByRole('list', { name: 'Water needs' })).toContainText('Laying hen');
  // Not the menu's "Plan a visit": the farm page's own, which names the farm.
  await expect(maren.getByRole('main').getByRole('link', { name: 'Plan a visit' })).toHaveAttribute('href', /\/office\/visits\/new\?farm=[0-9a-f-]{36}$/);
  await maren.setViewportSize(DESKTOP);
  await maren.screenshot({ path: `${shots}/office-farm-page-desktop.png`, fullPage: true });
});

test('planning: a past date needs its tick, a farm with a visit under way is warned, and an allowed move is made from the page', async ({ browser }) => {
  const maren = await person(browser, 'maren@wenlow-water.test', /\/office$/);
  await maren.goto('/office/farms?q=Lark');
  await maren.getByRole('table', { name: 'Farms' }).getByRole('link', { name: 'Plan a visit' }).click();
  const form = maren.getByRole('form', { name: 'Plan a visit' });
  const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
  await form.getByLabel('Planned date (optional)').fill('1900-01-01');
  await form.getByRole('button', { name: 'Plan the visit' }).click();
  await expect(form.getByText('Pick a date from Sat, 1 Jan 2000 on.')).toBeVisible();
  await form.getByLabel('Planned date (optional)').fill(yesterday);
  await form.getByRole('button', { name: 'Plan the visit' }).click();
  await expect(form.getByText('That day has passed. Tick “Yes, the date is in the past” to keep it.')).toBeVisible();
  await form.getByLabel('Yes, the date is in the past').check();
  await form.getByRole('button', { name: 'Plan the visit' }).click();
  const warning = form.getByRole('alert').filter({ hasText: 'already has a visit under way' });
  await expect(warning).toContainText('Lark Spinney already has a visit under way (Visit booked');
  await maren.screenshot({ path: `${shots}/office-plan-duplicate-phone.png`, fullPage: true });
  await warning.getByRole('button', { name: 'Plan another visit anyway' }).click();
  await expect(maren).toHaveURL(/\/office\/visits\/[0-9a-f-]{36}$/);
  await expect(maren.getByRole('heading', { level: 1, name: 'Lark Spinney' })).toBeVisible();

  // The new visit is only requested: cancelling it is a move the table offers the office.
  const change = maren.getByRole('form', { name: 'Change the state' });
  await change.getByLabel('Next state').selectOption({ label: 'Cancelled' });
  await change.getByRole('button', { name: 'Change state' }).click();
  await expect(maren.getByRole('status').filter({ hasText: 'Now: Cancelled.' })).toBeVisible();
  await expect(maren.getByRole('list', { name: 'Change history' })).toContainText('State: Needs requested → Cancelled');
});
