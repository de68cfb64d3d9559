import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { BASE, launch, SignInPage, Shell, USERS, signedInContext } from './support.mjs';

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

const HOMES = { manager: ['/map', 'Site map'], operator: ['/board', 'Morning board'], pilot: ['/departures', 'Departures'] };

for (const role of Object.keys(HOMES)) {
  test(`${role} signs in, lands on their home and signs out`, async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    const signin = new SignInPage(page);
    await signin.open();
    await signin.signIn(USERS[role]);
    await page.waitForURL(`${BASE}${HOMES[role][0]}`);
    const shell = new Shell(page);
    assert.equal(await shell.heading().textContent(), HOMES[role][1]);
    await shell.signOut();
    await page.goto(`${BASE}${HOMES[role][0]}`);
    await page.waitForURL(/\/signin/);
    await context.close();
  });
}

test('a wrong password is refused with a clear message that does not tell whether the account exists', async () => {
  const context = await browser.newContext();
  const page = await context.newPage();
  const signin = new SignInPage(page);
  await signin.open();
  await signin.signIn(USERS.operator, 'wrong-password-here');
  await page.getByText('do not match an active account').waitFor();
  await signin.signIn('nobody@nowhere.test', 'wrong-password-here');
  await page.getByText('do not match an active account').waitFor();
  assert.match(page.url(), /\/signin/);
  await context.close();
});

test('a pilot is refused the user admin page (403) and the users API (403)', async () => {
  const { context, page } = await signedInContext(browser, 'pilot');
  const res = await page.goto(`${BASE}/admin/users`);
  assert.equal(res.status(), 403);
  await page.getByRole('heading', { name: 'This page is not open to you' }).waitFor();
  const api = await context.request.get(`${BASE}/api/users`);
  assert.equal(api.status(), 403);
  await context.close();
});

test('signed-out visitors are sent to sign-in, and the API answers 401', async () => {
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto(`${BASE}/board`);
  assert.match(page.url(), /\/signin\?next=%2Fboard/);
  const api = await context.request.get(`${BASE}/api/me`);
  assert.equal(api.status(), 401);
  await context.close();
});

test('a manager sees the users table and can invite a user', async () => {
  const { context, page } = await signedInContext(browser, 'manager');
  await page.goto(`${BASE}/admin/users`);
  await page.getByRole('table').waitFor();
  await page.getByLabel('Name', { exact: true }).fill('Visiting Pilot');
  await page.getByLabel('E-mail').fill('visiting.pilot@frostvale.test');
  await page.getByRole('button', { name: 'Invite user' }).click();
  await page.getByText('Added Visiting Pilot').waitFor();
  await page.getByRole('row', { name: /Visiting Pilot/ }).waitFor();
  await context.close();
});
