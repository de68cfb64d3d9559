import path from 'node:path';
import fs from 'node:fs';
import { Sequelize } from 'sequelize';
import { env } from '@/lib/env';

// One Sequelize instance per process, cached on globalThis so hot reload in development does not
// open new connections. SQLite runs in WAL mode with a busy timeout; another dialect comes from DATABASE_URL.
const g = globalThis as unknown as { __thawlineSequelize?: Sequelize };

function create(): Sequelize {
  const e = env();
  const logging = e.DB_LOG ? (sql: string) => console.log(sql) : false;
  if (e.DATABASE_URL) {
    return new Sequelize(e.DATABASE_URL, { logging });
  }
  const storage = path.resolve(/* turbopackIgnore: true */ process.cwd(), e.DATABASE_FILE);
  fs.mkdirSync(path.dirname(storage), { recursive: true });
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const sqlite3 = require('sqlite3');
  const s = new Sequelize({ dialect: 'sqlite', storage, dialectModule: sqlite3, logging });
  s.addHook('afterConnect', async (connection: unknown) => {
    const db = connection as { run: (sql: string, cb: (err: Error | null) => void) => void };
    const run = (sql: string) => new Promise<void>((res, rej) => db.run(sql, (err) => (err ? rej(err) : res())));
    await run('PRAGMA journal_mode=WAL');
    await run('PRAGMA busy_timeout=5000');
    await run('PRAGMA foreign_keys=ON');
  });
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
