// The Site map is never blank: the outline basemap draws without any tile server, and stays visible
// when the configured tile server cannot be reached (a second app instance with MAP_TILE_URL pointing
// at a closed loopback port).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { spawn } from 'node:child_process';
import net from 'node:net';
import { BASE, launch, signedInContext, SignInPage, USERS } from './support.mjs';

let browser;
before(async () => {
  browser = await launch();
});
after(async () => {
  await browser?.close();
});

/** The Site map page: the Leaflet map, its outline basemap, tiles and airfield tags. */
class SiteMapPage {
  constructor(page, base = BASE) {
    this.page = page;
    this.base = base;
  }
  async open() {
    await this.page.goto(`${this.base}/map`);
    await this.page.getByRole('heading', { level: 1, name: 'Site map' }).waitFor();
    await this.page.locator('.leaflet-container').waitFor();
  }
  outline() {
    return this.page.locator('.leaflet-pane svg path.tl-basemap-land');
  }
  tiles() {
    return this.page.locator('img.leaflet-tile');
  }
  markers() {
    return this.page.locator('.leaflet-marker-icon');
  }
}

async function freePort() {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.listen(0, '127.0.0.1', () => {
      const p = srv.address().port;
      srv.close(() => resolve(p));
    });
  });
}

test('with no tile server configured the outline basemap draws the land, under the airfield tags', async () => {
  const { context, page } = await signedInContext(browser, 'manager');
  const map = new SiteMapPage(page);
  await map.open();
  await map.outline().first().waitFor();
  assert.ok((await map.outline().count()) >= 1, 'an SVG path of the outline basemap');
  const box = await map.outline().first().boundingBox();
  assert.ok(box && box.width > 50 && box.height > 50, 'the land outline covers part of the map');
  assert.equal(await map.tiles().count(), 0, 'no tile layer without MAP_TILE_URL');
  // One tag per airfield of the organization (the demo's three, and any a test added), none of another's.
  for (const ident of ['XKTL', 'XBRM', 'XSTG']) await page.locator(`.leaflet-marker-icon[title*="(${ident})"]`).waitFor();
  assert.equal(await page.locator('.leaflet-marker-icon[title*="(XRDG)"]').count(), 0);
  await page.getByText('Tonight’s forecast low', { exact: true }).waitFor();
  await context.close();
});

test('on a phone the key starts folded so it covers no tag, and opens from its button', async () => {
  const { context, page } = await signedInContext(browser, 'manager', { width: 390, height: 844 });
  const map = new SiteMapPage(page);
  await map.open();
  await page.locator('.leaflet-marker-icon[title*="(XKTL)"]').waitFor();
  const key = page.getByRole('button', { name: 'Key' });
  await key.waitFor();
  assert.equal(await key.getAttribute('aria-expanded'), 'false');
  assert.equal(await page.getByText('Tonight’s forecast low', { exact: true }).isVisible(), false);
  await key.click();
  await page.getByText('Tonight’s forecast low', { exact: true }).waitFor();
  await page.getByRole('button', { name: 'Hide key' }).click();
  await page.getByText('Tonight’s forecast low', { exact: true }).waitFor({ state: 'hidden' });
  await context.close();
});

test('with the tile server unreachable the outline basemap is still visible', async () => {
  const [port, closedPort] = [await freePort(), await freePort()];
  const base = `http://127.0.0.1:${port}`;
  const server = spawn('npx', ['next', 'start', '-p', String(port), '-H', '127.0.0.1'], {
    env: {
      ...process.env,
      PORT: String(port),
      NEXTAUTH_URL: base,
      THAWLINE_JOBS: 'off',
      MAP_TILE_URL: `http://127.0.0.1:${closedPort}/tiles/{z}/{x}/{y}.png`,
      MAP_TILE_ATTRIBUTION: 'Test tiles (unreachable)',
    },
    stdio: 'ignore',
    detached: true,
  });
  try {
    let up = false;
    for (let i = 0; i < 120 && !up; i++) {
      up = await fetch(`${base}/api/health`).then((r) => r.ok, () => false);
      if (!up) await new Promise((r) => setTimeout(r, 500));
    }
    assert.ok(up, 'second app instance answers /api/health');

    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    const failedTiles = [];
    page.on('requestfailed', (r) => (r.url().includes('/tiles/') ? failedTiles.push(r.url()) : null));
    const signin = new SignInPage(page);
    await page.goto(`${base}/signin`);
    await signin.signIn(USERS.manager);
    await page.waitForURL((u) => !u.pathname.startsWith('/signin'));

    const map = new SiteMapPage(page, base);
    await map.open();
    await map.tiles().first().waitFor({ state: 'attached' });
    await map.outline().first().waitFor();
    for (let i = 0; i < 40 && failedTiles.length === 0; i++) await page.waitForTimeout(250);
    assert.ok(failedTiles.length > 0, 'the tile requests failed');
    // Failed tiles are replaced by a transparent image, so the outline below shows through.
    await page.locator('img.leaflet-tile[src^="data:image/gif"]').first().waitFor({ state: 'attached' });
    assert.ok(await map.outline().first().isVisible(), 'the outline stays visible under the failed tiles');
    await page.getByText('Test tiles (unreachable)').waitFor();
    await context.close();
  } finally {
    try {
      process.kill(-server.pid, 'SIGTERM');
    } catch {}
  }
});
