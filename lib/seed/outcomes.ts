// A season of the demo's Morning outcomes (invented): for every aircraft of the first organization,
// past departures over the last eight weeks with what their plans predicted, the oil temperature the
// pilot recorded at start (some mornings "not flown"), and the energy against the usual all-night rule.
// Plus the last morning's departures of a few aircraft, not yet recorded (the "Oil at start" cards).
// Every number here belongs to the demo. Deterministic: a seeded generator, dates counted back from
// the seed's `now`.
import type { CreationAttributes } from 'sequelize';
import { db } from '@/models';
import type { Departure as DepartureRow } from '@/models/Departure';
import type { DepartureOutcome as OutcomeRow } from '@/models/DepartureOutcome';
import { rng } from '@/lib/fit/synthetic';
import { addDays, localDateOf, zonedTimeToUtc } from '@/lib/time';
import { ENGINE_CLASSES, type EngineClassId } from '@/lib/thermal/presets';
import type { SeedContext } from './demo';

const SEASON_DAYS = 56;
/** The σ the plans stated (forecast error only) when these mornings were planned. Invented for the demo. */
const STATED_SIGMA_K = 1.3;

/** Invented per-aircraft story: the model's true bias and spread at start (K), heater power (W), how often it flies. */
const STORY: Record<string, { bias: number; sigma: number; heaterW: number; flies: number }> = {
  'Q-KAPA': { bias: 0.8, sigma: 1.6, heaterW: 300, flies: 0.45 },
  'Q-LUMI': { bias: -2.4, sigma: 2.6, heaterW: 300, flies: 0.4 },
  'Q-SIPI': { bias: -3.8, sigma: 3.4, heaterW: 100, flies: 0.3 },
  'Q-ROUTA': { bias: 0.4, sigma: 1.2, heaterW: 400, flies: 0.5 },
  'Q-TAIMI': { bias: -1.2, sigma: 2.1, heaterW: 400, flies: 0.45 },
  'Q-HALLA': { bias: 1.8, sigma: 3.0, heaterW: 0, flies: 0.25 },
  'Q-KUURA': { bias: 1.4, sigma: 1.9, heaterW: 600, flies: 0.4 },
  'Q-VIIMA': { bias: -0.6, sigma: 1.7, heaterW: 600, flies: 0.35 },
};

/** The last morning's departures left to record (registration, pilot, local time). */
const LAST_MORNING: { reg: string; pilot: string; at: [number, number]; recorded?: number }[] = [
  { reg: 'Q-TAIMI', pilot: 'pilot@frostvale.test', at: [7, 30] },
  { reg: 'Q-KUURA', pilot: 'pilot@frostvale.test', at: [8, 15], recorded: 17 },
  { reg: 'Q-ROUTA', pilot: 'pilot2@frostvale.test', at: [7, 45] },
];

/** Standard normal CDF (Abramowitz–Stegun 7.1.26 on erf); for inventing stated chances only. */
function phi(z: number): number {
  const x = Math.abs(z) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * x);
  const erf = 1 - ((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496736) * t + 0.254829592) * t * Math.exp(-x * x);
  return z >= 0 ? 0.5 * (1 + erf) : 0.5 * (1 - erf);
}

const r1 = (v: number) => Math.round(v * 10) / 10;
const r2 = (v: number) => Math.round(v * 100) / 100;

