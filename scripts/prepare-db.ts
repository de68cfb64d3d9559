// Run by npm start and npm run dev: migrate, then seed the demo when the database has no organization yet.
import { migrate, closeSequelize, db } from '@/models';
import { seedDemo } from '@/lib/seed/demo';

async function main() {
  const applied = await migrate();
  if (applied.length) console.log(`[thawline] migrations applied: ${applied.join(', ')}`);
  const { Organization } = db();
  if ((await Organization.count()) === 0) {
    const summary = await seedDemo();
    console.log(`[thawline] demo data seeded: ${summary}`);
  }
  await closeSequelize();
}

main().catch((err) => {
  console.error('[thawline] database preparation failed:', err instanceof Error ? err.message : err);
  process.exit(1);
});
