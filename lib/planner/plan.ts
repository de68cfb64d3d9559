// planDeparture: the heat plan for one departure. Pure: plain data in, plain data out.
//
// 1. Slots of the control's granularity end at departure and step back to the earliest switch-on.
// 2. One adjoint pass through lib/thermal (planner-support) gives the oil at departure as an affine
//    function of the slot powers, oil(T) = base + Σ a_k·x_k (x_k = 1 when slot k is on), and its
//    sensitivity to the outside forecast; with a floor, the same at every slot end where the free
//    curve is below the floor (only those rows can bind: every a_jk ≥ 0).
// 3. The slot choice:
//    - least-cost, departure only: the exact on/off optimum by branch and bound over the
//      fractional-knapsack greedy (cover.ts); the greedy is the LP's exact optimum. Then one slot
//      may switch on part-way, to the minute (finerSwitchOn), when that is cheaper.
//    - least-cost with a floor: the exact on/off optimum by the label DP (labels.ts), started from
//      the departure-only optimum repaired for the floor (lp.ts roundCover).
//    - single-start: the fewest trailing slots that meet every row (bisection on the count; the
//      rows only grow as slots are added), the exact continuous latest switch-on for the ready
//      temperature (root of the re-simulated oil at departure), and the timer's switch-on to the minute.
// 4. The plan is re-simulated through lib/thermal; with a floor, the continuous minimum is checked
//    and any dip between slot ends becomes a new row (at most a few rounds).
// 5. Baselines (all night, N hours before), the chance of being ready, and — when short — the fix.
import { firstOilCrossing, simulate, type SoakModel } from '@/lib/thermal';
import { oilResponses, slotTransitions, type OilResponseAt } from '@/lib/thermal/planner-support';
import { coverExact, coverRelaxation } from './cover';
import { solveFloorDp, type DpRow } from './labels';
import { meetsRows, roundCover, type CoverRow } from './lp';
import { oilAt, oilMinimumBetween, partsOf, restartAt, withHeater } from './model';
import { normalQuantile, oilUncertainty, probabilityReady } from './probability';
import { kWhOf, mergeIntervals, pricingOf, slotGrid, type Pricing } from './slots';
import {
  PlanInputError,
  type Baseline,
  type FloorReport,
  type Interval,
  type Optimality,
  type PlanRequest,
  type PlanResult,
  type PlanStatus,
} from './types';

export const DEFAULT_SLOT_MINUTES = 5;
/** Switch-on times are set to the minute (timers and relays take minutes); slots stay the on/off granularity. */
export const DEFAULT_SWITCH_ON_STEP_MINUTES = 1;
export const DEFAULT_BASELINE_HOURS = [1, 2, 3, 4] as const;
export const MAX_SLOTS = 2000;
/** Numerical margin on every constraint so the re-simulated plan meets it, not just the affine prediction, K. */
const MARGIN_K = 1e-7;
/** Tolerance when judging a re-simulated curve against the ready temperature or the floor, K. */
export const CHECK_TOL_K = 1e-5;
/** The fix looks this far past departure for the time the oil would be ready. */
const FIX_HORIZON_MS = 48 * 3_600_000;
const MAX_FLOOR_ROUNDS = 4;

/**
 * Oil responses per slot for the planned heater: for several heaters on one control, by linearity
 * the power-weighted sum of each part's per-watt response (per watt of the total).
 */
function responses(model: SoakModel, heater: PlanRequest['heater'], slots: readonly Interval[], times: number[]): OilResponseAt[] {
  const parts = partsOf(heater);
  if (parts.length === 1) return oilResponses(model, { node: parts[0].node, slots, times });
  const rs = parts.map((pt) => oilResponses(model, { node: pt.node, slots, times }));
  const P = heater.powerW;
  return rs[0].map((r0, i) => ({
    ...r0,
    perWattK: Float64Array.from(r0.perWattK, (_, k) => parts.reduce((s, pt, j) => s + (pt.powerW / P) * rs[j][i].perWattK[k], 0)),
  }));
}

