// The slot choice with an overnight floor, exactly: dynamic programming over the slots in time
// order with Pareto labels.
//
// What the planned heat adds on top of the free run is a state z of the heated nodes (oil, and the
// engine mass in the two-node form; the shelter never feels the engines). Over slot k it moves
// exactly as z ← M_k·z + x_k·g_k (planner-support slotTransitions). Every constraint — the ready
// temperature at departure, the floor at a slot end or at a dip inside a slot — reads
// oil(t_j) − base_j = λ_jᵀ·z(start of the slot holding t_j) + x_slot·A_j,slot ≥ need_j, so it is
// checked the moment its slot is decided, and a schedule that breaks it is dropped at once.
//
// A label is (cost so far, z). Because the system's transition matrices and gains are
// non-negative, a label with no more cost and no less z in every node can do everything another
// can, and the other is dropped (dominance). Labels whose cost plus a lower bound on what the
// ready temperature still needs (the fractional-knapsack greedy over the remaining slots) reaches
// the incumbent are dropped too. What survives the last slot is the on/off optimum.

export interface DpRow {
  /** The slot holding the constraint time (t in (start, end] of that slot). */
  slot: number;
  /** λ at that slot's start, per heated node. */
  coState: ArrayLike<number>;
  /** Gain at the constraint time from that slot on, K. */
  aSlot: number;
  need: number;
}

export interface DpInput {
  H: number;
  M: readonly Float64Array[];
  g: readonly Float64Array[];
  /** Objective per slot (≥ 0). */
  c: ArrayLike<number>;
  rows: readonly DpRow[];
  /** The ready row's gains per slot and co-states at slot starts (K × H), for the lower bound. */
  ready: { a: ArrayLike<number>; coStateAtSlotStart: ArrayLike<number>; need: number };
  incumbent?: { on: Uint8Array; cost: number };
  relTol?: number;
  /** Give up (return null) when a stage holds more labels than this. */
  maxLabels?: number;
}

export interface DpResult {
  on: Uint8Array;
  cost: number;
  /** Labels created over all stages. */
  labels: number;
}

