// The start window on top of the planner: a departure is ready when the oil (and, where the model
// has an engine-mass node and an engine threshold is given, the engine mass) is at or above its
// threshold at every instant from departure through the hold, with the heater kept on through the
// hold ("leave on until just before start; unplug before start").
//
// How: the hold's heat is a fixed part of the run (the heater on over [departure, departure + hold]);
// the departure-instant planner (plan.ts) then plans the heat before departure for a target raised
// until the re-simulated window holds. The window's lowest value grows with the target (every slot's
// response is ≥ 0), so a safeguarded secant on the raise converges in a few rounds. The schedule is
// the least-cost one for its raised departure target; it is feasible for the window by re-simulation,
// not proven least-cost over the window (the docs say so: docs/soak-model.md).
import { simulate, type SoakModel } from '@/lib/thermal';
import { oilMinimumBetween, withHeater } from './model';
import { CHECK_TOL_K, planAtDeparture } from './plan';
import { probabilityReady } from './probability';
import { kWhOf, mergeIntervals, pricingOf } from './slots';
import { PlanInputError, type Interval, type PlanRequest, type PlanResult } from './types';

/** The organization default the app passes (the contract's default is 0: judged at departure). */
export const DEFAULT_HOLD_MINUTES = 30;
export const MAX_HOLD_MINUTES = 240;
const MAX_ROUNDS = 24;
/** Aim a little above the threshold so the last round lands on the safe side, K. */
const AIM_K = 2e-4;

/** Lowest oil and engine mass over [fromMs, toMs]: every 30 s and at heater edges; the oil's exact minimum on the continuous solution. */
export function windowMinimum(model: SoakModel, fromMs: number, toMs: number): { oilC: number; engineC?: number; atMs: number } {
  const set = new Set<number>([fromMs, toMs]);
  for (let t = fromMs; t < toMs; t += 30_000) set.add(t);
  for (const h of model.heaters ?? []) for (const t of [h.fromMs, h.toMs]) if (t > fromMs && t < toMs) set.add(t);
  for (const p of model.outside) if (p.atMs > fromMs && p.atMs < toMs) set.add(p.atMs);
  const times = Float64Array.from(set).sort();
  const s = simulate(model, { atMs: times });
  let i = 0;
  for (let j = 1; j < s.oilC.length; j++) if (s.oilC[j] < s.oilC[i]) i = j;
  let oil = { atMs: times[i], oilC: s.oilC[i] };
  if (toMs > fromMs) {
    const exact = oilMinimumBetween(model, fromMs, toMs, { exact: true });
    if (exact.oilC < oil.oilC) oil = exact;
  }
  const engineC = s.engineC ? Math.min(...s.engineC) : undefined;
  return { oilC: oil.oilC, atMs: oil.atMs, ...(engineC !== undefined ? { engineC } : {}) };
}

/** Cost of heat over [from, to]: the tariff where it covers, its last price beyond (a tariff need only cover up to departure). */
function holdCost(req: PlanRequest, kWh: number, fromMs: number, toMs: number): number {
  const pricing = pricingOf(req.tariff, req.flatPricePerKWh);
  try {
    return pricing.energyCost(fromMs, toMs, kWh);
  } catch {
    const last = [...(req.tariff ?? [])].sort((a, b) => a.fromMs - b.fromMs).filter((p) => p.fromMs <= fromMs).pop();
    return kWh * (last?.pricePerKWh ?? req.flatPricePerKWh ?? 1);
  }
}

/**
 * Plans the heat for one departure and its start window. With holdMinutes 0 and no engine threshold
 * it is the departure-instant plan unchanged. Throws PlanInputError (naming the field).
 */