/** Slot transitions of the heated nodes for the planned heater: the same M, the parts' heat g added. */
function transitions(model: SoakModel, heater: PlanRequest['heater'], slots: readonly Interval[]) {
  const parts = partsOf(heater);
  const trs = parts.map((pt) => slotTransitions(model, { node: pt.node, powerW: pt.powerW, slots }));
  if (trs.length === 1) return trs[0];
  return { ...trs[0], g: trs[0].g.map((g0, k) => Float64Array.from(g0, (v, h) => trs.reduce((s, t) => s + t.g[k][h], 0))) };
}

function validate(req: PlanRequest): void {
  const m = req.model;
  const T = req.departureMs;
  if (!Number.isFinite(T) || T < m.startMs || T > m.endMs) {
    throw new PlanInputError('plan.departure', 'Departure must lie within the run, from start to end.');
  }
  if (!(req.heater.powerW > 0)) throw new PlanInputError('plan.heater.powerW', 'The heater power must be greater than 0.');
  if (partsOf(req.heater).some((h) => h.node === 'engine') && !m.engine) {
    throw new PlanInputError('plan.heater.node', 'No "engine" node in this engine: the one-node form has "oil" only.');
  }
  if (req.heater.parts?.length && Math.abs(req.heater.parts.reduce((s, h) => s + h.powerW, 0) - req.heater.powerW) > 1e-6 * req.heater.powerW) {
    throw new PlanInputError('plan.heater.powerW', 'With parts, the power must be the sum of the parts’ powers.');
  }
  const slotMin = req.slotMinutes ?? DEFAULT_SLOT_MINUTES;
  if (!(slotMin > 0)) throw new PlanInputError('plan.slotMinutes', 'Must be greater than 0.');
  const e = req.earliestSwitchOnMs;
  if (e !== undefined && (!Number.isFinite(e) || e < m.startMs || e > T)) {
    throw new PlanInputError('plan.earliestSwitchOn', 'Must lie between the run start and departure.');
  }
  const periods = [...(req.tariff ?? [])].sort((a, b) => a.fromMs - b.fromMs);
  periods.forEach((p, i) => {
    if (!(p.toMs > p.fromMs)) throw new PlanInputError(`plan.tariff.${i}.to`, 'Must be after from.');
    if (!(p.pricePerKWh >= 0)) throw new PlanInputError(`plan.tariff.${i}.pricePerKWh`, 'Must be 0 or more.');
    if (i > 0 && p.fromMs < periods[i - 1].toMs) throw new PlanInputError('plan.tariff', 'Tariff periods must not overlap.');
  });
}

/** Everything the slot choice needs, built once per request. */
interface Problem {
  req: PlanRequest;
  model: SoakModel;
  T: number;
  earliest: number;
  slots: Interval[];
  /** Oil gain at departure per slot on, K. */
  a: Float64Array;
  /** Cost per slot (money, or kWh when unpriced). */
  cost: Float64Array;
  /** The objective: cost plus a 1e-9 share of energy, so free periods still prefer less energy. */
  objective: Float64Array;
  /** The energy tie-break per kWh inside the objective. */
  tie: number;
  kWh: Float64Array;
  pricing: Pricing;
  atT: OilResponseAt;
  targetC: number;
}

/** The ready row first, then one row per floor time. */
function rowsOf(p: Problem, floorResp: readonly OilResponseAt[], floorC?: number): CoverRow[] {
  const rows: CoverRow[] = [{ a: p.a, need: p.targetC + MARGIN_K - p.atT.baseOilC }];
  if (floorC === undefined) return rows;
  const P = p.req.heater.powerW;
  for (const r of floorResp) rows.push({ a: Float64Array.from(r.perWattK, (w) => P * w), need: floorC + MARGIN_K - r.baseOilC });
  return rows;
}

function sumOn(a: ArrayLike<number>, on: ArrayLike<number>): number {
  let s = 0;
  for (let k = 0; k < a.length; k++) if (on[k]) s += a[k];
  return s;
}

