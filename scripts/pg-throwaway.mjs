// A throwaway PostgreSQL server for tests and benchmarks: initdb into a fresh temporary folder, start on a
// free 127.0.0.1 port with trust authentication for one local user, and on stop() shut it down and remove
// the folder. Uses the Debian `postgresql` package's binaries (PG_BIN, else the newest
// /usr/lib/postgresql/<n>/bin, else pg_ctl on PATH). initdb refuses to run as root, so as root the
// server runs as the `postgres` system user (runuser), in a folder that user owns.
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

export function findPgBin() {
  const candidates = [];
  if (process.env.PG_BIN) candidates.push(process.env.PG_BIN);
  const base = '/usr/lib/postgresql';
  if (fs.existsSync(base)) {
    const versions = fs
      .readdirSync(base)
      .filter((v) => /^\d+$/.test(v))
      .sort((a, b) => Number(b) - Number(a));
    for (const v of versions) candidates.push(path.join(base, v, 'bin'));
  }
  for (const dir of candidates) if (fs.existsSync(path.join(dir, 'initdb'))) return dir;
  const which = spawnSync('sh', ['-c', 'command -v pg_ctl'], { encoding: 'utf8' });
  if (which.status === 0 && which.stdout.trim()) return path.dirname(which.stdout.trim());
  return null;
}

export function freePort() {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.unref();
    s.on('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address();
      s.close(() => resolve(port));
    });
  });
}

function runAs(user, bin, args, opts = {}) {
  const [cmd, argv] = user ? ['runuser', ['-u', user, '--', bin, ...args]] : [bin, args];
  return execFileSync(cmd, argv, { stdio: ['ignore', 'pipe', 'pipe'], encoding: 'utf8', ...opts });
}

/**
 * Starts a server; resolves to { url, adminUrl, port, dir, stop() }. `url` names the `thawline` database
 * (created empty); `adminUrl` the `postgres` maintenance database (for CREATE/DROP DATABASE).
 */
export async function startThrowawayPostgres({ log = () => {} } = {}) {
  const bin = findPgBin();
  if (!bin) throw new Error('PostgreSQL binaries not found: install the Debian package `postgresql` or set PG_BIN');
  const asRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  const user = asRoot ? 'postgres' : null;
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'thawline-pg-'));
  const data = path.join(dir, 'data');
  if (asRoot) {
    const uid = Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim());
    const gid = Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim());
    fs.chownSync(dir, uid, gid);
  }
  let started = false;
  let stopped = false;
  const stop = () => {
    if (stopped) return;
    stopped = true;
    if (started) {
      try {
        runAs(user, path.join(bin, 'pg_ctl'), ['-D', data, '-m', 'immediate', '-w', 'stop']);
      } catch {
        // already gone
      }
    }
    fs.rmSync(dir, { recursive: true, force: true });
  };
  try {
    runAs(user, path.join(bin, 'initdb'), ['-D', data, '-U', 'thawline', '--auth=trust', '-E', 'UTF8', '--locale=C', '--no-instructions']);
    const port = await freePort();
    // Durability off: the server lives for one run. Sockets in the run's own folder, TCP on loopback only.
    const opts = [
      `-p ${port}`,
      `-k ${dir}`,
      "-c listen_addresses='127.0.0.1'",
      '-c fsync=off',
      '-c synchronous_commit=off',
      '-c full_page_writes=off',
      '-c max_connections=200',
    ].join(' ');
    runAs(user, path.join(bin, 'pg_ctl'), ['-D', data, '-o', opts, '-l', path.join(dir, 'server.log'), '-w', '-t', '60', 'start']);
    started = true;
    runAs(user, path.join(bin, 'createdb'), ['-h', '127.0.0.1', '-p', String(port), '-U', 'thawline', 'thawline']);
    const url = `postgres://thawline@127.0.0.1:${port}/thawline`;
    log(`throwaway PostgreSQL (${path.basename(path.dirname(bin))}) on 127.0.0.1:${port}, data in ${dir}`);
    return { url, adminUrl: `postgres://thawline@127.0.0.1:${port}/postgres`, port, dir, stop };
  } catch (err) {
    const logFile = path.join(dir, 'server.log');
    const tail = fs.existsSync(logFile) ? fs.readFileSync(logFile, 'utf8').split('\n').slice(-15).join('\n') : '';
    stop();
    const detail = err && typeof err === 'object' && 'stderr' in err ? String(err.stderr) : String(err);
    throw new Error(`could not start a throwaway PostgreSQL: ${detail}${tail ? `\n${tail}` : ''}`);
  }
}

/** Stops the server on exit, Ctrl-C and termination as well as on a normal end. */
export function stopOnExit(server) {
  const stop = () => server.stop();
  process.once('exit', stop);
  for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
    process.once(sig, () => {
      stop();
      process.exit(128 + (os.constants.signals[sig] ?? 1));
    });
  }
}
