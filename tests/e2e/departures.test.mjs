import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { BASE, launch, signedInContext } from './support.mjs';

const ZONE = 'Europe/Helsinki';

/** The local date `days` ahead at the demo airfields, read with Intl (beyond the seeded week, so aircraft are free). */
function localDay(days) {
  return new Intl.DateTimeFormat('en-CA', { timeZone: ZONE, year: 'numeric', month: '2-digit', day: '2-digit' }).format(Date.now() + days * 86_400_000);
}

/** The departures page, found by its labels and roles. */
class DeparturesPage {
  constructor(page) {
    this.page = page;
  }
  async open() {
    await this.page.goto(`${BASE}/departures`);
    await this.page.getByRole('heading', { name: 'Book a departure' }).waitFor();
  }
  async book({ registration, date, time, readyC }) {
    const select = this.page.getByLabel('Aircraft', { exact: true });
    const value = await select.locator('option', { hasText: registration }).first().getAttribute('value');
    await select.selectOption(value);
    await this.page.getByLabel('Date', { exact: true }).fill(date);
    await this.page.getByLabel('Time', { exact: true }).fill(time);
    await this.page.getByLabel(/^Ready temperature/).fill(readyC ?? '');
    await this.page.getByRole('button', { name: 'Book departure' }).click();
  }
  status() {
    return this.page.getByRole('status').filter({ hasText: /Booked|Not booked/ });
  }
  list() {
    return this.page.getByRole('region', { name: /upcoming departures/i });
  }
}

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

for (const viewport of [{ width: 390, height: 844 }, { width: 1440, height: 900 }]) {
  test(`a pilot books a departure for an aircraft they may fly and sees it listed (${viewport.width} px)`, async () => {
    const { context, page } = await signedInContext(browser, 'pilot', viewport);
    const dep = new DeparturesPage(page);
    await dep.open();
    const date = localDay(viewport.width < 800 ? 9 : 10);
    await dep.book({ registration: 'Q-KAPA', date, time: '07:45' });
    await dep.status().getByText('Booked Q-KAPA').waitFor();
    // Listed among the upcoming departures, at the airfield's local time.
    const row = dep.list().locator(viewport.width < 800 ? 'li' : 'tr').filter({ hasText: 'Q-KAPA' }).filter({ hasText: '07:45' });
    await row.first().waitFor();
    assert.ok(await row.first().isVisible());
    await context.close();
  });
}

test('a ready temperature below the class default is refused beside the field, and the input is kept', async () => {
  const { context, page } = await signedInContext(browser, 'pilot');
  const dep = new DeparturesPage(page);
  await dep.open();
  await dep.book({ registration: 'Q-TAIMI', date: localDay(11), time: '08:10', readyC: '5' });
  await dep.status().getByText('Not booked').waitFor();
  const field = page.getByLabel(/^Ready temperature/);
  assert.equal(await field.getAttribute('aria-invalid'), 'true');
  const describedBy = await field.getAttribute('aria-describedby');
  assert.match(describedBy ?? '', /dep-readyC-error/);
  assert.match(await page.locator('#dep-readyC-error').textContent(), /cannot be below/);
  assert.equal(await field.inputValue(), '5');
  await context.close();
});

test('the API refuses a pilot an aircraft they may not fly (403) and names the field of bad input (422)', async () => {
  const { context } = await signedInContext(browser, 'pilot');
  const fleet = await (await context.request.get(`${BASE}/api/aircraft`)).json();
  const viima = fleet.aircraft.find((a) => a.registration === 'Q-VIIMA');
  assert.ok(viima, 'the demo has Q-VIIMA');
  const refused = await context.request.post(`${BASE}/api/departures`, { data: { aircraftId: viima.id, departAt: `${localDay(12)}T08:00` } });
  assert.equal(refused.status(), 403);
  assert.match((await refused.json()).message, /Q-VIIMA/);
  const bad = await context.request.post(`${BASE}/api/departures`, { data: { departAt: 'soon', readyC: 'warm' } });
  assert.equal(bad.status(), 422);
  const fields = (await bad.json()).fields.map((f) => f.field);
  for (const f of ['aircraftId', 'departAt', 'readyC']) assert.ok(fields.includes(f), `names ${f}`);
  await context.close();
});