function intervalsOf(slots: readonly Interval[], on: ArrayLike<number>): Interval[] {
  return mergeIntervals(slots.filter((_, k) => on[k]));
}

/** The least-cost choice: departure only by branch and bound; with floor rows by the label DP. */
function leastCost(p: Problem, rows: readonly CoverRow[], floorResp: readonly OilResponseAt[], maxNodes: number): { on: Uint8Array; optimality: Optimality } {
  const obj = p.objective;
  const sol = coverExact(p.a, obj, rows[0].need, { maxNodes });
  if (rows.length === 1) {
    const lp = sol.lpBound;
    return {
      on: sol.on,
      optimality: {
        method: 'branch-and-bound',
        lpBound: lp,
        gapToLpBound: lp > 0 ? (sol.cost - lp) / lp : 0,
        certifiedGap: sol.certifiedGap,
        nodes: sol.nodes,
      },
    };
  }
  // Incumbent: the departure-only optimum repaired for the floor rows and improved.
  const inc = roundCover(obj, rows, sol.on);
  const incCost = sumOn(obj, inc);
  const K = p.slots.length;
  const tr = transitions(p.model, p.req.heater, p.slots);
  const H = tr.nodes.length;
  const slotOf = (t: number) => {
    let lo = 0;
    let hi = K - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (p.slots[mid].toMs < t) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  };
  const P = p.req.heater.powerW;
  const dpRow = (r: OilResponseAt, need: number): DpRow => {
    const k = slotOf(r.atMs);
    return { slot: k, coState: r.coStateAtSlotStart.subarray(k * H, k * H + H), aSlot: P * r.perWattK[k], need };
  };
  const dpRows = [dpRow(p.atT, rows[0].need), ...floorResp.map((r, i) => dpRow(r, rows[i + 1].need))];
  const dp = solveFloorDp({
    H,
    M: tr.M,
    g: tr.g,
    c: obj,
    rows: dpRows,
    ready: { a: p.a, coStateAtSlotStart: p.atT.coStateAtSlotStart, need: rows[0].need },
    incumbent: meetsRows(rows, inc) ? { on: inc, cost: incCost } : undefined,
  });
  const on = dp ? dp.on : inc;
  const cost = sumOn(obj, on);
  return {
    on,
    optimality: {
      method: dp ? 'label-dp' : 'lp-rounding',
      // The departure-only relaxation bounds the floor problem from below too.
      lpBound: sol.lpBound,
      gapToLpBound: sol.lpBound > 0 ? (cost - sol.lpBound) / sol.lpBound : 0,
      certifiedGap: dp ? 1e-9 : cost > 0 ? (cost - sol.lpBound) / cost : 0,
      ...(dp ? { nodes: dp.labels } : {}),
    },
  };
}

