// The slot choice through the LP solver (javascript-lp-solver): the general form with the floor,
// and the reference the exact greedy and the branch and bound are checked against.
//
//   minimise Σ c_k·x_k  subject to  Σ_k A_jk·x_k ≥ need_j  (readiness at departure; the floor at
//   slot ends),  0 ≤ x_k ≤ 1   — or x_k ∈ {0, 1} with `integer`.
//
// Every A_jk ≥ 0 (heat never cools the oil in this model), so rounding a slot up never breaks a
// constraint: the LP solution rounded up is always a valid on/off plan.
import solver from 'javascript-lp-solver';

export interface CoverRow {
  /** Gain per slot (K when the slot is on). */
  a: ArrayLike<number>;
  need: number;
}

export interface LpSolution {
  feasible: boolean;
  x: Float64Array;
  /** Σ c_k·x_k of the returned x. */
  cost: number;
}

/** Solves the covering LP (or, with `integer`, the 0/1 programme) with javascript-lp-solver. */
export function solveCoverWithLpSolver(
  c: ArrayLike<number>,
  rows: readonly CoverRow[],
  opts: { integer?: boolean; relTol?: number; timeoutMs?: number } = {},
): LpSolution {
  const K = c.length;
  const x = new Float64Array(K);
  const live = rows.filter((r) => r.need > 0);
  if (live.length === 0) return { feasible: true, x, cost: 0 };
  // Scale for the solver's absolute tolerances: costs to ≤ 1, each row to need 1.
  let cmax = 0;
  for (let k = 0; k < K; k++) cmax = Math.max(cmax, Math.abs(c[k]));
  const cs = cmax > 0 ? 1 / cmax : 1;
  const constraints: Record<string, { min?: number; max?: number }> = {};
  const variables: Record<string, Record<string, number>> = {};
  live.forEach((_, j) => (constraints[`r${j}`] = { min: 1 }));
  for (let k = 0; k < K; k++) {
    const v: Record<string, number> = { cost: c[k] * cs };
    let useful = false;
    live.forEach((r, j) => {
      const coef = r.a[k] / r.need;
      if (coef > 0) {
        v[`r${j}`] = coef;
        useful = true;
      }
    });
    if (!useful) continue;
    constraints[`u${k}`] = { max: 1 };
    v[`u${k}`] = 1;
    variables[`x${k}`] = v;
  }
  const model: Parameters<typeof solver.Solve>[0] = {
    optimize: 'cost',
    opType: 'min',
    constraints,
    variables,
    ...(opts.integer
      ? {
          binaries: Object.fromEntries(Object.keys(variables).map((k) => [k, true])),
          options: { tolerance: opts.relTol ?? 0, timeout: opts.timeoutMs ?? 10_000 },
        }
      : {}),
  };
  const res = solver.Solve(model) as Record<string, number | boolean | undefined>;
  if (!res.feasible) return { feasible: false, x, cost: Infinity };
  let cost = 0;
  for (let k = 0; k < K; k++) {
    const v = res[`x${k}`];
    x[k] = typeof v === 'number' ? Math.min(1, Math.max(0, v)) : 0;
    cost += c[k] * x[k];
  }
  return { feasible: true, x, cost };
}

/** Σ_k A_jk·x_k ≥ need_j − tol for every row. */
export function meetsRows(rows: readonly CoverRow[], on: ArrayLike<number>, tol = 0): boolean {
  for (const r of rows) {
    let s = 0;
    for (let k = 0; k < on.length; k++) if (on[k]) s += r.a[k] * on[k];
    if (s < r.need - tol) return false;
  }
  return true;
}

