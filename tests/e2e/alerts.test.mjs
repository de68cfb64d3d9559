// The oil-too-cold warning end to end: the app starts with its scheduler on (THAWLINE_JOBS=on is the
// default; the first run of every job happens at start, in data-flow order: forecasts, plans, alerts,
// delivery), so the demo's short departure is warned about without any trigger from the test. The pilot
// sees the warning on the alerts page; the manager finds the e-mail in the local mail capture.
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

/** Polls an API until `pick` finds something (the scheduler's first run may still be going). */
async function eventually(context, url, pick, timeoutMs = 90_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const r = await context.request.get(`${BASE}${url}`);
    if (r.ok()) {
      const found = pick(await r.json());
      if (found) return found;
    }
    if (Date.now() > until) throw new Error(`nothing found at ${url} within ${timeoutMs} ms`);
    await new Promise((res) => setTimeout(res, 1000));
  }
}

/** The alerts page, by its roles and labels. */
class AlertsPage {
  constructor(page) {
    this.page = page;
  }
  async open() {
    await this.page.goto(`${BASE}/alerts`);
    await this.page.getByRole('heading', { name: 'Alerts', level: 1 }).waitFor();
  }
  alert(title) {
    return this.page.getByRole('article', { name: title });
  }
  unread() {
    return this.page.getByTestId('unread-count');
  }
}

test('the demo pilot sees the oil-too-cold warning for their short departure, and the manager finds its e-mail in the mail viewer', async () => {
  const { context, page } = await signedInContext(browser, 'pilot', { width: 390, height: 844 });
  // The demo's short departure of this pilot, from their own departures API.
  const mine = await (await context.request.get(`${BASE}/api/me/departures`)).json();
  const short = mine.plans.find((p) => p.status === 'short');
  assert.ok(short, `the demo pilot has a short departure (statuses: ${mine.plans.map((p) => `${p.aircraft.registration} ${p.status}`).join(', ')})`);
  const reg = short.aircraft.registration;

  const warning = await eventually(context, '/api/alerts', (b) => b.alerts.find((a) => a.kind === 'oil-too-cold' && a.data.departureId === short.departureId));
  const alerts = new AlertsPage(page);
  await alerts.open();
  const card = alerts.alert(warning.title);
  await card.waitFor();
  const text = await card.innerText();
  assert.match(text, /Oil-too-cold warning/);
  assert.match(text, new RegExp(`${reg} will be too cold`));
  assert.match(text, /What would fix it/);
  assert.match(text, /manufacturer/);
  assert.ok(Number(await alerts.unread().innerText()) >= 1);
  // The unread count in the navigation follows an acknowledgement.
  const before = Number(await alerts.unread().innerText());
  await card.getByRole('button', { name: /^Acknowledge/ }).click();
  await page.waitForFunction((n) => Number(document.querySelector('[data-testid="unread-count"]')?.textContent) === n, before - 1);
  await context.close();

  // The manager: the same warning as e-mail to the pilot, in the local mail capture.
  const m = await signedInContext(browser, 'manager');
  const mail = await eventually(m.context, '/api/mail', (b) => b.messages.find((x) => x.to.includes('pilot@frostvale.test') && x.subject.startsWith(`${reg} will be too cold`)));
  await m.page.goto(`${BASE}/mail`);
  await m.page.getByRole('heading', { name: 'Local mail capture', level: 1 }).waitFor();
  await m.page.getByRole('navigation', { name: 'Captured messages' }).getByRole('link', { name: new RegExp(mail.subject) }).first().click();
  await m.page.waitForURL(new RegExp(`/mail/\\d+$`));
  await m.page.getByRole('heading', { name: mail.subject, level: 2 }).waitFor();
  const frame = m.page.frameLocator('iframe[title^="Rendered message"]');
  await frame.getByRole('heading', { name: mail.subject }).waitFor();
  assert.match(await frame.locator('body').innerText(), /Thawline gives estimates/);
  await m.page.getByRole('tab', { name: 'Plain text' }).click();
  assert.match(await m.page.getByRole('tabpanel').innerText(), /Predicted oil at departure/);
  await m.context.close();
});

test('a pilot may not open the mail viewer (403)', async () => {
  const { context, page } = await signedInContext(browser, 'pilot');
  const res = await page.goto(`${BASE}/mail`);
  assert.equal(res.status(), 403);
  assert.equal((await context.request.get(`${BASE}/api/mail`)).status(), 403);
  await context.close();
});
