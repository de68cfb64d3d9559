import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { BASE, launch, signedInContext } from './support.mjs';

// Morning outcomes and the Season report, against the demo's season of recorded mornings and the last
// morning's departures left to record (lib/seed/outcomes.ts).

/** The "Oil at start" cards on the Departures page, found by their labels and roles. */
class OilAtStart {
  constructor(page) {
    this.page = page;
  }
  async open() {
    await this.page.goto(`${BASE}/departures`);
    await this.section().waitFor();
  }
  section() {
    return this.page.getByRole('region', { name: 'Oil at start' });
  }
  card(registration) {
    return this.section().getByRole('article').filter({ hasText: registration });
  }
  input(registration) {
    return this.section().getByLabel(new RegExp(`^Oil at start .*${registration}`));
  }
}

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

test('a pilot records the oil temperature at start in two taps on a phone, changes it, and undoes it', async () => {
  const { context, page } = await signedInContext(browser, 'pilot', { width: 390, height: 844 });
  const oil = new OilAtStart(page);
  await oil.open();
  const input = oil.input('Q-TAIMI');
  await input.waitFor();
  // Prefilled with the plan's prediction: tap one is "Record".
  const prefilled = await input.inputValue();
  assert.match(prefilled, /^-?\d+$/);
  const record = oil.card('Q-TAIMI').getByRole('button', { name: /^Record/ });
  const box = await record.boundingBox();
  assert.ok(box && box.height >= 44, `Record is a 44 px touch target (${box?.height})`);
  await record.click();
  await oil.section().getByRole('status').filter({ hasText: `Recorded ${prefilled}` }).waitFor();
  const change = oil.card('Q-TAIMI').getByRole('button', { name: /^Change/ });
  await change.waitFor();

  // It stays recorded after a reload; "Change" allows a corrected value.
  await page.reload();
  await oil.section().waitFor();
  await oil.card('Q-TAIMI').getByText(/at start/).first().waitFor();
  await oil.card('Q-TAIMI').getByRole('button', { name: /^Change/ }).click();
  await oil.input('Q-TAIMI').fill('400');
  await oil.card('Q-TAIMI').getByRole('button', { name: /^Record/ }).click();
  await oil.card('Q-TAIMI').getByText(/Enter an oil temperature from/).first().waitFor();
  assert.equal(await oil.input('Q-TAIMI').getAttribute('aria-invalid'), 'true');
  await oil.input('Q-TAIMI').fill('12');
  await oil.card('Q-TAIMI').getByRole('button', { name: /^Record/ }).click();
  await oil.section().getByRole('status').filter({ hasText: 'Recorded 12' }).waitFor();
  await oil.card('Q-TAIMI').getByText('below ready').waitFor();

  // Undo leaves the morning to record again.
  await oil.card('Q-TAIMI').getByRole('button', { name: /^Remove/ }).click();
  await oil.input('Q-TAIMI').waitFor();
  await context.close();
});

test('a pilot marks a morning as not flown', async () => {
  const { context, page } = await signedInContext(browser, 'pilot', { width: 390, height: 844 });
  const oil = new OilAtStart(page);
  await oil.open();
  await oil.card('Q-TAIMI').getByRole('button', { name: /^Not flown/ }).click();
  await oil.section().getByRole('status').filter({ hasText: 'Recorded Q-TAIMI as not flown' }).waitFor();
  await oil.card('Q-TAIMI').getByRole('button', { name: /^Remove/ }).click();
  await oil.input('Q-TAIMI').waitFor();
  await context.close();
});

for (const viewport of [{ width: 390, height: 844 }, { width: 1440, height: 900 }]) {
  test(`the Season report renders the demo season for a manager (${viewport.width} px)`, async () => {
    const { context, page } = await signedInContext(browser, 'manager', viewport);
    const res = await page.goto(`${BASE}/season`);
    assert.equal(res.status(), 200);
    await page.getByRole('heading', { level: 1, name: 'Season report' }).waitFor();
    await page.getByRole('img', { name: /Predicted against recorded oil at start, the organization/ }).waitFor();
    await page.getByRole('img', { name: /Stated chance of being ready/ }).waitFor();
    const rel = page.getByRole('table', { name: /How often the stated chance/ });
    assert.ok((await rel.getByRole('row').count()) >= 5);
    await page.getByRole('navigation', { name: 'Aircraft' }).getByRole('link', { name: 'Q-KAPA' }).click();
    await page.getByRole('heading', { name: /What Q-KAPA’s mornings say/ }).waitFor();
    await page.getByRole('img', { name: /Predicted against recorded oil at start, Q-KAPA/ }).waitFor();
    await context.close();
  });
}

test('the Season report is for managers and operators: a pilot is refused (403)', async () => {
  const { context, page } = await signedInContext(browser, 'pilot', { width: 390, height: 844 });
  const res = await page.goto(`${BASE}/season`);
  assert.equal(res.status(), 403);
  await context.close();
});
