// npm run test:scale — two built app instances on one PostgreSQL (TEST_DATABASE_URL's server, else a
// throwaway one), both running the jobs, mail going to an SMTP server of the test's own that counts
// every delivery. Checks: both healthy; each scheduled job runs once across both (one runs it, the other
// finds the lease held); each outbox mail is delivered once; a plan confirmed on one instance is
// confirmed on the other; sign-in failures made on either count against the one limit.
import { after, before, test } from 'node:test';
import assert from 'node:assert/strict';
import { createRequire } from 'node:module';
import { SMTPServer } from 'smtp-server';
import { startThrowawayPostgres } from '../../scripts/pg-throwaway.mjs';
import { buildIfNeeded, prepareDatabase, signIn, startInstance } from '../../scripts/app-instance.mjs';

const require = createRequire(import.meta.url);
const { Client } = require('pg');
const DEMO = { operator: 'operator@frostvale.test', password: 'thaw-demo-2026' };
const MAX_PER_ADDRESS = 4;

let pg = null;
let dbUrl;
let dropDb = null;
let smtp;
const received = new Map(); // Message-ID → deliveries
let a;
let b;
let sql;

function messageIdOf(raw) {
  const m = /^message-id:\s*(<[^>]+>)/im.exec(raw);
  return m ? m[1] : '(none)';
}

async function startSmtp() {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, _session, cb) {
      let raw = '';
      stream.on('data', (c) => (raw += c.toString('latin1')));
      stream.on('end', () => {
        const id = messageIdOf(raw);
        received.set(id, (received.get(id) ?? 0) + 1);
        cb();
      });
    },
  });
  await new Promise((r) => server.listen(0, '127.0.0.1', r));
  return { server, port: server.server.address().port };
}

async function until(what, fn, timeoutMs = 90_000) {
  const end = Date.now() + timeoutMs;
  let last;
  while (Date.now() < end) {
    last = await fn();
    if (last) return last;
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`timed out waiting for ${what}`);
}

before(async () => {
  if (process.env.TEST_DATABASE_URL) {
    const name = `thawline_scale_${process.pid}`;
    const admin = new Client({ connectionString: process.env.TEST_DATABASE_URL });
    await admin.connect();
    await admin.query(`CREATE DATABASE "${name}"`);
    await admin.end();
    const u = new URL(process.env.TEST_DATABASE_URL);
    u.pathname = `/${name}`;
    dbUrl = u.toString();
    dropDb = async () => {
      const c = new Client({ connectionString: process.env.TEST_DATABASE_URL });
      await c.connect();
      await c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      await c.end();
    };
  } else {
    pg = await startThrowawayPostgres();
    dbUrl = pg.url;
  }
  smtp = await startSmtp();
  const env = {
    ...process.env,
    DATABASE_URL: dbUrl,
    NEXTAUTH_SECRET: 'thawline-scale-test-secret-0123456789abcdef',
    SMTP_URL: `smtp://127.0.0.1:${smtp.port}`,
    THAWLINE_JOBS: 'on',
    SIGNIN_MAX_PER_ADDRESS: String(MAX_PER_ADDRESS),
    DB_POOL_MAX: '5',
  };
  buildIfNeeded(env);
  prepareDatabase(env);
  // Started together: both schedulers run every job once at start, racing for the leases.
  [a, b] = await Promise.all([startInstance(env, { name: 'instance-a' }), startInstance(env, { name: 'instance-b' })]);
  sql = new Client({ connectionString: dbUrl });
  await sql.connect();
});

after(async () => {
  await sql?.end().catch(() => {});
  await Promise.all([a?.stop(), b?.stop()]);
  await new Promise((r) => (smtp ? smtp.server.close(r) : r()));
  await dropDb?.().catch(() => {});
  pg?.stop();
});

test('both instances are healthy on one PostgreSQL, and both run a scheduler', async () => {
  for (const i of [a, b]) {
    const h = await i.health();
    assert.equal(h.status, 200);
    assert.equal(h.body.database.dialect, 'postgres');
    assert.equal(h.body.database.migrations.current, true);
    assert.equal(h.body.jobs.thisInstance, 'running');
    assert.equal(h.body.fakes.mail.local, false);
  }
});

