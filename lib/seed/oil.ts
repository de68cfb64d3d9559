// A season of the demo's Oil log (invented): for every aircraft of the first organization, morning oil
// checks on flying days from mid-September until yesterday, top-ups, oil changes and each aircraft's
// oil-change interval. Deterministic: a seeded generator, dates counted back from the seed's `now`.
import type { CreationAttributes } from 'sequelize';
import { db } from '@/models';
import type { OilCheck as OilCheckRow } from '@/models/OilCheck';
import type { OilChange as OilChangeRow } from '@/models/OilChange';
import { rng } from '@/lib/fit/synthetic';
import { addDays, localDateOf, zonedTimeToUtc } from '@/lib/time';
import { OIL_BETA_PER_K } from '@/lib/thermal/oil';
import { ENGINE_CLASSES, type EngineClassId } from '@/lib/thermal/presets';
import type { SeedContext } from './demo';

const SEASON_DAYS = 75;

/** Invented per-aircraft story: starting engine hours, how much more oil than usual it uses, a mid-season change. */
const STORY: Record<string, { hours: number; rateFactor: number; midChange?: number; grade: string }> = {
  'Q-KAPA': { hours: 412.3, rateFactor: 0.9, grade: 'SAE 10W-40 (semi-synthetic)' },
  'Q-LUMI': { hours: 1288.6, rateFactor: 1.1, midChange: 40, grade: 'SAE 10W-40 (semi-synthetic)' },
  'Q-SIPI': { hours: 655.0, rateFactor: 0.8, grade: 'SAE 10W-40 (semi-synthetic)' },
  'Q-ROUTA': { hours: 2140.2, rateFactor: 1.0, midChange: 45, grade: 'SAE 15W-50' },
  'Q-TAIMI': { hours: 1733.9, rateFactor: 2.6, grade: 'SAE 15W-50' },
  'Q-HALLA': { hours: 987.4, rateFactor: 0.9, midChange: 22, grade: 'SAE 20W-50' },
  'Q-KUURA': { hours: 3012.8, rateFactor: 1.2, midChange: 30, grade: 'SAE 15W-50' },
  'Q-VIIMA': { hours: 1502.1, rateFactor: 1.0, midChange: 50, grade: 'SAE 20W-50' },
};

export async function seedOilLog(ctx: SeedContext) {
  const { Aircraft, OilCheck, OilChange } = db();
  const org = ctx.scenario.organizations[0];
  const orgId = ctx.orgIds[org.key];
  const writers = org.users.filter((u) => u.role !== 'manager').map((u) => ctx.userIds[u.email]);
  const zoneOfShelter = new Map<string, string>();
  for (const a of org.airfields) for (const s of a.shelters) zoneOfShelter.set(s.key, a.timeZone);
  const r = rng(7_2026);
  const checks: CreationAttributes<OilCheckRow>[] = [];
  const changes: CreationAttributes<OilChangeRow>[] = [];

  for (const [k, ac] of org.aircraft.entries()) {
    const story = STORY[ac.registration] ?? { hours: 500 + 100 * k, rateFactor: 1, grade: 'SAE 15W-50' };
    const aircraftId = ctx.aircraftIds[ac.registration];
    const zone = zoneOfShelter.get(ac.shelter) ?? 'UTC';
    const preset = ENGINE_CLASSES[ac.engineClass as EngineClassId];
    if (!aircraftId || !preset) continue;
    const drySump = ac.engineClass.includes('drysump');
    const full = preset.oilL;
    const rate = preset.oilConsumptionLPerH * story.rateFactor;
    const topUpAt = drySump ? full - 0.35 : full - 1.1;
    const topUp = drySump ? 0.3 : 0.95;
    const today = localDateOf(zone, ctx.now.getTime());
    const at = (daysBack: number, hour: number, minute: number) => {
      const d = addDays(today, -daysBack);
      return new Date(zonedTimeToUtc(zone, d.year, d.month, d.day, hour, minute));
    };
    await Aircraft.update(
      drySump ? { oilChangeIntervalHours: 100, oilChangeIntervalMonths: 12 } : { oilChangeIntervalHours: 50, oilChangeIntervalMonths: 4 },
      { where: { id: aircraftId }, transaction: ctx.transaction },
    );

    let hours = story.hours;
    let level15 = full;
    let lastChangeHours = hours;
    const change = (daysBack: number) => {
      changes.push({
        organizationId: orgId,
        aircraftId,
        userId: writers[(k + daysBack) % writers.length],
        changedAt: at(daysBack, 16, 30),
        engineHours: Math.round(hours * 10) / 10,
        oilGrade: story.grade,
        quantityL: full,
        notes: daysBack === SEASON_DAYS ? 'Winter oil in; filter changed.' : 'Oil and filter changed.',
      });
      level15 = full;
      lastChangeHours = hours;
    };
    change(SEASON_DAYS);
    for (let daysBack = SEASON_DAYS - 1; daysBack >= 1; daysBack--) {
      if (story.midChange === daysBack) change(daysBack);
      const flies = r.uniform() < (daysBack < 20 ? 0.35 : 0.5);
      if (!flies) continue;
      // Outside at the morning check: from about +8 °C in mid-September towards −14 °C now.
      const season = (SEASON_DAYS - daysBack) / SEASON_DAYS;
      const outside = 8 - 22 * season + 4 * r.normal();
      // Mostly cold checks; now and then one taken after an earlier flight, with the oil still warm.
      const warm = r.uniform() < 0.1;
      const oilTemp = warm ? 35 + 40 * r.uniform() : outside + 1.5 * r.uniform();
      const read = level15 * Math.exp(OIL_BETA_PER_K * (oilTemp - 15)) + (drySump ? 0.02 : 0.05) * r.normal();
      const added = level15 < topUpAt ? topUp : 0;
      const age = hours - lastChangeHours;
      const blades = drySump ? Math.max(1, Math.round(3 + 0.28 * Math.max(0, -outside) + 0.04 * age + 1.2 * r.normal())) : null;
      const minute = Math.floor(r.uniform() * 50);
      checks.push({
        organizationId: orgId,
        aircraftId,
        userId: writers[(k + daysBack) % writers.length],
        checkedAt: at(daysBack, warm ? 13 : 7 + Math.floor(r.uniform() * 2), minute),
        levelL: Math.round(read * 100) / 100,
        oilTempC: Math.round(oilTemp * 10) / 10,
        outsideTempC: Math.round(outside * 10) / 10,
        bladesTurned: blades,
        engineHours: Math.round(hours * 10) / 10,
        addedL: added,
        notes: added ? `Topped up ${added} L.` : warm ? 'Checked after the morning flight, oil still warm.' : '',
      });
      level15 += added;
      const flown = 0.8 + 1.7 * r.uniform();
      hours += flown;
      level15 -= rate * flown;
    }
  }
  await OilChange.bulkCreate(changes, { transaction: ctx.transaction });
  await OilCheck.bulkCreate(checks, { transaction: ctx.transaction });
  return { checks: checks.length, changes: changes.length };
}