test('a pilot sees aircraft read-only; an operator gets the profile form', async () => {
  const pilot = await signedInContext(browser, 'pilot');
  await pilot.page.goto(`${BASE}/aircraft`);
  await pilot.page.getByRole('link', { name: 'Q-SIPI' }).first().click();
  await pilot.page.getByRole('heading', { level: 1, name: 'Q-SIPI' }).waitFor();
  // The aircraft page opens on its upcoming departures; the profile is its own tab.
  await pilot.page.getByRole('heading', { name: 'Upcoming departures' }).waitFor();
  await pilot.page.getByRole('link', { name: 'Profile' }).click();
  await pilot.page.getByRole('heading', { name: 'Heaters' }).waitFor();
  assert.equal(await pilot.page.getByRole('button', { name: 'Save changes' }).count(), 0);
  const denied = await pilot.page.goto(`${BASE}/aircraft/new`);
  assert.equal(denied.status(), 403);
  await pilot.context.close();

  const op = await signedInContext(browser, 'operator');
  await op.page.goto(`${BASE}/aircraft`);
  await op.page.getByRole('link', { name: 'Q-SIPI' }).first().click();
  // Its departures first, each with its plan.
  await op.page.getByRole('heading', { name: 'Upcoming departures' }).waitFor();
  await op.page.getByRole('link', { name: 'Profile' }).click();
  await op.page.getByLabel('Registration').waitFor();
  assert.equal(await op.page.getByLabel('Registration').inputValue(), 'Q-SIPI');
  await op.page.getByRole('button', { name: 'Save changes' }).click();
  await op.page.getByRole('status').filter({ hasText: 'Saved Q-SIPI' }).waitFor();
  await op.context.close();
});

for (const width of [1280, 1440, 1920]) {
  test(`the operator's Departures page has no sideways scroll at ${width} px and keeps Readiness and Cancel in view`, async () => {
    const { context, page } = await signedInContext(browser, 'operator', { width, height: 900 });
    const dep = new DeparturesPage(page);
    await dep.open();
    await dep.list().getByRole('table').waitFor();
    const over = await page.evaluate(() =>
      [document.documentElement, ...document.querySelectorAll('table')].map((el) => {
        const box = el === document.documentElement ? el : el.parentElement;
        return box.scrollWidth - box.clientWidth;
      }),
    );
    assert.ok(over.every((d) => d <= 0), `overflow by ${over.join(', ')} px`);
    const cancel = dep.list().getByRole('button', { name: /^Cancel / }).first();
    const box = await cancel.boundingBox();
    assert.ok(box && box.x + box.width <= width, 'the Cancel button is inside the window');
    await context.close();
  });
}

test('a pilot changes the time of a departure they booked, and the list shows the new time', async () => {
  const { context, page } = await signedInContext(browser, 'pilot');
  const dep = new DeparturesPage(page);
  await dep.open();
  const date = localDay(12);
  await dep.book({ registration: 'Q-LUMI', date, time: '07:15' });
  await dep.status().getByText('Booked Q-LUMI').waitFor();
  const row = dep.list().locator('tr').filter({ hasText: 'Q-LUMI' }).filter({ hasText: '07:15' }).first();
  await row.getByRole('link', { name: /^Change/ }).click();
  await page.getByRole('heading', { name: 'Change Q-LUMI' }).waitFor();
  await page.getByLabel('Time', { exact: true }).fill('09:40');
  await page.getByRole('button', { name: 'Save changes' }).click();
  await page.getByRole('status').getByText(/Saved: Q-LUMI departs .* 09:40/).waitFor();
  await page.getByRole('link', { name: 'Back to departures' }).click();
  await dep.list().locator('tr').filter({ hasText: 'Q-LUMI' }).filter({ hasText: '09:40' }).first().waitFor();
  assert.equal(await dep.list().locator('tr').filter({ hasText: 'Q-LUMI' }).filter({ hasText: '07:15' }).count(), 0);
  await context.close();
});
