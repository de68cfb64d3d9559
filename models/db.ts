import path from 'node:path';
import fs from 'node:fs';
import { Sequelize } from 'sequelize';
import { env } from '@/lib/env';

// One Sequelize instance per process, cached on globalThis so hot reload in development does not
// open new connections. SQLite runs in WAL mode with a busy timeout; DATABASE_URL selects PostgreSQL
// (through the `pg` driver, with the pool settings of lib/env.ts).
/** How long an SQLite connection waits for another's write lock before it reports SQLITE_BUSY. */
export const SQLITE_BUSY_TIMEOUT_MS = 10_000;

const g = globalThis as unknown as { __thawlineSequelize?: Sequelize };

function create(): Sequelize {
  const e = env();
  const logging = e.DB_LOG ? (sql: string) => console.log(sql) : false;
  if (e.DATABASE_URL) {
    // Required here (not imported at the top) so that the embedded set-up never loads the driver; the
    // bundle keeps it external (serverExternalPackages in next.config.js).
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    const pg = require('pg');
    return new Sequelize(e.DATABASE_URL, {
      dialect: 'postgres',
      dialectModule: pg,
      logging,
      pool: { max: e.DB_POOL_MAX, min: e.DB_POOL_MIN, idle: e.DB_POOL_IDLE_MS, acquire: e.DB_POOL_ACQUIRE_MS },
      // Stored times are instants; the session speaks UTC so that nothing depends on the server's zone.
      timezone: '+00:00',
    });
  }
  const storage = path.resolve(/* turbopackIgnore: true */ process.cwd(), e.DATABASE_FILE);
  fs.mkdirSync(path.dirname(storage), { recursive: true });
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const sqlite3 = require('sqlite3');
  const s = new Sequelize({ dialect: 'sqlite', storage, dialectModule: sqlite3, logging });
  // Sequelize's SQLite connection manager opens a connection of its own for every transaction and
  // does not run the `afterConnect` hook, so the settings go on each connection as it is handed out:
  // a busy timeout (a writer waits for the lock instead of failing at once), WAL, foreign keys.
  type SqliteConnection = { run: (sql: string, cb: (err: Error | null) => void) => void; configure?: (option: 'busyTimeout', ms: number) => void };
  const cm = s.connectionManager as unknown as { getConnection: (o?: unknown) => Promise<SqliteConnection> };
  const getConnection = cm.getConnection.bind(cm);
  const ready = new WeakSet<object>();
  cm.getConnection = async (o?: unknown) => {
    const c = await getConnection(o);
    if (ready.has(c)) return c;
    ready.add(c);
    const run = (sql: string) => new Promise<void>((res, rej) => c.run(sql, (err) => (err ? rej(err) : res())));
    c.configure?.('busyTimeout', SQLITE_BUSY_TIMEOUT_MS);
    await run(`PRAGMA busy_timeout=${SQLITE_BUSY_TIMEOUT_MS}`);
    await run('PRAGMA journal_mode=WAL');
    await run('PRAGMA foreign_keys=ON');
    return c;
  };
  return s;
}

export function getSequelize(): Sequelize {
  if (!g.__thawlineSequelize) g.__thawlineSequelize = create();
  return g.__thawlineSequelize;
}

/** Close and forget the instance (tests, CLIs). */
export async function closeSequelize() {
  if (g.__thawlineSequelize) {
    await g.__thawlineSequelize.close();
    g.__thawlineSequelize = undefined;
  }
}
