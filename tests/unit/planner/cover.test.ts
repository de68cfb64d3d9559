// The departure-only slot choice against the LP solver (javascript-lp-solver): the greedy is the
// covering LP's exact optimum, and the branch and bound is the 0/1 optimum (the solver's own
// branch and bound on binaries), on random instances.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { coverExact, coverRelaxation, solveCoverWithLpSolver } from '@/lib/planner';

/** Gains shaped like heater slots (rising towards departure), costs from a few tariff levels; need a share of the total. */
const instance = (maxK: number) =>
  fc
    .record({
      K: fc.integer({ min: 1, max: maxK }),
      tau: fc.double({ min: 2, max: 40, noNaN: true }),
      jitter: fc.array(fc.double({ min: 0.8, max: 1.2, noNaN: true }), { minLength: maxK, maxLength: maxK }),
      levels: fc.array(fc.double({ min: 0.05, max: 0.5, noNaN: true }), { minLength: 1, maxLength: 3 }),
      cuts: fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 2, maxLength: 2 }),
      share: fc.double({ min: 0.02, max: 1.1, noNaN: true }),
    })
    .map(({ K, tau, jitter, levels, cuts, share }) => {
      const a = Float64Array.from({ length: K }, (_, k) => Math.exp(-(K - 1 - k) / tau) * jitter[k]);
      const [c1, c2] = cuts.map((x) => Math.floor(x * K)).sort((x, y) => x - y);
      const c = Float64Array.from({ length: K }, (_, k) => levels[k < c1 ? 0 : k < c2 ? 1 % levels.length : 2 % levels.length]);
      const need = share * a.reduce((s, v) => s + v, 0);
      return { a, c, need };
    });

describe('coverRelaxation (exact greedy)', () => {
  it('equals the LP solver’s optimum of the continuous problem', () => {
    fc.assert(
      fc.property(instance(150), ({ a, c, need }) => {
        const g = coverRelaxation(a, c, need);
        const lp = solveCoverWithLpSolver(c, [{ a, need }]);
        expect(g.feasible).toBe(lp.feasible);
        if (!g.feasible) return;
        // The solver reports values to about 1e-8; the greedy is exact.
        expect(Math.abs(g.cost - lp.cost)).toBeLessThanOrEqual(1e-6 * Math.max(lp.cost, 1e-9) + 1e-9);
        expect(g.x.filter((x) => x > 1e-12 && x < 1 - 1e-12).length).toBeLessThanOrEqual(1);
      }),
      { numRuns: 60, seed: 1 },
    );
  });
});

describe('coverExact (branch and bound)', () => {
  it('matches the LP solver’s 0/1 optimum within 0.1 %, never below the LP bound, never above it by more than one slot', () => {
    fc.assert(
      fc.property(instance(18), ({ a, c, need }) => {
        const bb = coverExact(a, c, need);
        const milp = solveCoverWithLpSolver(c, [{ a, need }], { integer: true });
        expect(bb.feasible).toBe(milp.feasible);
        if (!bb.feasible) return;
        let gain = 0;
        bb.on.forEach((v, k) => (gain += v * a[k]));
        expect(gain).toBeGreaterThanOrEqual(need);
        expect(bb.cost).toBeLessThanOrEqual(milp.cost * 1.001 + 1e-12);
        expect(bb.cost).toBeGreaterThanOrEqual(bb.lpBound - 1e-12);
        // The LP's bound adjusted for slot rounding: rounding the one fractional slot up costs at most one slot.
        expect(bb.cost).toBeLessThanOrEqual(bb.lpBound + Math.max(...c) + 1e-12);
        expect(bb.certifiedGap).toBeLessThanOrEqual(1e-6);
      }),
      { numRuns: 60, seed: 2 },
    );
  });

  it('takes nothing when nothing is needed and reports an impossible need', () => {
    expect(coverExact([1, 2], [1, 1], 0).cost).toBe(0);
    expect(coverExact([1, 2], [1, 1], 3.5).feasible).toBe(false);
  });

  it('with equal costs takes the largest gains (the latest slots)', () => {
    const a = [0.1, 0.2, 0.3, 0.4, 0.5];
    const s = coverExact(a, [1, 1, 1, 1, 1], 0.85);
    expect(Array.from(s.on)).toEqual([0, 0, 0, 1, 1]);
  });
});
