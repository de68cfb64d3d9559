// npm run db:migrate — applies pending migrations; a second run applies nothing.
import { migrate, closeSequelize } from '@/models';

migrate()
  .then(async (names) => {
    console.log(names.length ? `Applied: ${names.join(', ')}` : 'Database is up to date.');
    await closeSequelize();
  })
  .catch((err) => {
    console.error('Migration failed:', err instanceof Error ? err.message : err);
    process.exit(1);
  });
