// Fit from log in the browser: an operator uploads the demo cool-down, sees the fit and applies it, then
// goes back to the profile before; a bad file shows its problems by row; a pilot is refused the page.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { BASE, launch, signedInContext } from './support.mjs';

const DEMO_LOG = path.resolve('data/demo/cooldown-q-kapa.csv');

/** The Fit from log page, found by its labels and roles. */
class CalibrationPage {
  constructor(page) {
    this.page = page;
  }
  async open() {
    await this.page.goto(`${BASE}/calibration`);
    await this.page.getByRole('heading', { level: 1, name: 'Fit from log' }).waitFor();
  }
  async chooseAircraft(registration) {
    const select = this.page.getByLabel('Aircraft');
    const value = await select.locator('option', { hasText: registration }).getAttribute('value');
    await select.selectOption(value);
    await this.page.getByRole('heading', { name: `Profile of ${registration}` }).waitFor();
  }
  async upload(file) {
    await this.page.getByLabel('Logger file (CSV)').setInputFiles(file);
  }
  status() {
    return this.page.getByRole('status');
  }
}

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

for (const viewport of [{ width: 1440, height: 900 }, { width: 390, height: 844 }]) {
  test(`an operator uploads the demo cool-down, sees the fit and applies it, then restores the profile (${viewport.width} px)`, async () => {
    const { context, page } = await signedInContext(browser, 'operator', viewport);
    const cal = new CalibrationPage(page);
    await cal.open();
    await cal.chooseAircraft('Q-KAPA');
    await cal.upload(DEMO_LOG);
    await page.getByText('861 rows, no problems').waitFor();
    await page.getByRole('heading', { name: 'Preview: cooldown-q-kapa.csv' }).waitFor();
    await page.getByRole('img', { name: /with the suggested cool-down/ }).waitFor();
    await page.getByRole('button', { name: 'Store and fit' }).click();
    await page.getByRole('heading', { name: 'Fit: cooldown-q-kapa.csv' }).waitFor({ timeout: 30_000 });
    await page.getByRole('img', { name: 'The fit over the logged cool-down, with residuals' }).waitFor();
    await page.getByText('Recommended: two nodes').waitFor();
    const tau = await page.getByRole('row', { name: /Time constant τ/ }).textContent();
    assert.match(tau, /\d\.\d+ ± \d\.\d+ h/);

    await page.getByRole('button', { name: 'Apply two-node fit' }).click();
    await cal.status().filter({ hasText: 'Applied the two-node fit' }).waitFor();
    const current = page.getByRole('listitem').filter({ hasText: 'Fitted from a log' }).filter({ hasText: 'Current' });
    await current.waitFor();

    await page.getByRole('listitem').filter({ hasText: 'Before the first change' }).getByRole('button', { name: /^Restore/ }).click();
    await cal.status().filter({ hasText: 'Restored the profile' }).waitFor();
    await page.getByRole('listitem').filter({ hasText: 'Restored' }).filter({ hasText: 'Current' }).waitFor();

    const id = await page.getByLabel('Aircraft').inputValue();
    const prof = await (await context.request.get(`${BASE}/api/aircraft/${id}/profile`)).json();
    const initial = prof.revisions.find((r) => r.kind === 'initial');
    assert.deepEqual(prof.thermal, initial.thermal);
    assert.equal(prof.revisions[0].kind, 'revert');
    await context.close();
  });
}

test('a file with text in the temperature column lists its problem by row and cannot be stored', async () => {
  const { context, page } = await signedInContext(browser, 'operator');
  const bad = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'thawline-e2e-')), 'bad.csv');
  fs.writeFileSync(bad, fs.readFileSync(DEMO_LOG, 'utf8').replace('2026-11-24 18:00:00,', '2026-11-24 18:00:00,probe lost'));
  const cal = new CalibrationPage(page);
  await cal.open();
  await cal.upload(bad);
  const problems = page.getByRole('table', { name: 'Problems by row' });
  await problems.waitFor();
  await problems.getByRole('row', { name: /54 .*probe lost/ }).waitFor();
  assert.equal(await page.getByRole('button', { name: 'Store and fit' }).isDisabled(), true);
  await context.close();
});

test('a pilot is refused Fit from log (403) and its upload API (403)', async () => {
  const { context, page } = await signedInContext(browser, 'pilot');
  const res = await page.goto(`${BASE}/calibration`);
  assert.equal(res.status(), 403);
  const api = await context.request.post(`${BASE}/api/aircraft/1/logs/preview`, { data: 'time,oil\n', headers: { 'content-type': 'text/csv' } });
  assert.equal(api.status(), 403);
  await context.close();
});

test('an operator removes a stored log through the confirm dialog, after first backing out', async () => {
  const { context, page } = await signedInContext(browser, 'operator');
  const cal = new CalibrationPage(page);
  await cal.open();
  await cal.chooseAircraft('Q-KAPA');
  await cal.upload(DEMO_LOG);
  await page.getByRole('button', { name: 'Store and fit' }).click();
  await page.getByRole('heading', { name: 'Fit: cooldown-q-kapa.csv' }).waitFor({ timeout: 30_000 });
  await cal.open();
  await cal.chooseAircraft('Q-KAPA');
  const removeButtons = page.getByRole('button', { name: 'Remove cooldown-q-kapa.csv' });
  await removeButtons.first().waitFor();
  const before = await removeButtons.count();

  await removeButtons.first().click();
  const dialog = page.getByRole('dialog', { name: 'Remove cooldown-q-kapa.csv?' });
  await dialog.waitFor();
  await dialog.getByRole('button', { name: 'Keep' }).click();
  await dialog.waitFor({ state: 'detached' });
  assert.equal(await removeButtons.count(), before);

  await removeButtons.first().click();
  await dialog.getByRole('button', { name: 'Remove log' }).click();
  await cal.status().filter({ hasText: 'Removed cooldown-q-kapa.csv' }).waitFor();
  await page.waitForFunction(
    (n) => document.querySelectorAll('button[aria-label], button').length >= 0 && [...document.querySelectorAll('button')].filter((b) => b.textContent === 'Remove cooldown-q-kapa.csv').length === n,
    before - 1,
  );
  await context.close();
});
