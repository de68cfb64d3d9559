// npm run bench:http [-- --db sqlite|pg|both] [--fleet N] [--seconds S] [--connections C]
// Starts the built app on a free port with a fleet seed (the demo's next morning plus N invented
// aircraft: 200 next-morning departures in the first organization by default), signs in as the demo
// operator, warms the board, then loads GET /api/board and GET /api/health in turn with C concurrent
// connections for S seconds each (autocannon) and prints their p99 latencies, the ratio and the errors.
// On SQLite (a temporary file) and on PostgreSQL (BENCH_DATABASE_URL's server, else a throwaway one).
// A benchmark, not a test: it prints figures and asserts nothing about time.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createRequire } from 'node:module';
import autocannon from 'autocannon';
import { startThrowawayPostgres } from '../../scripts/pg-throwaway.mjs';
import { buildIfNeeded, prepareDatabase, signIn, startInstance } from '../../scripts/app-instance.mjs';

const require = createRequire(import.meta.url);
const opt = { db: 'both', fleet: '193', seconds: '10', connections: '20' };
const argv = process.argv.slice(2);
for (let i = 0; i < argv.length; i++) {
  const m = /^--(db|fleet|seconds|connections)(?:=(.*))?$/.exec(argv[i]);
  if (!m) throw new Error(`unknown argument ${argv[i]}`);
  opt[m[1]] = m[2] ?? argv[++i];
}
const fleet = Number(opt.fleet);
const seconds = Number(opt.seconds);
const connections = Number(opt.connections);
if (!['sqlite', 'pg', 'both'].includes(opt.db) || !(fleet >= 0) || !(seconds > 0) || !(connections > 0)) throw new Error('bad arguments');

const DEMO = { operator: 'operator@frostvale.test', password: 'thaw-demo-2026' };
const baseEnv = {
  ...process.env,
  NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET || 'thawline-bench-secret-0123456789abcdef0123',
  THAWLINE_JOBS: 'off',
  SMTP_CAPTURE_PORT: '0',
};
const cleanups = [];
const cleanup = async () => {
  while (cleanups.length) await cleanups.pop()().catch(() => {});
};
for (const sig of ['SIGINT', 'SIGTERM']) process.once(sig, () => void cleanup().then(() => process.exit(130)));

function load(url, headers) {
  return new Promise((resolve, reject) => {
    const inst = autocannon({ url, connections, duration: seconds, headers, timeout: 60 }, (err, res) => (err ? reject(err) : resolve(res)));
    autocannon.track(inst, { renderProgressBar: false, renderResultsTable: false, renderLatencyTable: false });
  });
}

const fmt = (ms) => `${ms.toFixed(1)} ms`;

async function run(dialect) {
  const env = { ...baseEnv };
  if (dialect === 'sqlite') {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'thawline-bench-'));
    cleanups.push(async () => fs.rmSync(dir, { recursive: true, force: true }));
    env.DATABASE_FILE = path.join(dir, 'bench.sqlite');
    delete env.DATABASE_URL;
  } else if (process.env.BENCH_DATABASE_URL) {
    const { Client } = require('pg');
    const name = `thawline_bench_${process.pid}`;
    const admin = new Client({ connectionString: process.env.BENCH_DATABASE_URL });
    await admin.connect();
    await admin.query(`CREATE DATABASE "${name}"`);
    await admin.end();
    cleanups.push(async () => {
      const c = new Client({ connectionString: process.env.BENCH_DATABASE_URL });
      await c.connect();
      await c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      await c.end();
    });
    const u = new URL(process.env.BENCH_DATABASE_URL);
    u.pathname = `/${name}`;
    env.DATABASE_URL = u.toString();
  } else {
    const pg = await startThrowawayPostgres();
    cleanups.push(async () => pg.stop());
    env.DATABASE_URL = pg.url;
  }
  prepareDatabase(env, { fleet });
  const app = await startInstance(env, { name: `bench-${dialect}` });
  cleanups.push(() => app.stop());
  const s = await signIn(app.base, DEMO.operator, DEMO.password);
  if (!s.ok) throw new Error(`sign-in failed (${s.error ?? 'no session cookie'})`);
  const headers = { cookie: s.cookie };
  // Warm: the first board read computes and stores every plan; later reads find them current.
  const t0 = performance.now();
  const warm = await fetch(`${app.base}/api/board`, { headers });
  const warmMs = performance.now() - t0;
  const body = await warm.json();
  if (!warm.ok) throw new Error(`board answered ${warm.status}`);
  const departures = body.plans.length;
  const t1 = performance.now();
  await (await fetch(`${app.base}/api/board`, { headers })).arrayBuffer();
  const steadyMs = performance.now() - t1;
  // Health first, on an idle server; the board's load last, since requests still in flight when its
  // time is up keep the server busy afterwards (autocannon counts only the ones that finished).
  const health = await load(`${app.base}/api/health`, {});
  const board = await load(`${app.base}/api/board`, headers);
  await app.stop();
  await cleanup();
  const errors = (r) => r.errors + r.timeouts + r.non2xx;
  return { dialect, departures, warmMs, steadyMs, board, health, ratio: board.latency.p99 / health.latency.p99, errors: errors(board) + errors(health) };
}

buildIfNeeded(baseEnv);
const dialects = opt.db === 'both' ? ['sqlite', 'pg'] : [opt.db];
const results = [];
try {
  for (const d of dialects) results.push(await run(d));
} finally {
  await cleanup();
}
console.log(`\nHTTP bench: ${connections} connections, ${seconds} s per endpoint, THAWLINE_JOBS=off, ${os.cpus().length} cores, load average ${os.loadavg()[0].toFixed(1)}`);
for (const r of results) {
  console.log(
    `${r.dialect.padEnd(6)} board (${r.departures} next-morning departures): p99 ${fmt(r.board.latency.p99)}, median ${fmt(r.board.latency.p50)}, ${r.board.requests.total} requests; ` +
      `health: p99 ${fmt(r.health.latency.p99)}, ${r.health.requests.total} requests; ` +
      `p99 ratio board/health ${r.ratio.toFixed(1)}× (target ≤ 5×); errors ${r.errors}; one board read alone: first ${fmt(r.warmMs)}, then ${fmt(r.steadyMs)}`,
  );
}
process.exit(0);
