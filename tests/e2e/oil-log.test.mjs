// The Oil log in the browser: a pilot records a cold oil check in their units and sees it corrected to
// 15 °C; the hand-turning cautions are on the page; another organization's aircraft is not found.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { BASE, launch, signedInContext } from './support.mjs';

/** The Oil log page, found by its labels and roles. */
class OilLogPage {
  constructor(page) {
    this.page = page;
  }
  async open() {
    await this.page.goto(`${BASE}/oil-log`);
    await this.page.getByRole('heading', { level: 1, name: 'Oil log' }).waitFor();
  }
  async chooseAircraft(registration) {
    const select = this.page.getByLabel('Aircraft');
    const value = await select.locator('option', { hasText: registration }).getAttribute('value');
    await select.selectOption(value);
    await this.page.getByRole('table', { name: new RegExp(`Oil checks of ${registration}`) }).waitFor();
  }
  async recordCheck({ level, oilTemp, outsideTemp, blades, hours, notes }) {
    const p = this.page;
    await p.getByRole('textbox', { name: /Dipstick level/ }).fill(level);
    await p.getByRole('textbox', { name: /Oil temperature/ }).fill(oilTemp);
    await p.getByRole('textbox', { name: /Outside temperature/ }).fill(outsideTemp);
    if (blades) await p.getByRole('textbox', { name: 'Blade turns until the oil returned' }).fill(blades);
    if (hours) await p.getByRole('textbox', { name: 'Engine hours', exact: true }).first().fill(hours);
    if (notes) await p.getByRole('textbox', { name: 'Notes', exact: true }).first().fill(notes);
    await p.getByRole('button', { name: 'Record oil check' }).click();
  }
}

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

test('a pilot records a cold oil check on a phone and sees it corrected to 15 °C', async () => {
  const { context, page } = await signedInContext(browser, 'pilot', { width: 390, height: 844 });
  const oil = new OilLogPage(page);
  await oil.open();
  await page.getByRole('note').filter({ hasText: 'Before turning the propeller by hand' }).getByText('Magnetos / ignition off').waitFor();
  await oil.chooseAircraft('Q-KAPA');
  await page.getByRole('textbox', { name: /Dipstick level/ }).fill('3.00');
  await page.getByRole('textbox', { name: /Oil temperature/ }).fill('90');
  await page.getByText(/At 15 °C this reads 2\.85 L \(−5\.1 %\)/).waitFor();
  await oil.recordCheck({ level: '2.80', oilTemp: '-12', outsideTemp: '-14', blades: '9', hours: '470.5', notes: 'E2E cold check' });
  await page.getByRole('status').filter({ hasText: 'Oil check recorded.' }).waitFor();
  // Newest first: the check just recorded heads the table, its level corrected from 2.80 L at −12 °C.
  await page.getByRole('table', { name: /Oil checks of Q-KAPA/ }).getByRole('row').nth(1).filter({ hasText: '2.85 L' }).waitFor();
  const id = await page.getByLabel('Aircraft').inputValue();
  const log = await (await context.request.get(`${BASE}/api/aircraft/${id}/oil`)).json();
  const mine = log.checks.find((c) => c.notes === 'E2E cold check');
  assert.ok(mine, 'the check is stored');
  assert.equal(mine.levelL, 2.8);
  assert.ok(mine.correctedL > 2.8, 'a reading taken colder than 15 °C corrects upwards');
  await context.close();
});

test('the Oil log shows oil used per hour, the next change and the charts at desktop size', async () => {
  const { context, page } = await signedInContext(browser, 'operator');
  const oil = new OilLogPage(page);
  await oil.open();
  await oil.chooseAircraft('Q-TAIMI');
  await page.getByText(/Above the usual/).waitFor();
  await page.getByRole('img', { name: 'Dipstick level corrected to 15 °C over engine hours' }).waitFor();
  await page.getByRole('heading', { name: 'Next oil change' }).waitFor();
  await oil.chooseAircraft('Q-KAPA');
  await page.getByRole('img', { name: 'Blade turns until the oil returned, against outside temperature' }).waitFor();
  await context.close();
});

test("another organization's aircraft Oil log is not found (404)", async () => {
  const { context } = await signedInContext(browser, 'pilot');
  const other = await context.request.get(`${BASE}/api/aircraft/9/oil`);
  assert.equal(other.status(), 404);
  await context.close();
});
