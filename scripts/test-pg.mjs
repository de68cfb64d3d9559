// npm run test:pg [-- vitest arguments] — the integration suites against PostgreSQL.
// TEST_DATABASE_URL set: that server (the user needs CREATEDB; each test file gets its own database,
// dropped at the end). Unset: a throwaway PostgreSQL from Debian's binaries (scripts/pg-throwaway.mjs),
// stopped and removed at the end, also on failure and Ctrl-C.
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { createRequire } from 'node:module';
import { startThrowawayPostgres } from './pg-throwaway.mjs';

const require = createRequire(import.meta.url);
const args = process.argv.slice(2);
const files = args.some((a) => !a.startsWith('-')) ? [] : ['tests/integration'];
const prefix = `thawline_t_${randomBytes(3).toString('hex')}`;

let server = null;
let child = null;
let finishing = false;

async function dropRunDatabases(adminUrl) {
  const { Client } = require('pg');
  const c = new Client({ connectionString: adminUrl });
  try {
    await c.connect();
    const { rows } = await c.query('SELECT datname FROM pg_database WHERE datname LIKE $1', [`${prefix}%`]);
    for (const r of rows) await c.query(`DROP DATABASE IF EXISTS "${r.datname}" WITH (FORCE)`);
  } catch (err) {
    console.error(`[test:pg] could not drop the run's databases (${prefix}_*):`, err instanceof Error ? err.message : err);
  } finally {
    await c.end().catch(() => {});
  }
}

async function finish(code) {
  if (finishing) return;
  finishing = true;
  if (server) server.stop();
  else if (process.env.TEST_DATABASE_URL) await dropRunDatabases(process.env.TEST_DATABASE_URL);
  process.exit(code);
}

for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(sig, () => {
    if (child && child.exitCode === null) child.kill(sig);
    void finish(130);
  });
}
process.on('exit', () => server?.stop());

async function main() {
  let url = process.env.TEST_DATABASE_URL;
  if (!url) {
    server = await startThrowawayPostgres({ log: (m) => console.log(`[test:pg] ${m}`) });
    url = server.url;
  } else {
    console.log('[test:pg] using TEST_DATABASE_URL');
  }
  child = spawn(process.execPath, [path.join(path.dirname(require.resolve('vitest/package.json')), 'vitest.mjs'), 'run', ...files, ...args], {
    stdio: 'inherit',
    env: { ...process.env, TEST_DATABASE_URL: url, THAWLINE_TEST_DB_PREFIX: prefix },
  });
  const code = await new Promise((resolve) => child.on('exit', (c, sig) => resolve(c ?? (sig ? 1 : 0))));
  await finish(code);
}

main().catch((err) => {
  console.error('[test:pg]', err instanceof Error ? err.message : err);
  void finish(1);
});
