// Run by npm start and npm run dev: migrate, then seed the demo when the database has no organization yet.
import { applyMigrations, closeSequelize, db, withStartupLock } from '@/models';
import fs from 'node:fs';
import { seedDemo } from '@/lib/seed/demo';
import { env, SECRET_FILE } from '@/lib/env';

async function main() {
  // Parse the environment first (a bad variable stops here, named); without NEXTAUTH_SECRET this writes
  // the generated secret that the server started next will read.
  const hadSecretFile = fs.existsSync(SECRET_FILE);
  env();
  if (!process.env.NEXTAUTH_SECRET && !hadSecretFile) console.log(`[thawline] NEXTAUTH_SECRET not set: generated a random one in ${SECRET_FILE}`);
  // Several instances starting together on one PostgreSQL take turns, so one migrates and seeds.
  await withStartupLock(async () => {
    const applied = await applyMigrations();
    if (applied.length) console.log(`[thawline] migrations applied: ${applied.join(', ')}`);
    const { Organization } = db();
    if ((await Organization.count()) === 0) {
      const summary = await seedDemo();
      console.log(`[thawline] demo data seeded: ${summary}`);
    }
  });
  await closeSequelize();
}

main().catch((err) => {
  console.error('[thawline] database preparation failed:', err instanceof Error ? err.message : err);
  process.exit(1);
});
