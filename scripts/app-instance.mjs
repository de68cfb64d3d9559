// Starting built app instances for the scale-out test and the HTTP bench: prepare a database, run
// `next start` on a free port with a given environment, wait on /api/health, sign in over HTTP
// (next-auth's credentials flow), stop. Plain Node: no test framework, no browser.
import { execFileSync, spawn } from 'node:child_process';
import path from 'node:path';
import { freePort } from './pg-throwaway.mjs';

const root = path.resolve(import.meta.dirname, '..');
const nextBin = path.join(root, 'node_modules', 'next', 'dist', 'bin', 'next');
const tsx = path.join(root, 'node_modules', '.bin', 'tsx');

/** Migrates and seeds the demo when empty (scripts/prepare-db.ts); `fleet` adds that many invented aircraft. */
export function prepareDatabase(env, { fleet = 0 } = {}) {
  execFileSync(tsx, ['scripts/prepare-db.ts'], { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] });
  if (fleet > 0) execFileSync(tsx, ['scripts/seed.ts', '--fleet', String(fleet)], { cwd: root, env, stdio: ['ignore', 'inherit', 'inherit'] });
}

/** Builds the app when the sources are newer than the build (scripts/build-if-needed.mjs). */
export function buildIfNeeded(env = process.env) {
  execFileSync(process.execPath, ['scripts/build-if-needed.mjs'], { cwd: root, env, stdio: 'inherit' });
}

/** Starts one instance; resolves once /api/health answers 200. */
export async function startInstance(env, { name = 'app', timeoutMs = 120_000 } = {}) {
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const child = spawn(process.execPath, [nextBin, 'start', '-p', String(port), '-H', '127.0.0.1'], {
    cwd: root,
    env: { NEXTAUTH_URL: base, ...env, PORT: String(port), NODE_ENV: 'production' },
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  });
  let log = '';
  child.stdout.on('data', (d) => (log += d));
  child.stderr.on('data', (d) => (log += d));
  const instance = {
    name,
    port,
    base,
    log: () => log,
    async health() {
      const r = await fetch(`${base}/api/health`);
      return { status: r.status, body: await r.json() };
    },
    async stop() {
      if (child.exitCode !== null) return;
      const exited = new Promise((r) => child.once('exit', r));
      try {
        process.kill(-child.pid, 'SIGTERM');
      } catch {
        return;
      }
      await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
      try {
        process.kill(-child.pid, 'SIGKILL');
      } catch {}
    },
  };
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (child.exitCode !== null) break;
    const ok = await fetch(`${base}/api/health`).then((r) => r.ok, () => false);
    if (ok) return instance;
    await new Promise((r) => setTimeout(r, 300));
  }
  await instance.stop();
  throw new Error(`${name} did not become healthy on ${base}:\n${log.slice(-3000)}`);
}

function cookiesOf(res) {
  return (res.headers.getSetCookie?.() ?? []).map((c) => c.split(';')[0]);
}

/**
 * Signs in with e-mail and password; resolves to { ok, cookie, error } where `cookie` is the Cookie
 * header for later requests and `error` next-auth's error code (e.g. CredentialsSignin, TooManyAttempts:N).
 */
export async function signIn(base, email, password) {
  const c = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = await c.json();
  const jar = cookiesOf(c);
  const r = await fetch(`${base}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: jar.join('; ') },
    body: new URLSearchParams({ csrfToken, email, password, json: 'true', callbackUrl: `${base}/board` }),
  });
  const all = [...jar, ...cookiesOf(r)];
  const session = all.find((x) => /session-token=/.test(x));
  const location = r.headers.get('location') ?? (await r.json().catch(() => ({}))).url ?? '';
  const error = new URL(location || base, base).searchParams.get('error');
  return { ok: !!session && !error, cookie: all.join('; '), error };
}
