import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { BASE, launch, signedInContext } from './support.mjs';

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

const dayKey = (ms, zone) => new Intl.DateTimeFormat('en-CA', { timeZone: zone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(ms);
const weekday = (ms, zone) => new Intl.DateTimeFormat('en-GB', { timeZone: zone, weekday: 'short' }).format(ms);

test('every switch-on time on the board that is not today carries its day, and no heater reads as on before its time', async () => {
  const { context, page } = await signedInContext(browser, 'operator');
  await page.goto(`${BASE}/board`);
  await page.getByRole('heading', { name: 'Morning board' }).waitFor();
  const board = await page.evaluate(async () => (await fetch('/api/board')).json());
  const now = Date.parse(board.generatedAt);
  let checked = 0;
  for (const p of board.plans.filter((x) => x.switchOnAt)) {
    const zone = p.airfield.timeZone;
    const on = Date.parse(p.switchOnAt);
    const row = page.locator('tbody tr').filter({ hasText: p.aircraft.registration }).first();
    const cell = (await row.locator('td').first().innerText()).trim();
    if (on > now && dayKey(on, zone) !== dayKey(now, zone)) assert.match(cell, new RegExp(`^${weekday(on, zone)} \\d\\d:\\d\\d`), `${p.aircraft.registration}: ${cell}`);
    if (on > now) assert.doesNotMatch(await row.innerText(), /Heating|Switch on now/, `${p.aircraft.registration} is not on yet`);
    checked++;
  }
  assert.ok(checked >= 3, `checked ${checked} plans`);
  await context.close();
});

test("a manager's Alerts page shows the organization's current too-cold warnings", async () => {
  const { context, page } = await signedInContext(browser, 'manager');
  await page.goto(`${BASE}/alerts`);
  const banner = page.getByRole('alert').filter({ hasText: 'Current warnings for the organization' });
  await banner.waitFor();
  assert.ok(await banner.getByText(/Q-SIPI/).first().isVisible());
  await context.close();
});

test('booking a pilot who is not listed on the aircraft shows a warning before booking', async () => {
  const { context, page } = await signedInContext(browser, 'operator');
  await page.goto(`${BASE}/departures`);
  await page.getByRole('heading', { name: 'Book a departure' }).waitFor();
  const select = page.getByLabel('Aircraft', { exact: true });
  await select.selectOption(await select.locator('option', { hasText: 'Q-KAPA' }).first().getAttribute('value'));
  const pilot = page.getByLabel('Pilot', { exact: true });
  await pilot.selectOption({ label: 'Joel Varga' });
  await page.getByText('Joel Varga is not listed as a pilot of Q-KAPA').waitFor();
  // A listed pilot: no warning.
  await pilot.selectOption({ label: 'Aino Pell' });
  assert.equal(await page.getByText(/is not listed as a pilot of/).count(), 0);
  await context.close();
});

test("a departure's heat plan opens at the page's width from the Departures list", async () => {
  const { context, page } = await signedInContext(browser, 'operator', { width: 1440, height: 900 });
  await page.goto(`${BASE}/departures`);
  await page.getByRole('link', { name: /^Soak forecast and heat plan/ }).first().click();
  await page.getByRole('heading', { name: /soak forecast and heat plan/ }).waitFor();
  await page.locator('svg').first().waitFor();
  const box = await page.locator('main svg').first().boundingBox();
  assert.ok(box && box.width > 700, `chart ${box?.width} px wide`);
  await context.close();
});

test('the frost flag shows on the board and in the pilot view exactly for the departures the plans flag', async () => {
  const op = await signedInContext(browser, 'operator');
  await op.page.goto(`${BASE}/board`);
  await op.page.getByRole('heading', { name: 'Morning board' }).waitFor();
  const board = await op.page.evaluate(async () => (await fetch('/api/board')).json());
  for (const p of board.plans) {
    const row = op.page.locator('tbody tr').filter({ hasText: p.aircraft.registration }).first();
    assert.equal(await row.getByText('Frost likely').count() > 0, !!p.frost?.likely, `${p.aircraft.registration}`);
    // Never under a roof.
    if (p.shelter && p.shelter.kind !== 'tie-down') assert.ok(!p.frost, `${p.aircraft.registration} is under a roof`);
  }
  const flagged = board.plans.filter((p) => p.frost?.likely);
  await op.context.close();
  const pilot = await signedInContext(browser, 'pilot', { width: 390, height: 844 });
  await pilot.page.goto(`${BASE}/departures`);
  const mine = await pilot.page.evaluate(async () => (await fetch('/api/me/departures')).json());
  for (const p of mine.plans.filter((x) => x.frost?.likely)) {
    await pilot.page.getByText(/Frost likely — check and remove before flight/).first().waitFor();
    void p;
  }
  console.log(`# frost flagged on ${flagged.length} of ${board.plans.length} board plans`);
  await pilot.context.close();
});
