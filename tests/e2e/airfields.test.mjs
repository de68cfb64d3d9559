// Airfields and shelters in the browser: a manager adds both and finds the marker on the Site map;
// a pilot reads the map and the airfield page but gets no edit controls.
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

/** Opens a Site map tag's popup from the keyboard (tags may overlap where airfields are close). */
async function openTag(page, ident) {
  const marker = page.locator(`.leaflet-marker-icon[title*="(${ident})"]`);
  await marker.waitFor();
  await marker.focus();
  await page.keyboard.press('Enter');
  return marker;
}

/** The airfield form, found by its labels. */
class AirfieldFormPage {
  constructor(page) {
    this.page = page;
  }
  async open() {
    await this.page.goto(`${BASE}/airfields/new`);
    await this.page.getByRole('heading', { name: 'New airfield' }).waitFor();
  }
  async fill({ name, ident, latitude, longitude, elevation, timeZone }) {
    const p = this.page;
    await p.getByLabel('Name', { exact: true }).fill(name);
    await p.getByLabel('Identifier').fill(ident);
    await p.getByLabel('Latitude (°)').fill(latitude);
    await p.getByLabel('Longitude (°)').fill(longitude);
    await p.getByLabel('Elevation (m)').fill(elevation);
    await p.getByLabel('Time zone').fill(timeZone);
  }
  async submit() {
    await this.page.getByRole('button', { name: 'Create airfield' }).click();
  }
}

/** The shelter form. */
class ShelterFormPage {
  constructor(page) {
    this.page = page;
  }
  async add({ name, kind }) {
    await this.page.getByRole('heading', { name: 'New shelter' }).waitFor();
    await this.page.getByLabel('Name', { exact: true }).fill(name);
    await this.page.getByRole('radio', { name: new RegExp(`^${kind}`) }).check({ force: true });
    await this.page.getByRole('button', { name: 'Add shelter' }).click();
  }
}

const NEW = { name: 'Cedar Flats', ident: 'XCDF', latitude: '61.31', longitude: '24.85', elevation: '118', timeZone: 'Europe/Helsinki' };

test('a manager adds an airfield and a shelter and sees its marker on the Site map (phone size)', async () => {
  const { context, page } = await signedInContext(browser, 'manager', { width: 390, height: 844 });
  const form = new AirfieldFormPage(page);
  await form.open();

  // A bad latitude is refused beside its field, and what was typed is kept.
  await form.fill({ ...NEW, latitude: '91' });
  await form.submit();
  const lat = page.getByLabel('Latitude (°)');
  await page.getByText('The latitude must be between −90° and 90°.').waitFor();
  assert.equal(await lat.getAttribute('aria-invalid'), 'true');
  const describedBy = await lat.getAttribute('aria-describedby');
  assert.match(describedBy, /af-lat-error/);
  assert.equal(await page.getByLabel('Name', { exact: true }).inputValue(), NEW.name);

  await lat.fill(NEW.latitude);
  await form.submit();
  await page.waitForURL(/\/airfields\/\d+$/);
  await page.getByRole('heading', { level: 1, name: NEW.name }).waitFor();
  const airfieldUrl = page.url();

  await page.getByRole('link', { name: 'Add shelter' }).first().click();
  await new ShelterFormPage(page).add({ name: 'Birch row T', kind: 'T-hangar' });
  await page.waitForURL(airfieldUrl);
  await page.getByRole('cell', { name: /Birch row T/ }).first().waitFor();

  await page.goto(`${BASE}/map`);
  const marker = await openTag(page, NEW.ident);
  assert.match(await marker.getAttribute('title'), /tonight's low|no forecast yet/);
  const popup = page.locator('.leaflet-popup-content');
  await popup.getByText('Birch row T').waitFor();
  await popup.getByRole('link', { name: `Open ${NEW.name}` }).click();
  await page.waitForURL(airfieldUrl);
  await context.close();
});

test('a pilot sees the map and an airfield page but no edit controls, and the forms answer 403', async () => {
  const { context, page } = await signedInContext(browser, 'pilot');
  await page.goto(`${BASE}/map`);
  await openTag(page, 'XKTL');
  await page.locator('.leaflet-popup-content').getByRole('link', { name: 'Open Kettle Lake' }).click();
  await page.waitForURL(/\/airfields\/\d+$/);
  await page.getByRole('heading', { level: 1, name: 'Kettle Lake' }).waitFor();
  await page.getByRole('heading', { name: 'Next 48 hours' }).waitFor();
  await page.getByRole('heading', { name: 'Sun' }).waitFor();
  await page.getByRole('button', { name: 'Refresh forecast' }).waitFor();

  for (const name of ['Edit airfield', 'Add shelter', 'Edit']) {
    assert.equal(await page.getByRole('link', { name, exact: true }).count(), 0, `no "${name}" link for a pilot`);
  }
  assert.equal(await page.getByRole('button', { name: /^(Archive|Delete)/ }).count(), 0);

  const id = page.url().split('/').pop();
  assert.equal((await page.goto(`${BASE}/airfields/new`)).status(), 403);
  assert.equal((await page.goto(`${BASE}/airfields/${id}/edit`)).status(), 403);
  const api = await context.request.post(`${BASE}/api/airfields`, { data: NEW });
  assert.equal(api.status(), 403);
  await context.close();
});

test('the airfields table sorts by a column heading', async () => {
  const { context, page } = await signedInContext(browser, 'operator');
  await page.goto(`${BASE}/airfields`);
  const firstCell = () => page.locator('tbody tr').first().locator('td').first().textContent();
  await page.getByRole('columnheader', { name: /Airfield/ }).waitFor();
  assert.match(await firstCell(), /Birchmoor/);
  await page.getByRole('button', { name: /^Airfield/ }).click();
  assert.equal(await page.getByRole('columnheader', { name: /Airfield/ }).getAttribute('aria-sort'), 'descending');
  assert.doesNotMatch(await firstCell(), /Birchmoor/);
  await context.close();
});
