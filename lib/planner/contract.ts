// The plan contract on top of the planner: a validated request (lib/validation/plan.ts) in,
// JSON-ready output (ISO times, rounded numbers) out. Shared by `npm run plan` and POST /api/v1/plans.
import { toSoakModel } from '@/lib/thermal';
import type { PlanInput } from '@/lib/validation/plan';
import { planDeparture } from './hold';
import type { Baseline, PlanRequest, PlanResult } from './types';

const ms = (s: string) => Date.parse(s);
const iso = (t: number) => new Date(Math.round(t)).toISOString();
const r = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d;
const t4 = (v: number) => r(v, 4);
const e5 = (v: number) => r(v, 5);

/** A baseline as JSON: ISO times instead of epoch ms. */
export type BaselineJson = Omit<Baseline, 'fromMs' | 'toMs'> & { from: string; to: string };

export interface PlanJson {
  status: PlanResult['status'];
  mode: PlanResult['mode'];
  heaterOn: { from: string; to: string }[];
  switchOnAt?: string;
  latestSwitchOnAt?: string;
  oilAtDepartureC: number;
  predictedOilAtDepartureC: number;
  freeOilAtDepartureC: number;
  energyKWh: number;
  cost?: number;
  baselines: { allNight: BaselineJson; hoursBefore: BaselineJson[] };
  probabilityReady: number;
  uncertainty: PlanResult['uncertainty'];
  fix?: { readyAt: string | null; powerNeededW: number | null };
  floor?: {
    floorC: number;
    enforcedFrom: string;
    breachBeforeHeat?: { from: string; oilAtSwitchOnC: number };
    minOilC: number;
    minAt: string;
    met: boolean;
    dipRows: number;
  };
  optimality?: PlanResult['optimality'];
  /** The start window (with plan.holdMinutes > 0 or plan.engineReadyC). */
  hold?: { until: string; minOilC: number; minEngineC?: number; met: boolean; heaterOn: boolean };
  departure: string;
  readyC: number;
  targetC: number;
  earliestSwitchOn: string;
  slotMinutes: number;
}

/** The planner's request for a validated plan contract. */
export function toPlanRequest(input: PlanInput): PlanRequest {
  const p = input.plan;
  return {
    model: { ...toSoakModel(input), heaters: [] },
    departureMs: ms(p.departure),
    readyC: p.readyC,
    floorC: p.floorC,
    heater: p.heater,
    tariff: p.tariff?.map((t) => ({ fromMs: ms(t.from), toMs: ms(t.to), pricePerKWh: t.pricePerKWh })),
    flatPricePerKWh: p.flatPricePerKWh,
    slotMinutes: p.slotMinutes,
    switchOnStepMinutes: p.switchOnStepMinutes,
    earliestSwitchOnMs: p.earliestSwitchOn !== undefined ? ms(p.earliestSwitchOn) : undefined,
    mode: p.mode,
    nowMs: p.now !== undefined ? ms(p.now) : undefined,
    forecastIssuedAtMs: p.forecastIssuedAt !== undefined ? ms(p.forecastIssuedAt) : undefined,
    baselineHours: p.baselineHours,
    uncertainty: p.correlationHours !== undefined ? { correlationHours: p.correlationHours } : undefined,
    targetProbability: p.targetProbability,
    holdMinutes: p.holdMinutes,
    engineReadyC: p.engineReadyC,
  };
}

function baselineJson(b: Baseline): BaselineJson {
  return {
    rule: b.rule,
    ...(b.hours !== undefined ? { hours: b.hours } : {}),
    from: iso(b.fromMs),
    to: iso(b.toMs),
    clipped: b.clipped,
    energyKWh: e5(b.energyKWh),
    ...(b.cost !== undefined ? { cost: e5(b.cost) } : {}),
    oilAtDepartureC: t4(b.oilAtDepartureC),
    meetsReady: b.meetsReady,
    ...(b.meetsFloor !== undefined ? { meetsFloor: b.meetsFloor } : {}),
    saved: { energyKWh: e5(b.saved.energyKWh), ...(b.saved.cost !== undefined ? { cost: e5(b.saved.cost) } : {}) },
  };
}

/** The planner's result as the contract's JSON. */
export function toPlanJson(res: PlanResult): PlanJson {
  const u = res.uncertainty;
  return {
    status: res.status,
    mode: res.mode,
    heaterOn: res.heaterOn.map((i) => ({ from: iso(i.fromMs), to: iso(i.toMs) })),
    ...(res.switchOnAtMs !== undefined ? { switchOnAt: iso(res.switchOnAtMs) } : {}),
    ...(res.latestSwitchOnAtMs !== undefined ? { latestSwitchOnAt: iso(res.latestSwitchOnAtMs) } : {}),
    oilAtDepartureC: t4(res.oilAtDepartureC),
    predictedOilAtDepartureC: t4(res.predictedOilAtDepartureC),
    freeOilAtDepartureC: t4(res.freeOilAtDepartureC),
    energyKWh: e5(res.energyKWh),
    ...(res.cost !== undefined ? { cost: e5(res.cost) } : {}),
    baselines: { allNight: baselineJson(res.baselines.allNight), hoursBefore: res.baselines.hoursBefore.map(baselineJson) },
    probabilityReady: r(res.probabilityReady, 4),
    uncertainty: {
      ...u,
      leadHours: r(u.leadHours, 3),
      sigmaOutsideK: t4(u.sigmaOutsideK),
      sensitivityKPerK: t4(u.sensitivityKPerK),
      sigmaOilK: t4(u.sigmaOilK),
    },
    ...(res.fix ? { fix: { readyAt: res.fix.readyAtMs === null ? null : iso(res.fix.readyAtMs), powerNeededW: res.fix.powerNeededW } } : {}),
    ...(res.floor
      ? {
          floor: {
            floorC: res.floor.floorC,
            enforcedFrom: iso(res.floor.enforcedFromMs),
            ...(res.floor.breachBeforeHeat
              ? { breachBeforeHeat: { from: iso(res.floor.breachBeforeHeat.fromMs), oilAtSwitchOnC: t4(res.floor.breachBeforeHeat.oilAtSwitchOnC) } }
              : {}),
            minOilC: t4(res.floor.minOilC),
            minAt: iso(res.floor.minAtMs),
            met: res.floor.met,
            dipRows: res.floor.dipRows,
          },
        }
      : {}),
    ...(res.optimality ? { optimality: res.optimality } : {}),
    ...(res.hold
      ? {
          hold: {
            until: iso(res.hold.untilMs),
            minOilC: t4(res.hold.minOilC),
            ...(res.hold.minEngineC !== undefined ? { minEngineC: t4(res.hold.minEngineC) } : {}),
            met: res.hold.met,
            heaterOn: res.hold.heaterOn,
          },
        }
      : {}),
    departure: iso(res.departureMs),
    readyC: res.readyC,
    targetC: t4(res.targetC),
    earliestSwitchOn: iso(res.earliestSwitchOnMs),
    slotMinutes: res.slotMinutes,
  };
}

/** Plans a validated request and returns the contract's JSON. */
export function runPlan(input: PlanInput): PlanJson {
  return toPlanJson(planDeparture(toPlanRequest(input)));
}
