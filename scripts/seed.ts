// npm run db:seed — migrates, then adds the demo scenario if the database is empty (never duplicates it).
import { migrate, closeSequelize, db } from '@/models';
import { seedDemo } from '@/lib/seed/demo';

async function main() {
  await migrate();
  const { Organization } = db();
  if ((await Organization.count()) > 0) {
    console.log('The database already has data; use npm run db:reset to start over with the demo.');
  } else {
    console.log(`Seeded: ${await seedDemo()}`);
  }
  await closeSequelize();
}
main().catch((err) => {
  console.error('Seeding failed:', err instanceof Error ? err.message : err);
  process.exit(1);
});