export async function seedOutcomes(ctx: SeedContext) {
  const { Departure, DepartureOutcome, HeatPlan, AircraftPilot } = db();
  const { transaction } = ctx;
  const org = ctx.scenario.organizations[0];
  const orgId = ctx.orgIds[org.key];
  const zoneOfShelter = new Map<string, string>();
  for (const a of org.airfields) for (const s of a.shelters) zoneOfShelter.set(s.key, a.timeZone);
  const links = await AircraftPilot.findAll({ transaction });
  const pilotsOf = (aircraftId: number) => links.filter((l) => l.aircraftId === aircraftId).map((l) => l.userId);
  const r = rng(11_2026);
  const nowMs = ctx.now.getTime();

  type Planned = { dep: CreationAttributes<DepartureRow>; outcome: Omit<CreationAttributes<OutcomeRow>, 'departureId'> | null; plan?: { oilC: number; p: number | null; kWh: number } };
  const planned: Planned[] = [];

  for (const ac of org.aircraft) {
    const aircraftId = ctx.aircraftIds[ac.registration];
    const preset = ENGINE_CLASSES[ac.engineClass as EngineClassId];
    const story = STORY[ac.registration];
    const pilots = pilotsOf(aircraftId);
    if (!aircraftId || !preset || !story || !pilots.length) continue;
    const zone = zoneOfShelter.get(ac.shelter) ?? 'UTC';
    const today = localDateOf(zone, nowMs);
    for (let back = SEASON_DAYS; back >= 2; back--) {
      if (r.uniform() > story.flies) continue;
      const day = addDays(today, -back);
      const minutes = 7 * 60 + Math.floor(r.uniform() * 12) * 15; // 07:00 … 09:45
      const departAt = new Date(zonedTimeToUtc(zone, day.year, day.month, day.day, Math.floor(minutes / 60), minutes % 60));
      const pilotId = pilots[Math.floor(r.uniform() * pilots.length)];
      const readyC = preset.readyC;
      const heated = story.heaterW > 0;
      // A heated plan aims a margin above the ready temperature and states its chance from the forecast's σ alone.
      const margin = heated ? r.uniform() * 3.2 - 0.2 : 0;
      const predicted = heated ? readyC + margin : -6 + 10 * r.uniform();
      const chance = heated ? Math.min(0.995, phi(margin / STATED_SIGMA_K)) : null;
      const hours = heated ? 3 + 4 * r.uniform() : 0;
      const flown = r.uniform() > 0.12;
      const recorded = predicted + story.bias + story.sigma * r.normal();
      planned.push({
        dep: { organizationId: orgId, aircraftId, pilotId, bookedById: pilotId, departAt, readyC, notes: '' },
        outcome: {
          organizationId: orgId,
          aircraftId,
          flown,
          oilAtStartC: flown ? r1(recorded) : null,
          recordedById: pilotId,
          recordedAt: new Date(departAt.getTime() + (10 + Math.floor(r.uniform() * 40)) * 60_000),
          predictedOilC: r1(predicted),
          probabilityReady: chance === null ? null : r2(chance),
          readyC,
          energyKWh: heated ? r2((story.heaterW * hours) / 1000) : 0,
          usualEnergyKWh: heated ? r2((story.heaterW * (11 + 2 * r.uniform())) / 1000) : null,
          planStatus: heated ? 'warming' : 'unplanned',
          thermalSource: 'preset',
          notes: '',
        },
      });
    }
  }

  // The last morning: departed at least seven hours ago and within the day and a half the cards show.
  for (const m of LAST_MORNING) {
    const ac = org.aircraft.find((a) => a.registration === m.reg);
    const aircraftId = ctx.aircraftIds[m.reg];
    const pilotId = ctx.userIds[m.pilot];
    if (!ac || !aircraftId || !pilotId) continue;
    const zone = zoneOfShelter.get(ac.shelter) ?? 'UTC';
    const preset = ENGINE_CLASSES[ac.engineClass as EngineClassId];
    let day = localDateOf(zone, nowMs);
    let at = zonedTimeToUtc(zone, day.year, day.month, day.day, m.at[0], m.at[1]);
    if (at > nowMs - 7 * 3_600_000) {
      day = addDays(day, -1);
      at = zonedTimeToUtc(zone, day.year, day.month, day.day, m.at[0], m.at[1]);
    }
    const story = STORY[m.reg];
    const oilC = preset.readyC + 1.6;
    const kWh = r2((story.heaterW * 4.5) / 1000);
    planned.push({
      dep: { organizationId: orgId, aircraftId, pilotId, bookedById: pilotId, departAt: new Date(at), readyC: preset.readyC, notes: '' },
      plan: { oilC, p: 0.89, kWh },
      outcome:
        m.recorded === undefined
          ? null
          : {
              organizationId: orgId,
              aircraftId,
              flown: true,
              oilAtStartC: m.recorded,
              recordedById: pilotId,
              recordedAt: new Date(at + 20 * 60_000),
              predictedOilC: oilC,
              probabilityReady: 0.89,
              readyC: preset.readyC,
              energyKWh: kWh,
              usualEnergyKWh: r2((story.heaterW * 12) / 1000),
              planStatus: 'warming',
              thermalSource: 'preset',
              notes: '',
            },
    });
  }

  const deps = await Departure.bulkCreate(
    planned.map((p) => p.dep),
    { transaction, returning: true },
  );
  const outcomes: CreationAttributes<OutcomeRow>[] = [];
  for (const [i, p] of planned.entries()) {
    const departureId = deps[i].id;
    if (p.outcome) outcomes.push({ ...p.outcome, departureId });
    if (p.plan) {
      // What the plan said for that morning (read by the card's prefill; never recomputed for a past departure).
      await HeatPlan.create(
        {
          organizationId: orgId,
          departureId,
          inputsKey: 'demo-past-morning',
          computedAt: new Date(p.dep.departAt.getTime() - 14 * 3_600_000),
          status: 'warming',
          switchOnAt: new Date(p.dep.departAt.getTime() - 4.5 * 3_600_000),
          oilAtDepartureC: p.plan.oilC,
          energyKWh: p.plan.kWh,
          cost: null,
          probabilityReady: p.plan.p,
          result: { status: 'warming', result: null, freeOilC: null },
        },
        { transaction },
      );
    }
  }
  await DepartureOutcome.bulkCreate(outcomes, { transaction });
}
