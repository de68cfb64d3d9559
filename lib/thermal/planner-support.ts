// Sensitivities of the oil temperature for the heat planner, by the adjoint of the exact stepping.
//
// The model is linear: over each step x_b = Φ·x_a + Γ0·(g·Tout_a + c) + Γ1·g·slope. The oil at a
// time T is therefore e_oilᵀ·x(T), and its sensitivity to any input of an earlier step is
// λ_bᵀ·(∂x_b/∂input), where the co-state λ is carried backwards from λ(T) = e_oil by λ_a = Φᵀ·λ_b
// (and zeroed on the shelter at the start of a segment whose shelter is pinned at its set-point,
// since the walk overwrites it there). One backward pass gives, at the cost of one simulation:
//   - the oil rise at T per watt in every heater slot (what heaterResponse gives in one forward pass
//     per slot, O(slots × steps); here O(steps));
//   - the oil change at T per kelvin on every outside-forecast point (linear between points), and
//     for a uniform shift of the whole forecast (the readiness probability's input).
// The steps are the same as the walk's (segment boundaries, slot edges, the evaluation times) and
// share its cached discretisations, so the values agree with heaterResponse to rounding.
import { discretise, type Discretisation } from './discretise';
import { sampleStates } from './integrate';
import { compile, nodeIndex } from './plan';
import type { HeaterSlot } from './response';
import type { NodeName, SoakModel } from './types';

export interface OilResponseAt {
  /** The evaluation time, clamped to the run, epoch ms. */
  atMs: number;
  /** Oil at that time for the model as given (its own heaters included), °C. */
  baseOilC: number;
  /** Oil rise at that time per watt held over slot k on the heater's node, K/W (0 for slots after it). */
  perWattK: Float64Array;
  /** ∂oil/∂(outside forecast point i), K/K, in the order of model.outside (linear between points). */
  perOutsideK: Float64Array;
  /**
   * ∂oil/∂δ for the whole outside forecast shifted by δ, K/K: the sum of perOutsideK plus the
   * hangar air's start temperature when it defaults to the outside. A heated hangar's thermostat
   * events are held where they are (the local derivative).
   */
  uniformShiftKPerK: number;
  /**
   * The co-state at the start of each slot, restricted to the heated nodes (oil, engine — see
   * `heatedNodes`): row k holds ∂oil(atMs)/∂(heat-raised temperature of each heated node at slot k's
   * start), so oil(atMs) = base + coState_kᵀ·z(slot k start) + the heat of slot k onwards. Zero for
   * slots starting at or after atMs. Flat, K × heatedNodes.length.
   */
  coStateAtSlotStart: Float64Array;
}

/** Step length in seconds rounded to the microsecond, exactly as the walk does, so cached exponentials are shared. */
function stepSeconds(ta: number, tb: number): number {
  return Math.round((tb - ta) * 1000) / 1e6;
}

/**
 * The oil's sensitivities at each of `times` to heater power per slot (on `node`) and to the outside
 * forecast, for the model as given. One compile, one forward list of steps, one backward pass per time.
 * Flat typed arrays throughout: the planner calls this once per aircraft and per floor row.
 */