/**
 * An on/off plan from an LP solution, for the rows of the floor (each row only feels the slots
 * before it):
 * 1. cumulative rounding in time order — slot k is on when round(Σ_{i≤k} x_i) steps up — so a
 *    stretch the LP holds at the floor with a fractional duty becomes on/off pulses of the same total;
 * 2. repair: while a row is unmet, turn on the slot that is cheapest per kelvin for the earliest
 *    unmet row (rounding up only ever raises every row: all gains are ≥ 0);
 * 3. improve: drop slots no longer needed (dearest first), then try "one off, one on" and
 *    "two off, one on" exchanges that lower the cost and keep every row, until none helps.
 */
export function roundCover(c: ArrayLike<number>, rows: readonly CoverRow[], x: ArrayLike<number>, maxPasses = 20): Uint8Array {
  const K = c.length;
  const J = rows.length;
  const on = new Uint8Array(K);
  let acc = 0;
  let prev = 0;
  for (let k = 0; k < K; k++) {
    acc += x[k];
    const r = Math.floor(acc + 0.5 - 1e-9);
    on[k] = r > prev ? 1 : 0;
    prev = Math.max(prev, r);
  }
  const slack = new Float64Array(J);
  const recompute = () => {
    for (let j = 0; j < J; j++) {
      let s = -rows[j].need;
      const a = rows[j].a;
      for (let k = 0; k < K; k++) if (on[k]) s += a[k];
      slack[j] = s;
    }
  };
  recompute();
  const set = (k: number, v: 0 | 1) => {
    if (on[k] === v) return;
    on[k] = v;
    const sign = v ? 1 : -1;
    for (let j = 0; j < J; j++) slack[j] += sign * rows[j].a[k];
  };
  // 2. Repair.
  for (;;) {
    let worst = -1;
    for (let j = 0; j < J; j++) if (slack[j] < 0 && (worst < 0 || slack[j] < slack[worst])) worst = j;
    if (worst < 0) break;
    const a = rows[worst].a;
    let pick = -1;
    for (let k = 0; k < K; k++) if (!on[k] && a[k] > 0 && (pick < 0 || c[k] / a[k] < c[pick] / a[pick])) pick = k;
    if (pick < 0) break; // infeasible rows: nothing left to turn on
    set(pick, 1);
  }
  const canRemove = (k: number) => {
    for (let j = 0; j < J; j++) if (slack[j] - rows[j].a[k] < 0) return false;
    return true;
  };
  const dropPass = () => {
    let changed = false;
    const ks = Array.from({ length: K }, (_, k) => k).filter((k) => on[k]).sort((i, j) => c[j] - c[i] || i - j);
    for (const k of ks) {
      if (canRemove(k)) {
        set(k, 0);
        changed = true;
      }
    }
    return changed;
  };
  // 3. Improve.
  for (let pass = 0; pass < maxPasses; pass++) {
    let improved = dropPass();
    const onK: number[] = [];
    const offK: number[] = [];
    for (let k = 0; k < K; k++) (on[k] ? onK : offK).push(k);
    // One off (i), one on (k): cheaper, and every row keeps slack ≥ 0.
    outer1: for (const i of onK) {
      for (const k of offK) {
        if (!(c[k] < c[i])) continue;
        let ok = true;
        for (let j = 0; j < J && ok; j++) ok = slack[j] - rows[j].a[i] + rows[j].a[k] >= 0;
        if (ok) {
          set(i, 0);
          set(k, 1);
          improved = true;
          break outer1;
        }
      }
    }
    if (!improved) {
      // Two off (i1, i2), one on (k).
      outer2: for (let p = 0; p < onK.length; p++) {
        for (let q = p + 1; q < onK.length; q++) {
          const i1 = onK[p];
          const i2 = onK[q];
          for (const k of offK) {
            if (!(c[k] < c[i1] + c[i2])) continue;
            let ok = true;
            for (let j = 0; j < J && ok; j++) ok = slack[j] - rows[j].a[i1] - rows[j].a[i2] + rows[j].a[k] >= 0;
            if (ok) {
              set(i1, 0);
              set(i2, 0);
              set(k, 1);
              improved = true;
              break outer2;
            }
          }
        }
      }
    }
    if (!improved) break;
  }
  return on;
}