test('each scheduled job runs once across both instances', async () => {
  // Wait until both have made their start-up attempt at every job.
  const [ha, hb] = await until('both start-up runs', async () => {
    const hs = [(await a.health()).body, (await b.health()).body];
    return hs.every((h) => h.jobs.each.every((j) => j.lastAttemptHere)) ? hs : null;
  });
  for (const name of ha.jobs.each.map((j) => j.name)) {
    const ja = ha.jobs.each.find((j) => j.name === name);
    const jb = hb.jobs.each.find((j) => j.name === name);
    const outcomes = [ja.lastAttemptHere.outcome, jb.lastAttemptHere.outcome].sort();
    assert.deepEqual(outcomes, ['lease-held', 'ran'], `${name}: one instance ran it, the other found the lease held`);
    assert.equal(Number(ja.heldByThisInstance) + Number(jb.heldByThisInstance), 1, `${name}: one holder`);
  }
  const { rows } = await sql.query('SELECT name, runs FROM leases');
  // Each job's lease counts its runs: at start each ran once (a cron tick since can only add holder runs).
  for (const r of rows) assert.ok(r.runs >= 1, `${r.name} ran`);
  const started = rows.find((r) => r.name === 'forecast-refresh');
  assert.equal(started.runs, 1, 'the forecast refresh ran once, not once per instance');
});

test('each outbox mail is delivered once', async () => {
  const sent = await until('the start-up mail to go out', async () => {
    const { rows } = await sql.query(`SELECT "messageId", status FROM outbox_messages`);
    const open = rows.filter((r) => r.status === 'pending' || r.status === 'sending');
    return rows.length > 0 && open.length === 0 ? rows.filter((r) => r.status === 'sent') : null;
  });
  assert.ok(sent.length > 0, 'the demo queues mail at start');
  for (const m of sent) assert.equal(received.get(m.messageId), 1, `${m.messageId} delivered once`);
  const total = [...received.values()].reduce((s, n) => s + n, 0);
  assert.equal(total, sent.length, 'nothing delivered that the outbox did not send');
});

test('a plan confirmed on one instance is confirmed on the other', async () => {
  const sa = await signIn(a.base, DEMO.operator, DEMO.password);
  assert.ok(sa.ok, `sign-in on a: ${sa.error}`);
  const boardA = await (await fetch(`${a.base}/api/board`, { headers: { cookie: sa.cookie } })).json();
  const plan = boardA.plans.find((p) => p.status === 'warming' && !p.confirmed);
  assert.ok(plan, 'a warming plan to confirm');
  const c = await fetch(`${a.base}/api/departures/${plan.departureId}/plan/confirm`, { method: 'POST', headers: { cookie: sa.cookie } });
  assert.equal(c.status, 200);
  // The same session works on the other instance (one secret), and sees the confirmation.
  const boardB = await (await fetch(`${b.base}/api/board`, { headers: { cookie: sa.cookie } })).json();
  const same = boardB.plans.find((p) => p.departureId === plan.departureId);
  assert.ok(same.confirmed, 'confirmed on b');
  const { rows } = await sql.query('SELECT COUNT(*)::int AS n FROM heat_plans WHERE "departureId" = $1', [plan.departureId]);
  assert.equal(rows[0].n, 1, 'one stored plan for the departure');
});

test('sign-in failures on either instance count against one limit', async () => {
  const wrong = 'nobody-here@frostvale.test';
  for (let i = 0; i < MAX_PER_ADDRESS; i++) {
    const r = await signIn(i % 2 ? b.base : a.base, wrong, 'not-the-password-1');
    assert.equal(r.ok, false);
    assert.equal(r.error, 'CredentialsSignin', `failure ${i + 1} is an ordinary failure`);
  }
  for (const i of [a, b]) {
    const r = await signIn(i.base, wrong, 'not-the-password-1');
    assert.match(r.error ?? '', /TooManyAttempts/, `${i.name} refuses: the address used up its tries across both`);
  }
});
