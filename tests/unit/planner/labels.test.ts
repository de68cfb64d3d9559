// The floor's label DP against exhaustive enumeration of every on/off schedule (small instances),
// for one and two heated nodes.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { solveFloorDp, type DpRow } from '@/lib/planner/labels';

interface Inst {
  H: number;
  M: Float64Array[];
  g: Float64Array[];
  c: Float64Array;
  rows: DpRow[];
  /** Per row: the slot end index it is read at (end of `slot`). */
  K: number;
}

/** z after slot k for a schedule, and each row's value (rows read at their slot's end). */
function evaluate(inst: Inst, on: number[]): boolean {
  const { H, M, g, K } = inst;
  let z = new Float64Array(H);
  const zStart: Float64Array[] = [];
  for (let k = 0; k < K; k++) {
    zStart.push(z);
    const next = new Float64Array(H);
    for (let h = 0; h < H; h++) {
      next[h] = on[k] ? g[k][h] : 0;
      for (let q = 0; q < H; q++) next[h] += M[k][h * H + q] * z[q];
    }
    z = next;
  }
  return inst.rows.every((r) => {
    let v = on[r.slot] ? r.aSlot : 0;
    for (let h = 0; h < H; h++) v += r.coState[h] * zStart[r.slot][h];
    return v >= r.need;
  });
}

const inst = fc
  .record({
    H: fc.constantFrom(1, 2),
    K: fc.integer({ min: 2, max: 11 }),
    decay: fc.double({ min: 0.6, max: 0.99, noNaN: true }),
    couple: fc.double({ min: 0, max: 0.2, noNaN: true }),
    gains: fc.array(fc.double({ min: 0.1, max: 1, noNaN: true }), { minLength: 22, maxLength: 22 }),
    prices: fc.array(fc.constantFrom(1, 2, 3), { minLength: 11, maxLength: 11 }),
    needs: fc.array(fc.double({ min: -0.5, max: 2, noNaN: true }), { minLength: 11, maxLength: 11 }),
    readyNeed: fc.double({ min: 0.1, max: 3, noNaN: true }),
  })
  .map(({ H, K, decay, couple, gains, prices, needs, readyNeed }): Inst => {
    const M = Array.from({ length: K }, () => (H === 1 ? Float64Array.of(decay) : Float64Array.of(decay, couple, couple, decay * 0.95)));
    const g = Array.from({ length: K }, (_, k) => (H === 1 ? Float64Array.of(gains[k]) : Float64Array.of(gains[k], gains[k + 11] * 0.5)));
    const c = Float64Array.from({ length: K }, (_, k) => prices[k]);
    // Row at the end of slot j: coState = e_oilᵀ·M_j (the oil row of M), aSlot = g_j[oil].
    const row = (j: number, need: number): DpRow => ({ slot: j, coState: H === 1 ? [M[j][0]] : [M[j][0], M[j][1]], aSlot: g[j][0], need });
    const rows = needs.slice(0, K - 1).map((n, j) => row(j, n));
    rows.push(row(K - 1, readyNeed));
    return { H, M, g, c, rows, K };
  });

describe('solveFloorDp', () => {
  it('finds the cheapest schedule that meets every row, as exhaustive enumeration does', () => {
    fc.assert(
      fc.property(inst, (p) => {
        let best = Infinity;
        for (let mask = 0; mask < 1 << p.K; mask++) {
          const on = Array.from({ length: p.K }, (_, k) => (mask >> k) & 1);
          if (!evaluate(p, on)) continue;
          best = Math.min(best, on.reduce((s, v, k) => s + v * p.c[k], 0));
        }
        // The ready row's co-states at slot starts, for the bound: λ_T(start k) = e_oilᵀ·M_{K−1}⋯M_k.
        const lam = new Float64Array(p.K * p.H);
        let v = Float64Array.from({ length: p.H }, (_, h) => (h === 0 ? 1 : 0));
        for (let k = p.K - 1; k >= 0; k--) {
          const nv = new Float64Array(p.H);
          for (let q = 0; q < p.H; q++) for (let h = 0; h < p.H; h++) nv[q] += v[h] * p.M[k][h * p.H + q];
          v = nv;
          lam.set(v, k * p.H);
        }
        const ready = p.rows[p.rows.length - 1];
        // Gain at T from slot k on: λ_T(end k)·g_k, with λ_T(end k) = λ_T(start k+1) (e_oil for the last slot).
        const a = Float64Array.from({ length: p.K }, (_, k) => {
          let s = 0;
          for (let h = 0; h < p.H; h++) s += (k + 1 < p.K ? lam[(k + 1) * p.H + h] : h === 0 ? 1 : 0) * p.g[k][h];
          return s;
        });
        const dp = solveFloorDp({ H: p.H, M: p.M, g: p.g, c: p.c, rows: p.rows, ready: { a, coStateAtSlotStart: lam, need: ready.need } });
        if (best === Infinity) {
          expect(dp).toBeNull();
          return;
        }
        expect(dp).not.toBeNull();
        expect(dp!.cost).toBeCloseTo(best, 9);
        expect(evaluate(p, Array.from(dp!.on))).toBe(true);
      }),
      { numRuns: 150, seed: 31 },
    );
  });
});