/** Fewest trailing slots meeting every row (monotone in the count), or −1. */
function trailingBlock(K: number, rows: readonly CoverRow[]): number {
  const ok = (m: number) => rows.every((r) => {
    let s = 0;
    for (let k = K - m; k < K; k++) s += r.a[k];
    return s >= r.need;
  });
  if (!ok(K)) return -1;
  let lo = 0;
  let hi = K;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (ok(mid)) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/** The exact latest switch-on for one block ending at T meeting `targetC` at T, inside [lo, hi] (f(lo) ≥ 0 > f(hi)). */
function latestSwitchOn(p: Problem, lo: number, hi: number): number {
  const f = (s: number) => oilAt(withHeater(p.model, p.req.heater, [{ fromMs: s, toMs: p.T }]), p.T) - p.targetC;
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (fa < 0) return lo;
  // Illinois false position on the switch-on time, to 1 ms; keep the side that meets the target.
  for (let it = 0; it < 100 && b - a > 1; it++) {
    let s = (a * fb - b * fa) / (fb - fa);
    if (!(s > a && s < b)) s = 0.5 * (a + b);
    const fs = f(s);
    if (fs >= 0) {
      a = s;
      fa = fs;
      fb /= 2;
    } else {
      b = s;
      fb = fs;
      fa /= 2;
    }
  }
  return Math.floor(a);
}

function floorResponses(p: Problem, times: number[]): OilResponseAt[] {
  return times.length ? responses(p.model, p.req.heater, p.slots, times) : [];
}

/** Cost in the objective's units (cost plus the energy tie-break) of intervals. */
function objectiveOf(p: Problem, iv: readonly Interval[]): number {
  const P = p.req.heater.powerW;
  const tie = p.tie;
  return iv.reduce((s, i) => {
    const e = kWhOf(P, i.fromMs, i.toMs);
    return s + p.pricing.energyCost(i.fromMs, i.toMs, e) + tie * e;
  }, 0);
}

/**
 * The switch-on of one slot at a finer step (`stepMs`, counted back from the slot's end) instead of
 * the slot's start. Two candidates: the LP optimum's full slots with its fractional slot on over its
 * last part, and the on/off optimum with its slack taken out of the first slot of its dearest run.
 * Each tail [end − m·step, end] is priced by one more adjoint pass (exact), the shortest that meets
 * the target is taken, and the cheaper candidate wins if it beats the on/off plan (null otherwise).
 */
function finerSwitchOn(p: Problem, on: Uint8Array, need: number, stepMs: number): { intervals: Interval[]; predictedC: number } | null {
  const { slots, a } = p;
  const K = slots.length;
  const P = p.req.heater.powerW;
  const candidates: { full: Uint8Array; k: number }[] = [];
  const relax = coverRelaxation(a, p.objective, need);
  if (relax.feasible) {
    const f = relax.x.findIndex((x) => x > 1e-12 && x < 1 - 1e-12);
    if (f >= 0) candidates.push({ full: Uint8Array.from(relax.x, (x) => (x >= 1 - 1e-12 ? 1 : 0)), k: f });
  }
  let worst = -1;
  for (let k = 0; k < K; k++) {
    if (on[k] && (k === 0 || !on[k - 1]) && a[k] > 0 && (worst < 0 || p.objective[k] / a[k] > p.objective[worst] / a[worst])) worst = k;
  }
  if (worst >= 0) candidates.push({ full: on, k: worst });
  if (!candidates.length) return null;
  // Every tail of every candidate slot, in one pass.
  const tails: Interval[] = [];
  const first: number[] = [];
  for (const c of candidates) {
    first.push(tails.length);
    const { fromMs, toMs } = slots[c.k];
    for (let m = 1; toMs - (m - 1) * stepMs > fromMs + 1e-6; m++) tails.push({ fromMs: Math.max(fromMs, toMs - m * stepMs), toMs });
  }
  const [r] = responses(p.model, p.req.heater, tails, [p.T]);
  const gridCost = objectiveOf(p, intervalsOf(slots, on));
  let best: { intervals: Interval[]; cost: number; predictedC: number } | null = null;
  candidates.forEach((c, ci) => {
    let rest = r.baseOilC;
    for (let j = 0; j < K; j++) if (c.full[j] && j !== c.k) rest += a[j];
    const end = ci + 1 < candidates.length ? first[ci + 1] : tails.length;
    for (let t = first[ci]; t < end; t++) {
      const oil = rest + P * r.perWattK[t];
      if (oil < p.targetC + MARGIN_K) continue;
      const iv = mergeIntervals([...slots.filter((_, j) => c.full[j] && j !== c.k), tails[t]]);
      const cost = objectiveOf(p, iv);
      if (cost < gridCost && (!best || cost < best.cost)) best = { intervals: iv, cost, predictedC: oil };
      return;
    }
  });
  return best;
}

/**
 * Plans the heat for one departure, judged at the departure instant only (the start window on top is
 * lib/planner/hold.ts, which every caller goes through as planDeparture). Throws PlanInputError
 * (naming the field) for requests it cannot plan.
 */
export function planAtDeparture(req: PlanRequest): PlanResult {
  validate(req);
  const model = req.model;
  const T = req.departureMs;
  const slotMinutes = req.slotMinutes ?? DEFAULT_SLOT_MINUTES;
  const earliest = Math.min(T, req.earliestSwitchOnMs ?? Math.max(model.startMs, req.nowMs ?? model.startMs));
  const slots = slotGrid(earliest, T, slotMinutes * 60_000);
  if (slots.length > MAX_SLOTS) {
    throw new PlanInputError('plan.slotMinutes', `Gives ${slots.length} slots from the earliest switch-on to departure; at most ${MAX_SLOTS}.`);
  }
  const K = slots.length;
  const P = req.heater.powerW;
  const pricing = pricingOf(req.tariff, req.flatPricePerKWh);
  const kWh = Float64Array.from(slots, (s) => kWhOf(P, s.fromMs, s.toMs));
  const cost = Float64Array.from(slots, (s, k) => pricing.energyCost(s.fromMs, s.toMs, kWh[k]));
  let priceScale = 0;
  for (let k = 0; k < K; k++) priceScale = Math.max(priceScale, kWh[k] > 0 ? cost[k] / kWh[k] : 0);
  const tie = 1e-9 * (priceScale > 0 ? priceScale : 1);
  const objective = Float64Array.from(cost, (c, k) => c + tie * kWh[k]);

  const [atT] = responses(model, req.heater, slots, [T]);
  const a = Float64Array.from(atT.perWattK, (w) => w * P);
  const issuedAtMs = req.forecastIssuedAtMs ?? req.nowMs ?? model.startMs;
  const uncertainty = oilUncertainty(model, atT, { departureMs: T, issuedAtMs, correlationHours: req.uncertainty?.correlationHours });
  const z = req.targetProbability !== undefined ? Math.max(0, normalQuantile(req.targetProbability)) : 0;
  const targetC = req.readyC + Math.max(z * uncertainty.sigmaOilK, req.targetMarginK ?? 0);
  const p: Problem = { req, model, T, earliest, slots, a, cost, objective, tie, kWh, pricing, atT, targetC };

  // The floor: where it is enforced from, and the slot ends where it can bind.
  const floorC = req.floorC;
  let enforcedFromMs = earliest;
  let breachBeforeHeat: FloorReport['breachBeforeHeat'];
  let floorRestorable = true;
  const floorRows: OilResponseAt[] = [];
  let dipRows = 0;
  if (floorC !== undefined) {
    const ends = slots.map((s) => s.toMs);
    const times = [earliest, ...ends];
    const base = simulate(model, { atMs: times }).oilC;
    const freeAtEarliest = base[0];
    const before = earliest > model.startMs ? oilMinimumBetween(model, model.startMs, earliest, { exact: true }).oilC : freeAtEarliest;
    if (before < floorC || freeAtEarliest < floorC) {
      const fromMs = model.oil.initialTempC < floorC ? model.startMs : (firstOilCrossing(model, floorC) ?? model.startMs);
      breachBeforeHeat = { fromMs, oilAtSwitchOnC: freeAtEarliest };
    }
    if (freeAtEarliest < floorC) {
      const full = restartAt(withHeater(model, req.heater, [{ fromMs: earliest, toMs: T }]), earliest, T);
      const back = T > earliest ? firstOilCrossing(full, floorC) : null;
      floorRestorable = back !== null;
      enforcedFromMs = back ?? T;
    }
    if (floorRestorable) {
      const bind = ends.filter((t, j) => t >= enforcedFromMs && base[j + 1] < floorC + 1e-6);
      floorRows.push(...floorResponses(p, bind));
    }
  }

  const maxNodes = req.maxNodes ?? 200_000;
  let rows = rowsOf(p, floorRows, floorC);
  const allOn = new Uint8Array(K).fill(1);
  const feasible = floorRestorable && meetsRows(rows, allOn);
  let on: Uint8Array = new Uint8Array(K);
  let optimality: Optimality | undefined;
  let latestSwitchOnAtMs: number | undefined;
  let status: PlanStatus;
  let floorReport: FloorReport | undefined;

  const solve = () => {
    if (req.mode === 'least-cost') {
      const r = leastCost(p, rows, floorRows, maxNodes);
      on = r.on;
      optimality = r.optimality;
    } else {
      const m = trailingBlock(K, rows);
      on = new Uint8Array(K);
      for (let k = K - m; k < K; k++) on[k] = 1;
    }
  };

  // The last continuous floor check, reused for the report when the plan did not change since.
  let checked: { key: string; min: { atMs: number; oilC: number } } | undefined;
  const keyOf = (x: Uint8Array) => x.join('');
  if (!feasible) {
    status = 'short';
    on = allOn;
  } else {
    if (!rows.every((r) => r.need <= 0)) solve();
    // Dips between slot ends: add a row where the re-simulated curve is lowest, and solve again.
    for (let round = 0; floorC !== undefined && T > enforcedFromMs && round < MAX_FLOOR_ROUNDS; round++) {
      const planned = withHeater(model, req.heater, intervalsOf(slots, on));
      const min = oilMinimumBetween(planned, enforcedFromMs, T, { exact: true });
      checked = { key: keyOf(on), min };
      if (min.oilC >= floorC - CHECK_TOL_K || !(min.atMs > enforcedFromMs && min.atMs < T)) break;
      floorRows.push(...floorResponses(p, [min.atMs]));
      dipRows++;
      rows = rowsOf(p, floorRows, floorC);
      if (!meetsRows(rows, allOn)) {
        on = allOn;
        break;
      }
      solve();
    }
    status = !meetsRows(rows, allOn) ? 'short' : on.some((v) => v) ? 'warming' : 'ready';
  }
  const stepMs = Math.min(slotMinutes, req.switchOnStepMinutes ?? DEFAULT_SWITCH_ON_STEP_MINUTES) * 60_000;
  let heaterOn = status === 'ready' ? [] : intervalsOf(slots, on);
  let predictedOilAtDepartureC = atT.baseOilC + sumOn(a, on);
  if (req.mode === 'single-start' && status !== 'short') {
    const mReady = trailingBlock(K, rows.slice(0, 1));
    if (mReady > 0) latestSwitchOnAtMs = latestSwitchOn(p, slots[K - mReady].fromMs, slots[K - mReady].toMs);
    // The timer's switch-on at the finer step: the latest step at or before the exact time, unless the floor wants the block earlier.
    const onSlots = sumOn(allOn, on);
    if (latestSwitchOnAtMs !== undefined && onSlots === mReady && stepMs < slotMinutes * 60_000) {
      const stepped = Math.max(earliest, T - Math.ceil((T - latestSwitchOnAtMs) / stepMs - 1e-9) * stepMs);
      if (stepped > heaterOn[0].fromMs) {
        heaterOn = [{ fromMs: stepped, toMs: T }];
        const [r] = responses(model, req.heater, heaterOn, [T]);
        predictedOilAtDepartureC = r.perWattK.reduce((x, w) => x + w * P, r.baseOilC);
      }
    }
  }
  if (req.mode === 'least-cost' && status === 'warming' && floorC === undefined && stepMs < slotMinutes * 60_000) {
    const fine = finerSwitchOn(p, on, rows[0].need, stepMs);
    if (fine) {
      heaterOn = fine.intervals;
      predictedOilAtDepartureC = fine.predictedC;
      if (optimality) optimality = { ...optimality, switchOn: 'finer-step', gapToLpBound: optimality.lpBound > 0 ? (objectiveOf(p, heaterOn) - optimality.lpBound) / optimality.lpBound : 0 };
    }
  }

  const planned = withHeater(model, req.heater, heaterOn);
  const oilAtDepartureC = oilAt(planned, T);
  const energyKWh = heaterOn.reduce((s, i) => s + kWhOf(P, i.fromMs, i.toMs), 0);
  const planCost = heaterOn.reduce((s, i) => s + pricing.energyCost(i.fromMs, i.toMs, kWhOf(P, i.fromMs, i.toMs)), 0);

  if (floorC !== undefined) {
    const min =
      T <= enforcedFromMs
        ? { atMs: T, oilC: oilAtDepartureC }
        : checked && checked.key === keyOf(on)
          ? checked.min
          : oilMinimumBetween(planned, enforcedFromMs, T, { exact: true });
    floorReport = {
      floorC,
      enforcedFromMs,
      ...(breachBeforeHeat ? { breachBeforeHeat } : {}),
      minOilC: min.oilC,
      minAtMs: min.atMs,
      met: floorRestorable && min.oilC >= floorC - CHECK_TOL_K,
      dipRows,
    };
  }

  let fix: PlanResult['fix'];
  if (status === 'short') {
    const full = withHeater(model, req.heater, [{ fromMs: earliest, toMs: T + FIX_HORIZON_MS }]);
    const after = restartAt(full, T, T + FIX_HORIZON_MS);
    const readyAtMs = oilAtDepartureC >= req.readyC ? T : firstOilCrossing(after, req.readyC);
    const sumA = atT.perWattK.reduce((s, w) => s + w, 0);
    let need = sumA > 0 ? (targetC - atT.baseOilC) / sumA : Infinity;
    for (const r of floorRows) {
      const s = r.perWattK.reduce((x, w) => x + w, 0);
      need = Math.max(need, s > 0 ? (floorC! - r.baseOilC) / s : Infinity);
    }
    fix = { readyAtMs, powerNeededW: Number.isFinite(need) && floorRestorable ? Math.ceil(need) : null };
  }

  const baseline = (rule: Baseline['rule'], fromWanted: number, hours?: number): Baseline => {
    const from = Math.max(earliest, fromWanted);
    const iv = from < T ? [{ fromMs: from, toMs: T }] : [];
    const m = withHeater(model, req.heater, iv);
    const e = kWhOf(P, from, T);
    const c = pricing.energyCost(from, T, e);
    // On the slot grid the block's oil is the exact affine response (equal to a re-simulation to
    // rounding; the checks compare); off it, or with a floor to check, it is simulated.
    const first = slots.findIndex((sl) => sl.fromMs === from);
    let oil: number;
    if (floorC === undefined && (first >= 0 || iv.length === 0)) {
      oil = atT.baseOilC;
      if (first >= 0) for (let k = first; k < K; k++) oil += a[k];
    } else {
      oil = oilAt(m, T);
    }
    const b: Baseline = {
      rule,
      ...(hours !== undefined ? { hours } : {}),
      fromMs: from,
      toMs: T,
      clipped: fromWanted < earliest,
      energyKWh: e,
      ...(pricing.priced ? { cost: c } : {}),
      oilAtDepartureC: oil,
      meetsReady: oil >= req.readyC - CHECK_TOL_K,
      saved: { energyKWh: e - energyKWh, ...(pricing.priced ? { cost: c - planCost } : {}) },
    };
    if (floorC !== undefined) b.meetsFloor = floorRestorable && (T > enforcedFromMs ? oilMinimumBetween(m, enforcedFromMs, T).oilC : oil) >= floorC - CHECK_TOL_K;
    return b;
  };
  const baselines = {
    allNight: baseline('all-night', earliest),
    hoursBefore: (req.baselineHours ?? DEFAULT_BASELINE_HOURS).map((h) => baseline('hours-before', T - h * 3_600_000, h)),
  };

  return {
    mode: req.mode,
    status,
    departureMs: T,
    readyC: req.readyC,
    targetC,
    earliestSwitchOnMs: earliest,
    slotMinutes,
    heaterOn,
    ...(heaterOn.length ? { switchOnAtMs: heaterOn[0].fromMs } : {}),
    ...(latestSwitchOnAtMs !== undefined ? { latestSwitchOnAtMs } : {}),
    oilAtDepartureC,
    predictedOilAtDepartureC,
    freeOilAtDepartureC: atT.baseOilC,
    energyKWh,
    ...(pricing.priced ? { cost: planCost } : {}),
    ...(floorReport ? { floor: floorReport } : {}),
    ...(fix ? { fix } : {}),
    baselines,
    probabilityReady: probabilityReady(oilAtDepartureC, req.readyC, uncertainty.sigmaOilK),
    uncertainty,
    ...(optimality ? { optimality } : {}),
  };
}

