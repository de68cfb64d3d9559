import fs from 'node:fs';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import { z } from 'zod';
import { db } from '@/models';
import type { ShelterKind } from '@/models/Shelter';
import type { Role } from '@/lib/auth/permissions';
import { aircraftDefaultsFor, shelterDefaultsFor } from '@/lib/defaults';
import { seedPlanning } from './planning';
import { seedOilLog } from './oil';
import { seedAlerts } from './alerts';
import { seedOutcomes } from './outcomes';
import { writeTransaction } from '@/models/transaction';

// The invented demo scenario (data/demo/scenario.json) written into an empty database in one transaction.
const scenarioSchema = z.object({
  password: z.string().min(10),
  organizations: z.array(
    z.object({
      key: z.string(),
      name: z.string(),
      coldNightThresholdC: z.number(),
      coldNightNoticeAt: z.string(),
      users: z.array(z.object({ name: z.string(), email: z.string(), role: z.enum(['manager', 'operator', 'pilot']) })),
      airfields: z.array(
        z.object({
          key: z.string(),
          name: z.string(),
          ident: z.string(),
          latitude: z.number(),
          longitude: z.number(),
          elevationM: z.number(),
          timeZone: z.string(),
          shelters: z.array(
            z.object({
              key: z.string(),
              name: z.string(),
              kind: z.enum(['heated-hangar', 'unheated-hangar', 't-hangar', 'tie-down']),
              setpointC: z.number().optional(),
              heatingPowerW: z.number().optional(),
            }),
          ),
        }),
      ),
      aircraft: z.array(z.object({ registration: z.string(), typeLabel: z.string(), engineClass: z.string(), shelter: z.string(), cover: z.boolean() })),
    }),
  ),
});
export type DemoScenario = z.infer<typeof scenarioSchema>;

export function loadScenario(): DemoScenario {
  const file = path.join(process.cwd(), 'data', 'demo', 'scenario.json');
  return scenarioSchema.parse(JSON.parse(fs.readFileSync(file, 'utf8')));
}

/** What the seed wrote, by the scenario's keys (later features seed their rows from it). */
export interface SeedContext {
  scenario: DemoScenario;
  now: Date;
  orgIds: Record<string, number>;
  userIds: Record<string, number>;
  airfieldIds: Record<string, number>;
  shelterIds: Record<string, number>;
  aircraftIds: Record<string, number>;
  transaction: import('sequelize').Transaction;
}

export async function seedDemo(now = new Date()): Promise<string> {
  const scenario = loadScenario();
  const { Organization, User, Airfield, Shelter, Aircraft } = db();
  const passwordHash = await bcrypt.hash(scenario.password, 10);
  return writeTransaction(async (transaction) => {
    const ctx: SeedContext = { scenario, now, orgIds: {}, userIds: {}, airfieldIds: {}, shelterIds: {}, aircraftIds: {}, transaction };
    for (const o of scenario.organizations) {
      const org = await Organization.create({ name: o.name, coldNightThresholdC: o.coldNightThresholdC, coldNightNoticeAt: o.coldNightNoticeAt }, { transaction });
      ctx.orgIds[o.key] = org.id;
      for (const u of o.users) {
        const user = await User.create({ organizationId: org.id, name: u.name, email: u.email, role: u.role as Role, passwordHash }, { transaction });
        ctx.userIds[u.email] = user.id;
      }
      for (const a of o.airfields) {
        const af = await Airfield.create(
          { organizationId: org.id, name: a.name, ident: a.ident, latitude: a.latitude, longitude: a.longitude, elevationM: a.elevationM, timeZone: a.timeZone },
          { transaction },
        );
        ctx.airfieldIds[a.key] = af.id;
        for (const s of a.shelters) {
          const d = shelterDefaultsFor(s.kind as ShelterKind);
          const sh = await Shelter.create(
            {
              organizationId: org.id,
              airfieldId: af.id,
              name: s.name,
              kind: s.kind as ShelterKind,
              heatCapacityJPerK: d.heatCapacityJPerK,
              lossWPerK: d.lossWPerK,
              solarApertureM2: d.solarApertureM2,
              setpointC: s.setpointC ?? d.setpointC ?? null,
              heatingPowerW: s.heatingPowerW ?? d.heatingPowerW ?? null,
            },
            { transaction },
          );
          ctx.shelterIds[s.key] = sh.id;
        }
      }
      for (const ac of o.aircraft) {
        const d = aircraftDefaultsFor(ac.engineClass);
        const row = await Aircraft.create(
          {
            organizationId: org.id,
            shelterId: ctx.shelterIds[ac.shelter],
            registration: ac.registration,
            typeLabel: ac.typeLabel,
            engineClass: ac.engineClass,
            oilQuantityL: d.oilQuantityL,
            thermal: d.thermal,
            coverOnByDefault: ac.cover,
          },
          { transaction },
        );
        ctx.aircraftIds[ac.registration] = row.id;
      }
    }
    await seedPlanning(ctx);
    await seedOilLog(ctx);
    await seedAlerts(ctx);
    await seedOutcomes(ctx);
    const counts = scenario.organizations.map((o) => `${o.name}: ${o.users.length} users, ${o.airfields.length} airfields, ${o.aircraft.length} aircraft`);
    return counts.join('; ');
  });
}
