// Writes under concurrency against the built app (its scheduler running): simultaneous requests with a
// signed-in session wait for the write lock instead of failing. Every batch starts at once; the answers
// are counted, and the rows are checked through the API and, for heat plans, in the database file.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { createRequire } from 'node:module';
import { BASE, SignInPage, launch, signedInContext } from './support.mjs';

const require = createRequire(import.meta.url);
const ZONE = 'Europe/Helsinki';

function localDay(days) {
  return new Intl.DateTimeFormat('en-CA', { timeZone: ZONE, year: 'numeric', month: '2-digit', day: '2-digit' }).format(Date.now() + days * 86_400_000);
}

function tally(statuses) {
  const out = {};
  for (const s of statuses) out[s] = (out[s] ?? 0) + 1;
  return out;
}

/** JSON calls with the session cookie of a signed-in browser context, as the app's own pages send them. */
function api(context) {
  const headers = { origin: BASE, 'content-type': 'application/json' };
  return {
    async send(method, path, data) {
      const r = await context.request.fetch(`${BASE}${path}`, { method, headers, data: data === undefined ? undefined : JSON.stringify(data), failOnStatusCode: false });
      let body = null;
      try {
        body = await r.json();
      } catch {}
      return { status: r.status(), body };
    },
  };
}

let browser;
const contexts = [];
async function as(role) {
  const { context } = await signedInContext(browser, role);
  contexts.push(context);
  return api(context);
}
async function asEmail(email) {
  const context = await browser.newContext();
  const page = await context.newPage();
  const signin = new SignInPage(page);
  await signin.open();
  await signin.signIn(email);
  await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
  contexts.push(context);
  return api(context);
}

before(async () => {
  browser = await launch();
});
after(async () => {
  for (const c of contexts) await c.close();
  await browser?.close();
});

async function aircraftId(client, registration) {
  const r = await client.send('GET', '/api/aircraft');
  const list = r.body.aircraft ?? r.body;
  const a = list.find((x) => x.registration === registration);
  assert.ok(a, `aircraft ${registration}`);
  return a.id;
}

// Q-KUURA: no other browser test books it, so its 50 days never clash with theirs (the run shares one database).
test('50 bookings on 50 different days: 50 × 201, and 50 more departures listed', async () => {
  const op = await as('operator');
  const id = await aircraftId(op, 'Q-KUURA');
  const count = async () => (await op.send('GET', `/api/departures?aircraftId=${id}&from=${encodeURIComponent(new Date().toISOString())}&to=${encodeURIComponent(new Date(Date.now() + 61 * 86_400_000).toISOString())}`)).body.departures.length;
  const before = await count();
  const res = await Promise.all(Array.from({ length: 50 }, (_, i) => op.send('POST', '/api/departures', { aircraftId: id, departAt: `${localDay(8 + i)}T07:30` })));
  assert.deepEqual(tally(res.map((r) => r.status)), { 201: 50 });
  assert.equal(await count(), before + 50);
});

test('50 bookings of one aircraft on the same day: 1 × 201 and 49 × 409', async () => {
  const op = await as('operator');
  const id = await aircraftId(op, 'Q-LUMI');
  const day = localDay(20);
  const res = await Promise.all(Array.from({ length: 50 }, (_, i) => op.send('POST', '/api/departures', { aircraftId: id, departAt: `${day}T${String(6 + (i % 10)).padStart(2, '0')}:${String(i).padStart(2, '0')}` })));
  assert.deepEqual(tally(res.map((r) => r.status)), { 201: 1, 409: 49 });
});

test('50 changes of one departure: 50 × 200, and the last write wins', async () => {
  const op = await as('operator');
  const id = await aircraftId(op, 'Q-SIPI');
  const made = await op.send('POST', '/api/departures', { aircraftId: id, departAt: `${localDay(25)}T08:00` });
  assert.equal(made.status, 201);
  const dep = made.body.departure.id;
  const finished = [];
  const res = await Promise.all(
    Array.from({ length: 50 }, async (_, i) => {
      const r = await op.send('PATCH', `/api/departures/${dep}`, { notes: `change ${i}` });
      if (r.status === 200) finished.push(r.body.departure.notes);
      return r;
    }),
  );
  assert.deepEqual(tally(res.map((r) => r.status)), { 200: 50 });
  const now = await op.send('GET', `/api/departures/${dep}`);
  assert.equal(now.body.departure.notes, finished.at(-1));
});

test('50 invitations of one address: 1 × 201 and 49 × 409, one user', async () => {
  const mgr = await as('manager');
  const email = 'e2e.member@frostvale.test';
  const res = await Promise.all(Array.from({ length: 50 }, () => mgr.send('POST', '/api/users', { name: 'New Member', email, role: 'pilot' })));
  assert.deepEqual(tally(res.map((r) => r.status)), { 201: 1, 409: 49 });
  const users = (await mgr.send('GET', '/api/users')).body.users;
  assert.equal(users.filter((u) => u.email === email).length, 1);
});

test('20 first saves of alert preferences: 20 × 200', async () => {
  const me = await asEmail('operator2@frostvale.test');
  const res = await Promise.all(Array.from({ length: 20 }, (_, i) => me.send('PUT', '/api/me/preferences', { reminderLeadMinutes: 30 + i, quietStart: '22:00', quietEnd: '06:00' })));
  assert.deepEqual(tally(res.map((r) => r.status)), { 200: 20 });
});

test('board reads while bookings are written: no 500, one stored heat plan per departure', async () => {
  const op = await as('operator');
  const id = await aircraftId(op, 'Q-TAIMI');
  const [reads, bookings] = await Promise.all([
    Promise.all(Array.from({ length: 30 }, () => op.send('GET', '/api/board'))),
    Promise.all(Array.from({ length: 10 }, (_, i) => op.send('POST', '/api/departures', { aircraftId: id, departAt: `${localDay(30 + i)}T07:00` }))),
  ]);
  assert.deepEqual(tally(reads.map((r) => r.status)), { 200: 30 });
  assert.deepEqual(tally(bookings.map((r) => r.status)), { 201: 10 });
  if (process.env.DATABASE_FILE) {
    const sqlite3 = require('sqlite3');
    const db = new sqlite3.Database(process.env.DATABASE_FILE, sqlite3.OPEN_READONLY);
    const dup = await new Promise((res, rej) => db.all('SELECT "departureId", COUNT(*) AS n FROM heat_plans GROUP BY "departureId" HAVING COUNT(*) > 1', (e, rows) => (e ? rej(e) : res(rows))));
    const all = await new Promise((res, rej) => db.get('SELECT COUNT(*) AS n FROM heat_plans', (e, row) => (e ? rej(e) : res(row.n))));
    db.close();
    assert.deepEqual(dup, []);
    assert.ok(all > 0);
  }
});
