// npm run db:reset — deletes the SQLite file, migrates and seeds the demo afresh.
import fs from 'node:fs';
import path from 'node:path';
import { env } from '@/lib/env';
import { migrate, closeSequelize } from '@/models';
import { seedDemo } from '@/lib/seed/demo';

async function main() {
  const e = env();
  if (e.DATABASE_URL) throw new Error('db:reset only removes the embedded SQLite file; drop the external database by hand.');
  const file = path.resolve(process.cwd(), e.DATABASE_FILE);
  for (const f of [file, `${file}-wal`, `${file}-shm`]) fs.rmSync(f, { force: true });
  await migrate();
  console.log(`Reset and seeded: ${await seedDemo()}`);
  await closeSequelize();
}
main().catch((err) => {
  console.error('Reset failed:', err instanceof Error ? err.message : err);
  process.exit(1);
});