export function planDeparture(req: PlanRequest): PlanResult {
  const holdMin = req.holdMinutes ?? 0;
  if (!(holdMin >= 0 && holdMin <= MAX_HOLD_MINUTES)) throw new PlanInputError('plan.holdMinutes', `Must be 0 to ${MAX_HOLD_MINUTES} minutes.`);
  const engThr = req.model.engine ? req.engineReadyC : undefined;
  if (holdMin === 0 && engThr === undefined) return planAtDeparture(req);

  const T = req.departureMs;
  const until = T + holdMin * 60_000;
  const base: SoakModel = { ...req.model, endMs: Math.max(req.model.endMs, until) };
  const margin = (m: SoakModel) => {
    const w = windowMinimum(m, T, until);
    return { w, m: Math.min(w.oilC - req.readyC, engThr !== undefined && w.engineC !== undefined ? w.engineC - engThr : Infinity) };
  };
  const report = (w: ReturnType<typeof windowMinimum>, heaterOn: boolean) => ({
    untilMs: until,
    minOilC: w.oilC,
    ...(engThr !== undefined && w.engineC !== undefined ? { minEngineC: w.engineC } : {}),
    met: Math.min(w.oilC - req.readyC, engThr !== undefined && w.engineC !== undefined ? w.engineC - engThr : Infinity) >= -CHECK_TOL_K,
    heaterOn,
  });

  // No heat needed: the free run holds the whole window (and the planner finds nothing to do).
  const free = planAtDeparture({ ...req, model: base });
  const freeWindow = margin(base);
  if (free.status === 'ready' && freeWindow.m >= -CHECK_TOL_K) return { ...free, hold: report(freeWindow.w, false) };

  // The hold's heat is fixed; raise the departure target until the window holds.
  const holdOn: Interval[] = until > T ? [{ fromMs: T, toMs: until }] : [];
  const held = withHeater(base, req.heater, holdOn);
  let bump = 0;
  let res = planAtDeparture({ ...req, model: held });
  let cur = margin(withHeater(held, req.heater, res.heaterOn));
  let prev: { bump: number; m: number } | null = null;
  for (let round = 0; round < MAX_ROUNDS && cur.m < -CHECK_TOL_K && res.status !== 'short'; round++) {
    const need = -cur.m + AIM_K;
    let step = need;
    if (prev && cur.m > prev.m) step = Math.max(need, (need * (bump - prev.bump)) / (cur.m - prev.m));
    prev = { bump, m: cur.m };
    bump += Math.min(step, 50);
    res = planAtDeparture({ ...req, model: held, readyC: req.readyC + bump });
    cur = margin(withHeater(held, req.heater, res.heaterOn));
  }

  const P = req.heater.powerW;
  const holdKWh = holdOn.length ? kWhOf(P, T, until) : 0;
  const holdPrice = holdOn.length ? holdCost(req, holdKWh, T, until) : 0;
  const hold = report(cur.w, holdOn.length > 0);
  const heaterOn = mergeIntervals([...res.heaterOn, ...holdOn]);
  const addHold = <B extends { energyKWh: number; cost?: number; oilAtDepartureC: number; meetsReady: boolean; fromMs: number; toMs: number }>(b: B): B => {
    const iv = b.fromMs < b.toMs ? [{ fromMs: b.fromMs, toMs: b.toMs }] : [];
    const ok = margin(withHeater(held, req.heater, iv)).m >= -CHECK_TOL_K;
    return { ...b, energyKWh: b.energyKWh + holdKWh, ...(b.cost !== undefined ? { cost: b.cost + holdPrice } : {}), meetsReady: ok };
  };
  return {
    ...res,
    readyC: req.readyC,
    status: res.status === 'short' || !hold.met ? 'short' : 'warming',
    heaterOn,
    ...(heaterOn.length ? { switchOnAtMs: heaterOn[0].fromMs } : {}),
    energyKWh: res.energyKWh + holdKWh,
    ...(res.cost !== undefined ? { cost: res.cost + holdPrice } : {}),
    baselines: { allNight: addHold(res.baselines.allNight), hoursBefore: res.baselines.hoursBefore.map(addHold) },
    probabilityReady: probabilityReady(res.oilAtDepartureC, req.readyC, res.uncertainty.sigmaOilK),
    hold,
  };
}
