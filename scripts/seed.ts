// npm run db:seed — migrates, then adds the demo scenario if the database is empty (never duplicates it).
// npm run db:seed -- --fleet N [--org ID] — also adds N invented aircraft with heaters and tomorrow
// morning's departures to an organization (default: the first), for load tests and the benchmarks.
import { z } from 'zod';
import { migrate, closeSequelize, db } from '@/models';
import { seedDemo } from '@/lib/seed/demo';
import { FLEET_MAX, seedFleet } from '@/lib/seed/fleet';

const argsSchema = z.strictObject({
  fleet: z.coerce.number().int().min(1).max(FLEET_MAX).optional(),
  org: z.coerce.number().int().positive().optional(),
});

function parseArgs(argv: string[]) {
  const raw: Record<string, string> = {};
  for (let i = 0; i < argv.length; i++) {
    const m = /^--([a-z]+)(?:=(.*))?$/.exec(argv[i]);
    if (!m) throw new Error(`unexpected argument ${argv[i]} (use --fleet N [--org ID])`);
    raw[m[1]] = m[2] ?? argv[++i] ?? '';
  }
  const parsed = argsSchema.safeParse(raw);
  if (!parsed.success) throw new Error(parsed.error.issues.map((i) => `--${i.path.join('.') || '?'}: ${i.message}`).join('; '));
  return parsed.data;
}

async function main() {
  const args = parseArgs(process.argv.slice(2));
  await migrate();
  const { Organization } = db();
  if ((await Organization.count()) > 0) {
    if (!args.fleet) console.log('The database already has data; use npm run db:reset to start over with the demo.');
  } else {
    console.log(`Seeded: ${await seedDemo()}`);
  }
  if (args.fleet) {
    const f = await seedFleet({ count: args.fleet, orgId: args.org });
    console.log(
      `Fleet: ${f.added} aircraft (${f.first} … ${f.last}) in organization ${f.organizationId}, over ${f.airfields} airfields and ${f.shelters} shelters; ${f.departures} departures tomorrow morning`,
    );
  }
  await closeSequelize();
}
main().catch((err) => {
  console.error('Seeding failed:', err instanceof Error ? err.message : err);
  process.exit(1);
});
