// The departure-only slot choice: a 0/1 covering knapsack.
//
//   minimise Σ c_k·x_k  subject to  Σ a_k·x_k ≥ need,  x_k ∈ {0, 1}
//
// a_k is the oil rise at departure from slot k on (K), c_k its cost. Its continuous relaxation
// (0 ≤ x_k ≤ 1) is solved exactly by the greedy of the fractional knapsack: take slots by cost per
// kelvin c_k / a_k, cheapest first, the last one fractionally (Dantzig's bound). The on/off
// optimum is found by depth-first branch and bound on that order, with the greedy as the bound and
// one dominance rule: among slots of equal cost (same price and length) a plan never needs a
// smaller-gain slot while a larger-gain one is off, so each such group is taken as a prefix. The
// search stops once the incumbent is proven within `relTol` of the on/off optimum.

export interface CoverLp {
  feasible: boolean;
  /** x_k in [0, 1]; at most one fractional. */
  x: Float64Array;
  cost: number;
}

export interface CoverSolution {
  feasible: boolean;
  on: Uint8Array;
  cost: number;
  /** The relaxation's optimum (a lower bound on any on/off plan). */
  lpBound: number;
  /** Proven: (cost − on/off optimum) / cost ≤ certifiedGap. */
  certifiedGap: number;
  nodes: number;
}

/** Indices of useful slots (a > 0) by cost per kelvin, cheapest first; ties: larger gain first. */
function order(a: ArrayLike<number>, c: ArrayLike<number>): number[] {
  const idx: number[] = [];
  for (let k = 0; k < a.length; k++) if (a[k] > 0) idx.push(k);
  return idx.sort((i, j) => c[i] / a[i] - c[j] / a[j] || a[j] - a[i]);
}

/** The exact continuous optimum by the fractional-knapsack greedy. */
export function coverRelaxation(a: ArrayLike<number>, c: ArrayLike<number>, need: number): CoverLp {
  const x = new Float64Array(a.length);
  if (need <= 0) return { feasible: true, x, cost: 0 };
  let left = need;
  let cost = 0;
  for (const k of order(a, c)) {
    if (a[k] >= left) {
      x[k] = left / a[k];
      cost += c[k] * x[k];
      return { feasible: true, x, cost };
    }
    x[k] = 1;
    cost += c[k];
    left -= a[k];
  }
  return { feasible: false, x, cost };
}

/** The on/off optimum (within relTol, proven) by branch and bound. */
export function coverExact(
  a: ArrayLike<number>,
  c: ArrayLike<number>,
  need: number,
  opts: { relTol?: number; maxNodes?: number } = {},
): CoverSolution {
  const relTol = opts.relTol ?? 1e-9;
  const maxNodes = opts.maxNodes ?? 200_000;
  const K = a.length;
  const on = new Uint8Array(K);
  if (need <= 0) return { feasible: true, on, cost: 0, lpBound: 0, certifiedGap: 0, nodes: 0 };
  const idx = order(a, c);
  const n = idx.length;
  const A = new Float64Array(n);
  const C = new Float64Array(n);
  const group = new Int32Array(n);
  const groups = new Map<number, number>();
  for (let i = 0; i < n; i++) {
    A[i] = a[idx[i]];
    C[i] = c[idx[i]];
    let g = groups.get(C[i]);
    if (g === undefined) groups.set(C[i], (g = groups.size));
    group[i] = g;
  }
  const closed = new Uint8Array(groups.size);

  /** Greedy bound on the cost still needed to gain `left` from items i.. of open groups; Infinity if impossible. */
  const bound = (i: number, left: number): number => {
    let cost = 0;
    for (; i < n; i++) {
      if (closed[group[i]]) continue;
      if (A[i] >= left) return cost + (C[i] * left) / A[i];
      cost += C[i];
      left -= A[i];
    }
    return Infinity;
  };

  const root = bound(0, need);
  if (root === Infinity) return { feasible: false, on, cost: Infinity, lpBound: Infinity, certifiedGap: 0, nodes: 0 };

  // Incumbent: the greedy rounded up (the fractional slot taken whole), then slots it no longer
  // needs dropped, dearest first.
  const take = new Uint8Array(n);
  let left = need;
  let best = 0;
  for (let i = 0; i < n && left > 0; i++) {
    take[i] = 1;
    best += C[i];
    left -= A[i];
  }
  const byCost = Array.from({ length: n }, (_, i) => i).sort((i, j) => C[j] - C[i] || A[i] - A[j]);
  for (const i of byCost) {
    if (take[i] && left + A[i] <= 0) {
      take[i] = 0;
      best -= C[i];
      left += A[i];
    }
  }
  let bestTake = take.slice();

  const cur = new Uint8Array(n);
  let nodes = 0;
  let complete = true;
  const search = (i: number, cost: number, left: number): void => {
    if (++nodes > maxNodes) {
      complete = false;
      return;
    }
    while (i < n && closed[group[i]]) i++;
    if (i >= n) return;
    if (cost + bound(i, left) >= best * (1 - relTol)) return;
    // Take item i.
    cur[i] = 1;
    if (A[i] >= left) {
      if (cost + C[i] < best) {
        best = cost + C[i];
        bestTake = cur.slice();
      }
    } else {
      search(i + 1, cost + C[i], left - A[i]);
    }
    cur[i] = 0;
    if (!complete) return;
    // Leave it off, and with it the rest of its equal-cost group.
    const g = group[i];
    closed[g] = 1;
    search(i + 1, cost, left);
    closed[g] = 0;
  };
  search(0, 0, need);

  let cost = 0;
  for (let i = 0; i < n; i++) {
    if (bestTake[i]) {
      on[idx[i]] = 1;
      cost += C[i];
    }
  }
  return {
    feasible: true,
    on,
    cost,
    lpBound: root,
    certifiedGap: complete ? relTol : Math.max(0, (cost - root) / cost),
    nodes,
  };
}
