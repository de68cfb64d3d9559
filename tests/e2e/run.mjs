// npm run test:e2e — builds if needed, starts the built app on a free port with a fresh seeded database and
// the local fakes, waits on /api/health, runs the browser tests (node:test + playwright-core driving Debian's
// chromium), then stops the server.
import { spawn, execSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

const root = process.cwd();
// `npm run test:e2e -- calibration map` runs only the files whose names contain one of the words.
const only = process.argv.slice(2);
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'thawline-e2e-'));
const port = await new Promise((res) => {
  const srv = net.createServer();
  srv.listen(0, '127.0.0.1', () => {
    const p = srv.address().port;
    srv.close(() => res(p));
  });
});
const base = `http://127.0.0.1:${port}`;
const env = {
  ...process.env,
  DATABASE_FILE: path.join(dir, 'e2e.sqlite'),
  PORT: String(port),
  NEXTAUTH_URL: base,
  SMTP_CAPTURE_PORT: '0',
  NODE_ENV: 'production',
};

execSync('npx tsx scripts/prepare-db.ts', { stdio: 'inherit', env });
execSync('node scripts/build-if-needed.mjs', { stdio: 'inherit', env });

const server = spawn('npx', ['next', 'start', '-p', String(port), '-H', '127.0.0.1'], { env, stdio: ['ignore', 'pipe', 'pipe'], detached: true });
let log = '';
server.stdout.on('data', (d) => (log += d));
server.stderr.on('data', (d) => (log += d));

async function waitHealthy() {
  for (let i = 0; i < 120; i++) {
    try {
      const r = await fetch(`${base}/api/health`);
      if (r.ok) return;
    } catch {}
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`server did not become healthy:\n${log.slice(-3000)}`);
}

let code = 1;
try {
  await waitHealthy();
  const files = fs.readdirSync(path.join(root, 'tests/e2e')).filter((f) => f.endsWith('.test.mjs')).filter((f) => !only.length || only.some((o) => f.includes(o))).map((f) => path.join('tests/e2e', f));
  const t = spawn(process.execPath, ['--test', '--test-concurrency=1', ...files], { env: { ...env, E2E_BASE_URL: base }, stdio: 'inherit' });
  code = await new Promise((res) => t.on('exit', (c) => res(c ?? 1)));
} catch (e) {
  console.error(e.message);
} finally {
  try {
    process.kill(-server.pid, 'SIGTERM');
  } catch {}
  if (code !== 0) console.error(`--- server log (tail) ---\n${log.slice(-4000)}`);
}
process.exit(code);