export function oilResponses(
  model: SoakModel,
  opts: { node: NodeName; slots: readonly HeaterSlot[]; times: readonly number[] },
): OilResponseAt[] {
  const plan = compile(model);
  const ni = nodeIndex(plan, opts.node);
  if (ni < 0) throw new Error(`the model has no "${opts.node}" node`);
  const n = plan.n;
  const t0 = plan.startMs;
  const clamp = (t: number) => Math.min(Math.max(t, t0), plan.endMs);
  const K = opts.slots.length;
  const from = new Float64Array(K);
  const to = new Float64Array(K);
  for (let k = 0; k < K; k++) {
    from[k] = clamp(opts.slots[k].fromMs);
    to[k] = clamp(opts.slots[k].toMs);
  }
  const times = opts.times.map(clamp);
  let last = t0;
  for (const t of times) if (t > last) last = t;
  const raw = new Float64Array(2 * K + times.length);
  raw.set(from, 0);
  raw.set(to, K);
  raw.set(times, 2 * K);
  raw.sort();
  const stops: number[] = [];
  for (const t of raw) if (t > t0 && t <= last && t !== stops[stops.length - 1]) stops.push(t);

  // Forward: the steps up to the last evaluation time.
  const out = model.outside;
  const cap = plan.segs.length + stops.length + 1;
  const ta = new Float64Array(cap);
  const tb = new Float64Array(cap);
  const oiOf = new Int32Array(cap);
  const pinned = new Uint8Array(cap);
  const ds: Discretisation[] = [];
  const g0 = new Float64Array(cap * n);
  const g1 = new Float64Array(cap * n);
  let S = 0;
  let j = 0;
  let oi = -1;
  for (const seg of plan.segs) {
    if (seg.t0 >= last) break;
    while (oi + 1 < out.length && out[oi + 1].atMs <= seg.t0) oi++;
    let t = seg.t0;
    while (t < seg.t1 && t < last) {
      while (j < stops.length && stops[j] <= t) j++;
      let tn = j < stops.length && stops[j] < seg.t1 ? stops[j] : seg.t1;
      if (tn > last) tn = last;
      const d = discretise(seg.sys, stepSeconds(t, tn));
      for (let r = 0; r < n; r++) {
        let x = 0;
        let y = 0;
        for (let m = 0; m < n; m++) {
          x += d.gamma0[r * n + m] * seg.g[m];
          y += d.gamma1[r * n + m] * seg.g[m];
        }
        g0[S * n + r] = x;
        g1[S * n + r] = y;
      }
      ta[S] = t;
      tb[S] = tn;
      oiOf[S] = oi;
      pinned[S] = t === seg.t0 && !Number.isNaN(seg.pin) ? 1 : 0;
      ds.push(d);
      S++;
      t = tn;
    }
  }
  /** First step starting at or after t (steps are sorted and tile [start, last]). */
  const stepFrom = (t: number) => {
    let lo = 0;
    let hi = S;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (ta[mid] < t) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  };
  // Which slots cover each step, compressed by step (slots may overlap in general).
  const firstStep = new Int32Array(K);
  const coverStart = new Int32Array(S + 1);
  for (let k = 0; k < K; k++) {
    firstStep[k] = to[k] > from[k] ? stepFrom(from[k]) : S;
    for (let i = firstStep[k]; i < S && tb[i] <= to[k]; i++) coverStart[i + 1]++;
  }
  for (let i = 0; i < S; i++) coverStart[i + 1] += coverStart[i];
  const coverIdx = new Int32Array(coverStart[S]);
  const fill = coverStart.slice(0, S);
  for (let k = 0; k < K; k++) for (let i = firstStep[k]; i < S && tb[i] <= to[k]; i++) coverIdx[fill[i]++] = k;

  const sortedTimes = Array.from(new Set(times)).sort((a, b) => a - b);
  const baseStates = sampleStates(plan, sortedTimes)[plan.iO];
  const baseAt = new Map<number, number>();
  sortedTimes.forEach((t, i) => baseAt.set(t, baseStates[i]));

  // Hangar air starting at the outside temperature (no initialTempC, not heated): it shifts too.
  const sh = model.shelter;
  const shelterFollowsOutside =
    sh.kind === 'hangar' && sh.initialTempC === undefined && !(sh.setpointC !== undefined && sh.heatingPowerW !== undefined);
  const invC = 1 / plan.caps[ni];
  const lam = new Float64Array(n);
  const tmp = new Float64Array(n);
  const heated = plan.iE >= 0 ? [plan.iO, plan.iE] : [plan.iO];
  const H = heated.length;
  /** λ at each step's start (after the pin), per time. */
  const lamAt = new Float64Array(S * n);

  return times.map((T) => {
    const perWattK = new Float64Array(K);
    const perOutsideK = new Float64Array(out.length);
    const coStateAtSlotStart = new Float64Array(K * H);
    lam.fill(0);
    lam[plan.iO] = 1;
    // The step ending at T (T is a stop, so a step ends there exactly).
    let endI = -1;
    if (T > t0) {
      let lo = 0;
      let hi = S - 1;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (tb[mid] < T) lo = mid + 1;
        else hi = mid;
      }
      endI = lo;
    }
    for (let i = endI; i >= 0; i--) {
      const d = ds[i];
      // Heater slots: Γ0·e_node / C per watt.
      if (coverStart[i + 1] > coverStart[i]) {
        let v = 0;
        for (let r = 0; r < n; r++) v += lam[r] * d.gamma0[r * n + ni];
        v *= invC;
        for (let c = coverStart[i]; c < coverStart[i + 1]; c++) perWattK[coverIdx[c]] += v;
      }
      // Outside: α = λᵀ·Γ0·g multiplies Tout at the step start, β = λᵀ·Γ1·g its slope (K/s).
      let alpha = 0;
      let beta = 0;
      for (let r = 0; r < n; r++) {
        alpha += lam[r] * g0[i * n + r];
        beta += lam[r] * g1[i * n + r];
      }
      const o = oiOf[i];
      if (o < 0) perOutsideK[0] += alpha;
      else if (o + 1 >= out.length) perOutsideK[out.length - 1] += alpha;
      else {
        const p = out[o];
        const q = out[o + 1];
        const span = q.atMs - p.atMs;
        const u = (ta[i] - p.atMs) / span;
        const dsl = 1000 / span; // ∂slope(K/s)/∂(q − p)
        perOutsideK[o] += alpha * (1 - u) - beta * dsl;
        perOutsideK[o + 1] += alpha * u + beta * dsl;
      }
      // λ_a = Φᵀ·λ_b.
      for (let m = 0; m < n; m++) {
        let v = 0;
        for (let r = 0; r < n; r++) v += d.phi[r * n + m] * lam[r];
        tmp[m] = v;
      }
      lam.set(tmp);
      if (pinned[i]) lam[plan.iS] = 0;
      for (let m = 0; m < n; m++) lamAt[i * n + m] = lam[m];
    }
    for (let k = 0; k < K; k++) {
      const i = firstStep[k];
      if (i <= endI) for (let h = 0; h < H; h++) coStateAtSlotStart[k * H + h] = lamAt[i * n + heated[h]];
    }
    let uniform = 0;
    for (let i = 0; i < out.length; i++) uniform += perOutsideK[i];
    if (shelterFollowsOutside) {
      // x0[shelter] = outside at the start, linear in the two points around it.
      const w = outsideWeights(out, t0);
      for (const [i, wi] of w) perOutsideK[i] += lam[plan.iS] * wi;
      uniform += lam[plan.iS];
    }
    return { atMs: T, baseOilC: baseAt.get(T)!, perWattK, perOutsideK, uniformShiftKPerK: uniform, coStateAtSlotStart };
  });
}