/** The on/off optimum (within relTol) or null when the label limit is hit or nothing is feasible. */
export function solveFloorDp(inp: DpInput): DpResult | null {
  const { H, M, g, c, rows } = inp;
  const K = c.length;
  const relTol = inp.relTol ?? 1e-9;
  const maxLabels = inp.maxLabels ?? 50_000;
  let best = inp.incumbent ? inp.incumbent.cost : Infinity;
  const cut = () => best * (1 - relTol);

  const rowsAt: DpRow[][] = Array.from({ length: K }, () => []);
  for (const r of rows) rowsAt[r.slot].push(r);

  // Ready row: slots by cost per kelvin.
  const ra = inp.ready.a;
  const order = Array.from({ length: K }, (_, k) => k)
    .filter((k) => ra[k] > 0)
    .sort((i, j) => c[i] / ra[i] - c[j] / ra[j] || ra[j] - ra[i]);

  // Stage storage for backtracking.
  const parents: Int32Array[] = [];
  const takes: Uint8Array[] = [];
  let cost = new Float64Array([0]);
  let z = new Float64Array(H);
  let labels = 1;

  const lamT = inp.ready.coStateAtSlotStart;
  let cc = new Float64Array(0);
  let cz = new Float64Array(0);
  let cp = new Int32Array(0);
  let ct = new Uint8Array(0);
  const cumA = new Float64Array(K + 1);
  const cumC = new Float64Array(K + 1);
  for (let k = 0; k < K; k++) {
    // Suffix k+1.. of the greedy order, as cumulative gain and cost, for the bound.
    let m = 0;
    for (const i of order) {
      if (i > k) {
        cumA[m + 1] = cumA[m] + ra[i];
        cumC[m + 1] = cumC[m] + c[i];
        m++;
      }
    }
    const lb = (left: number): number => {
      if (left <= 0) return 0;
      if (left > cumA[m]) return Infinity;
      let lo = 0;
      let hi = m;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (cumA[mid] < left) lo = mid;
        else hi = mid;
      }
      // cumA[lo] < left ≤ cumA[hi]
      const f = (left - cumA[lo]) / (cumA[hi] - cumA[lo]);
      return cumC[lo] + f * (cumC[hi] - cumC[lo]);
    };
    const L = cost.length;
    const Mk = M[k];
    const gk = g[k];
    const here = rowsAt[k];
    const hasNext = k + 1 < K;
    const limit = cut();
    let nCand = 0;
    if (cc.length < 2 * L) {
      cc = new Float64Array(4 * L);
      cz = new Float64Array(4 * L * H);
      cp = new Int32Array(4 * L);
      ct = new Uint8Array(4 * L);
    }
    for (let l = 0; l < L; l++) {
      for (let x = 0; x <= 1; x++) {
        const c1 = cost[l] + (x ? c[k] : 0);
        if (c1 >= limit) continue;
        let ok = true;
        for (const r of here) {
          let v = x ? r.aSlot : 0;
          for (let h = 0; h < H; h++) v += r.coState[h] * z[l * H + h];
          if (v < r.need) {
            ok = false;
            break;
          }
        }
        if (!ok) continue;
        const o = nCand * H;
        for (let h = 0; h < H; h++) {
          let v = x ? gk[h] : 0;
          for (let q = 0; q < H; q++) v += Mk[h * H + q] * z[l * H + q];
          cz[o + h] = v;
        }
        if (hasNext) {
          let got = 0;
          for (let h = 0; h < H; h++) got += lamT[(k + 1) * H + h] * cz[o + h];
          if (c1 + lb(inp.ready.need - got) >= limit) continue;
        }
        cc[nCand] = c1;
        cp[nCand] = l;
        ct[nCand] = x;
        nCand++;
      }
    }
    // Dominance: by cost, then keep a label only if no cheaper-or-equal one has z ≥ it everywhere.
    const idx = Array.from({ length: nCand }, (_, i) => i).sort((i, j) => cc[i] - cc[j] || cz[j * H] - cz[i * H] || (H > 1 ? cz[j * H + 1] - cz[i * H + 1] : 0));
    const keep: number[] = [];
    if (H === 1) {
      let zmax = -Infinity;
      for (const i of idx) {
        if (cz[i] > zmax) {
          keep.push(i);
          zmax = cz[i];
        }
      }
    } else {
      // Staircase of kept (z0, z1): z0 descending, z1 ascending.
      const s0: number[] = [];
      const s1: number[] = [];
      for (const i of idx) {
        const a0 = cz[i * H];
        const a1 = cz[i * H + 1];
        // Dominated if some kept point has z0 ≥ a0 and z1 ≥ a1: the one with the smallest z0 ≥ a0 has the largest z1 among them.
        let lo = 0;
        let hi = s0.length;
        while (lo < hi) {
          const mid = (lo + hi) >> 1;
          if (s0[mid] >= a0) lo = mid + 1;
          else hi = mid;
        }
        if (lo > 0 && s1[lo - 1] >= a1) continue;
        keep.push(i);
        // Remove kept points it dominates (z0 ≤ a0 and z1 ≤ a1): they sit from `lo` on while z1 ≤ a1.
        let e = lo;
        while (e < s0.length && s1[e] <= a1) e++;
        s0.splice(lo, e - lo, a0);
        s1.splice(lo, e - lo, a1);
      }
    }
    if (keep.length > maxLabels) return null;
    const nc = new Float64Array(keep.length);
    const nz = new Float64Array(keep.length * H);
    const np = new Int32Array(keep.length);
    const nt = new Uint8Array(keep.length);
    keep.forEach((i, m2) => {
      nc[m2] = cc[i];
      for (let h = 0; h < H; h++) nz[m2 * H + h] = cz[i * H + h];
      np[m2] = cp[i];
      nt[m2] = ct[i];
    });
    labels += keep.length;
    parents.push(np);
    takes.push(nt);
    cost = nc;
    z = nz;
    if (cost.length === 0) break;
  }
  if (parents.length < K || cost.length === 0) {
    return inp.incumbent ? { on: inp.incumbent.on, cost: inp.incumbent.cost, labels } : null;
  }
  let bi = 0;
  for (let l = 1; l < cost.length; l++) if (cost[l] < cost[bi]) bi = l;
  if (inp.incumbent && !(cost[bi] < inp.incumbent.cost)) return { on: inp.incumbent.on, cost: inp.incumbent.cost, labels };
  const on = new Uint8Array(K);
  let l = bi;
  for (let k = K - 1; k >= 0; k--) {
    on[k] = takes[k][l];
    l = parents[k][l];
  }
  return { on, cost: cost[bi], labels };
}
