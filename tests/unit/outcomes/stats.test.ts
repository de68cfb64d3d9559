import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rng } from '@/lib/fit/synthetic';
import { estimateBias, priorFor, reliability, summarizeErrors, updateNormalInvChi2, wilsonInterval, PRIOR_SIGMA_K } from '@/lib/outcomes/stats';

describe('Wilson score interval', () => {
  // docs/sources.md, Morning outcomes: Wilson (1927), JASA 22:209–212; check values from memory
  // (Newcombe 1998, Statistics in Medicine 17:857–872, Table I, 95 %, no continuity correction).
  it.each([
    [81, 263, 0.2553, 0.3662],
    [15, 148, 0.0624, 0.1605],
    [0, 20, 0, 0.1611],
    [1, 29, 0.0061, 0.1718],
  ])('%i of %i → %f–%f', (k, n, lo, hi) => {
    const w = wilsonInterval(k, n);
    expect(w.lo).toBeCloseTo(lo, 4);
    expect(w.hi).toBeCloseTo(hi, 4);
  });

  it('always holds the observed share and stays within [0, 1]', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 500 }), fc.double({ min: 0, max: 1, noNaN: true }), (n, f) => {
        const k = Math.round(f * n);
        const w = wilsonInterval(k, n);
        return w.lo >= 0 && w.hi <= 1 && w.lo <= k / n + 1e-12 && w.hi >= k / n - 1e-12;
      }),
    );
  });
});

describe('Normal–scaled-inverse-χ² update (Gelman et al., BDA3 §3.3; docs/sources.md, Morning outcomes)', () => {
  it('without mornings gives the class prior: zero bias, the preset σ', () => {
    const e = estimateBias([], 'preset');
    expect(e.biasK).toBe(0);
    expect(e.sigmaK).toBeCloseTo(PRIOR_SIGMA_K.preset, 12);
    expect(e.n).toBe(0);
  });

  it('matches the published formulas on a hand-worked case', () => {
    // Prior μ₀ = 0, κ₀ = 2, ν₀ = 4, σ₀² = 16; data 1, 3 (ȳ = 2, (n−1)s² = 2):
    // κ = 4, ν = 6, μ = 4/4 = 1, νσ² = 64 + 2 + 2·2·4/4 = 70 → σ² = 70/6. [derived from BDA3 §3.3]
    const p = updateNormalInvChi2(priorFor('preset'), [1, 3]);
    expect(p.kappa).toBe(4);
    expect(p.nu).toBe(6);
    expect(p.mu).toBeCloseTo(1, 12);
    expect(p.sigma2).toBeCloseTo(70 / 6, 12);
  });

  it('one batch equals one morning at a time (a conjugate update is coherent)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -20, max: 20, noNaN: true }), { minLength: 1, maxLength: 30 }), (ys) => {
        const batch = updateNormalInvChi2(priorFor('preset'), ys);
        const step = ys.reduce((p, y) => updateNormalInvChi2(p, [y]), priorFor('preset'));
        const close = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
        return close(batch.mu, step.mu) && close(batch.sigma2, step.sigma2) && batch.kappa === step.kappa && batch.nu === step.nu;
      }),
    );
  });

  it('a few mornings are shrunk towards zero bias; a fitted aircraft starts narrower', () => {
    const few = [5, 6, 4];
    const e = estimateBias(few, 'preset');
    expect(e.biasK).toBeGreaterThan(0);
    expect(e.biasK).toBeLessThan(5); // the raw mean is 5
    expect(estimateBias([], 'fitted').predictiveSigmaK).toBeLessThan(estimateBias([], 'preset').predictiveSigmaK);
  });

  // Synthetic mornings with a known bias and noise (seeded): the estimates converge as n grows.
  // Tolerances: at n = 2000 the bias within 0.35 K (over 3.5 standard errors σ/√n for every σ here) and
  // σ within 8 % (the prior's pull, ν₀σ₀² + κ₀ȳ²·n/κₙ over νₙ, is then under 4 % of σ² at σ = 1 K).
  it.each([
    [2.5, 1.5, 11],
    [-3, 2, 12],
    [0, 4, 13],
    [6, 1, 14],
  ])('bias %f K, σ %f K: the estimates converge', (bias, sigma, seed) => {
    const r = rng(seed);
    const ys = Array.from({ length: 2000 }, () => bias + sigma * r.normal());
    const at = (n: number) => estimateBias(ys.slice(0, n), 'preset');
    const eN = at(2000);
    expect(Math.abs(eN.biasK - bias)).toBeLessThan(0.35);
    expect(Math.abs(eN.sigmaK / sigma - 1)).toBeLessThan(0.08);
    // The bias's uncertainty narrows with n, and the error in the bias shrinks from 5 to 400 mornings.
    expect(eN.biasSdK).toBeLessThan(at(20).biasSdK);
    expect(at(20).biasSdK).toBeLessThan(at(5).biasSdK);
    expect(Math.abs(at(2000).biasK - bias)).toBeLessThanOrEqual(Math.abs(at(5).biasK - bias) + 0.2);
    // The predictive σ approaches the noise σ from the prior's side.
    expect(Math.abs(eN.predictiveSigmaK / sigma - 1)).toBeLessThan(0.08);
  });
});

describe('error summary and reliability', () => {
  it('mean, spread and mean absolute error', () => {
    const s = summarizeErrors([1, -1, 3]);
    expect(s.meanK).toBeCloseTo(1, 12);
    expect(s.sdK).toBeCloseTo(2, 12);
    expect(s.maeK).toBeCloseTo(5 / 3, 12);
    expect(summarizeErrors([]).meanK).toBeNull();
  });

  it('groups by stated chance and counts the mornings that were ready', () => {
    const rows = reliability([
      { probabilityReady: 0.95, recordedC: 20, readyC: 15 },
      { probabilityReady: 1, recordedC: 10, readyC: 15 },
      { probabilityReady: 0.9, recordedC: 16, readyC: 15 },
      { probabilityReady: 0.75, recordedC: 15, readyC: 15 },
      { probabilityReady: 0.5, recordedC: 12, readyC: 15 },
      { probabilityReady: 0.2, recordedC: 9, readyC: 15 },
    ]);
    expect(rows.map((r) => [r.label, r.n, r.ready])).toEqual([
      ['under 50 %', 1, 0],
      ['50–70 %', 1, 0],
      ['70–90 %', 1, 1],
      ['90–100 %', 3, 2],
    ]);
    const top = rows[3];
    expect(top.share).toBeCloseTo(2 / 3, 12);
    const w = wilsonInterval(2, 3);
    expect(top.lo).toBeCloseTo(w.lo, 12);
    expect(top.hi).toBeCloseTo(w.hi, 12);
    expect(top.meanStated).toBeCloseTo((0.95 + 1 + 0.9) / 3, 12);
  });

  it('a well-calibrated chance lands inside its interval (seeded)', () => {
    const r = rng(99);
    const outs = Array.from({ length: 600 }, () => {
      const p = 0.5 + 0.5 * r.uniform();
      return { probabilityReady: p, recordedC: r.uniform() < p ? 20 : 10, readyC: 15 };
    });
    for (const row of reliability(outs).slice(1)) {
      expect(row.n).toBeGreaterThan(50);
      expect(row.meanStated!).toBeGreaterThanOrEqual(row.lo! - 0.02);
      expect(row.meanStated!).toBeLessThanOrEqual(row.hi! + 0.02);
    }
  });
});