/** The outside temperature at t as weights on the forecast points (linear between, flat beyond the ends). */
function outsideWeights(pts: SoakModel['outside'], t: number): [number, number][] {
  const n = pts.length;
  if (t <= pts[0].atMs) return [[0, 1]];
  if (t >= pts[n - 1].atMs) return [[n - 1, 1]];
  let i = 0;
  while (pts[i + 1].atMs <= t) i++;
  const u = (t - pts[i].atMs) / (pts[i + 1].atMs - pts[i].atMs);
  return [
    [i, 1 - u],
    [i + 1, u],
  ];
}

/** The heated nodes' state indices as the planner sees them: oil, then engine when present. */
export function heatedNodes(model: SoakModel): NodeName[] {
  return model.engine ? ['oil', 'engine'] : ['oil'];
}

export interface SlotTransitions {
  /** The heated nodes, in order (oil first). */
  nodes: NodeName[];
  /**
   * Per slot: z(end) = M·z(start) + x·g for the heat-raised temperatures z of the heated nodes
   * (what the planned heat adds on top of the free run), x = 1 when the slot is on.
   * M is H×H row-major; g is the rise at the slot end from the slot on at the heater's power.
   */
  M: Float64Array[];
  g: Float64Array[];
}

/**
 * Exact per-slot transitions of the heat the planner adds, for slots that tile an interval (each
 * starts where the previous ends). The shelter never feels the engines, so the added heat lives on
 * the oil and engine nodes alone.
 */
export function slotTransitions(model: SoakModel, opts: { node: NodeName; powerW: number; slots: readonly HeaterSlot[] }): SlotTransitions {
  const plan = compile(model);
  const ni = nodeIndex(plan, opts.node);
  if (ni < 0) throw new Error(`the model has no "${opts.node}" node`);
  const n = plan.n;
  const heated = plan.iE >= 0 ? [plan.iO, plan.iE] : [plan.iO];
  const H = heated.length;
  const gain = opts.powerW / plan.caps[ni];
  const M: Float64Array[] = [];
  const g: Float64Array[] = [];
  let si = 0;
  const segs = plan.segs;
  const m2 = new Float64Array(H * H);
  const g2 = new Float64Array(H);
  for (const slot of opts.slots) {
    const a = Math.min(Math.max(slot.fromMs, plan.startMs), plan.endMs);
    const b = Math.min(Math.max(slot.toMs, plan.startMs), plan.endMs);
    const Mk = new Float64Array(H * H);
    for (let h = 0; h < H; h++) Mk[h * H + h] = 1;
    const gk = new Float64Array(H);
    let t = a;
    if (segs[si].t0 > t) si = 0;
    while (t < b) {
      while (si + 1 < segs.length && segs[si].t1 <= t) si++;
      const seg = segs[si];
      const tn = Math.min(seg.t1, b);
      const d = discretise(seg.sys, stepSeconds(t, tn));
      // Φ restricted to the heated nodes, applied to (M, g); then the slot's own heat.
      m2.fill(0);
      g2.fill(0);
      for (let r = 0; r < H; r++) {
        for (let c = 0; c < H; c++) {
          const phi = d.phi[heated[r] * n + heated[c]];
          for (let q = 0; q < H; q++) m2[r * H + q] += phi * Mk[c * H + q];
          g2[r] += phi * gk[c];
        }
        g2[r] += d.gamma0[heated[r] * n + ni] * gain;
      }
      Mk.set(m2);
      gk.set(g2);
      t = tn;
    }
    M.push(Mk);
    g.push(gk);
  }
  return { nodes: heated.map((i) => (i === plan.iO ? 'oil' : 'engine')), M, g };
}
