import { describe, expect, it } from 'vitest';
import { simulate } from '@/lib/thermal';
import { oneNodeCurve } from '@/lib/fit/oneNode';
import { fitCooldown, fitOneNode, twoNodeTimeConstants, FitRefused, type FitData } from '@/lib/fit/cooldown';
import { syntheticOneNode, syntheticTwoNode } from '@/lib/fit/synthetic';
import { suggestWindow } from '@/lib/fit/window';

const START = Date.UTC(2026, 10, 30, 15, 40);
const H = 3600;

function data(tS: number[], y: ArrayLike<number>, ambient: ArrayLike<number> | null): FitData {
  return { t0Ms: START, tS: Float64Array.from(tS), y: Float64Array.from(y), ambient: ambient ? Float64Array.from(ambient) : null, rows: tS.length };
}

describe('the one-node solution over linear surroundings', () => {
  // docs/sources.md, linear surroundings T∞ = Ta + b·t: τ = 3 h, T0 = 20 °C, Ta = 5 °C, b = −1 K/h →
  // T(1 h) = 15.598 °C, T(3 h) = 9.415 °C, T(6 h) = 3.624 °C [derived; arithmetic checked].
  it('matches the published check values', () => {
    const tS = [0, 1 * H, 3 * H, 6 * H];
    const amb = tS.map((s) => 5 - s / H);
    const T = oneNodeCurve(tS, amb, 3 * H, 0, 20);
    expect(T[1]).toBeCloseTo(15.598, 3);
    expect(T[2]).toBeCloseTo(9.415, 3);
    expect(T[3]).toBeCloseTo(3.624, 3);
  });

  it('gives the same answer sampled finely or coarsely (exact per interval)', () => {
    const coarse = oneNodeCurve([0, 6 * H], [5, -1], 3 * H, 0, 20);
    const fineT = Array.from({ length: 361 }, (_, i) => i * 60);
    const fine = oneNodeCurve(fineT, fineT.map((s) => 5 - s / H), 3 * H, 0, 20);
    expect(fine[360]).toBeCloseTo(coarse[1], 10);
  });

  it('agrees with the soak model (lib/thermal, one node on a tie-down) over a piecewise-linear ambient', () => {
    const pts = [0, 1.5, 4, 7, 10].map((h) => START + h * H * 1000);
    const temps = [-2, -6, -7.5, -12, -11];
    const atMs = Array.from({ length: 101 }, (_, i) => START + i * 360_000);
    const sim = simulate(
      { startMs: atMs[0], endMs: atMs[100], outside: pts.map((atMs, i) => ({ atMs, tempC: temps[i] })), shelter: { kind: 'tie-down' }, oil: { heatCapacityJPerK: 90_000, lossWPerK: 10, initialTempC: 80 } },
      { atMs: [...new Set([...atMs, ...pts])].sort((a, b) => a - b) },
    );
    // Evaluate the closed form on the same breakpoints, then compare at the output times.
    const tS = Array.from(sim.atMs, (t) => (t - START) / 1000);
    const T = oneNodeCurve(tS, sim.outsideC, 9000, 0, 80);
    for (let i = 0; i < tS.length; i++) expect(T[i]).toBeCloseTo(sim.oilC[i], 6);
  });
});

describe('published cooling examples fitted back to their own time constant', () => {
  it('the linear-ambient check (τ = 3 h) from its own exact values', () => {
    // docs/sources.md linear-surroundings check [derived; arithmetic checked].
    const tS = Array.from({ length: 109 }, (_, i) => i * 300); // 9 h every 5 min
    const amb = tS.map((s) => 5 - s / H);
    const y = oneNodeCurve(tS, amb, 3 * H, 0, 20);
    const { fit } = fitOneNode(data(tS, y, amb), 1e5);
    expect(fit.tauH.value).toBeCloseTo(3, 4);
    expect(fit.level.value).toBeCloseTo(0, 4);
    expect(fit.startC.value).toBeCloseTo(20, 4);
    expect(fit.r2).toBeGreaterThan(0.999999);
  });

  it('Incropera Example 5.1: a thermocouple junction with τ = 1 s reaches 199 °C in a 200 °C gas after ≈ 5.16 s', () => {
    // docs/sources.md: τ = 1 s; from 25 °C to 199 °C in a 200 °C stream takes t = ln(175)·τ ≈ 5.16 s
    // [memory for the statement: Incropera, Example 5.1; arithmetic checked].
    const tS = Array.from({ length: 121 }, (_, i) => i * 0.05);
    const amb = tS.map(() => 200);
    const y = oneNodeCurve(tS, amb, 1, 0, 25);
    const { fit } = fitOneNode(data(tS, y, amb), 1, { tauMinH: 1e-6 });
    const tauS = fit.tauH.value * H;
    expect(tauS).toBeCloseTo(1, 4);
    expect(Math.log(175) * tauS).toBeCloseTo(5.16, 2);
    expect(oneNodeCurve([0, 5.16], [200, 200], tauS, 0, 25)[1]).toBeCloseTo(199, 1);
  });
});

describe('synthetic cool-downs from known parameters with noise', () => {
  const tauH = 2.4;
  const make = (noiseK: number, seed = 11, logAmbient = true) =>
    syntheticOneNode({ startMs: START, hours: 10, stepS: 60, noiseK, tauH, startC: 86, ambient: (h) => -4 - 0.7 * h + 0.5 * Math.sin(h), seed, logAmbient });

  it('recovers τ within 3 % and reports a wider uncertainty as the noise grows (logged ambient)', () => {
    let lastSigma = 0;
    for (const noise of [0.05, 0.2, 0.5, 1.0]) {
      const s = make(noise);
      const r = fitCooldown(s, { startMs: s.t[0], endMs: s.t[s.t.length - 1] }, { heatCapacityJPerK: 100_000, twoNode: false });
      expect(Math.abs(r.oneNode.tauH.value - tauH) / tauH).toBeLessThan(0.03);
      expect(r.oneNode.tauH.sigma).toBeGreaterThan(lastSigma);
      expect(r.oneNode.rmseK / noise).toBeGreaterThan(0.9);
      expect(r.oneNode.rmseK / noise).toBeLessThan(1.1);
      // G = C/τ and its uncertainty follow from τ's.
      expect(r.oneNode.lossWPerK.value).toBeCloseTo(100_000 / (r.oneNode.tauH.value * H), 6);
      expect(r.oneNode.lossWPerK.sigma / r.oneNode.lossWPerK.value).toBeCloseTo(r.oneNode.tauH.sigma / r.oneNode.tauH.value, 6);
      lastSigma = r.oneNode.tauH.sigma;
    }
  });

  it('recovers τ within 3 % with no ambient column (constant surroundings fitted)', () => {
    const s = syntheticOneNode({ startMs: START, hours: 9, stepS: 120, noiseK: 0.2, tauH, startC: 80, ambient: () => -8, seed: 5, logAmbient: false });
    const r = fitCooldown(s, { startMs: s.t[0], endMs: s.t[s.t.length - 1] }, { heatCapacityJPerK: 100_000, twoNode: false });
    expect(r.surroundings).toBe('constant');
    expect(Math.abs(r.oneNode.tauH.value - tauH) / tauH).toBeLessThan(0.03);
    expect(r.oneNode.level.value).toBeCloseTo(-8, 0);
  });

  it('the reported uncertainty is honest: across 20 noisy draws τ falls within 2σ of the truth in most', () => {
    let inside = 0;
    for (let seed = 1; seed <= 20; seed++) {
      const s = make(0.3, seed);
      const { fit } = fitOneNode({ t0Ms: s.t[0], tS: Float64Array.from(s.t, (t) => (t - s.t[0]) / 1000), y: s.oil, ambient: s.ambient, rows: s.t.length }, 1e5);
      if (Math.abs(fit.tauH.value - tauH) < 2 * fit.tauH.sigma) inside++;
    }
    expect(inside).toBeGreaterThanOrEqual(16); // ≈ 95 % expected
  });

  it('a one-node log does not support two nodes; a two-node log does, and its conductances come back', () => {
    const one = make(0.2);
    const r1 = fitCooldown(one, { startMs: one.t[0], endMs: one.t[one.t.length - 1] }, { heatCapacityJPerK: 58_000, oilHeatCapacityJPerK: 6_000, engineHeatCapacityJPerK: 52_000 });
    expect(r1.twoNode?.supported).toBe(false);
    expect(r1.recommended).toBe('one-node');

    const truth = { oilJPerK: 6100, engineJPerK: 52000, oilLossWPerK: 1.8, engineLossWPerK: 5, couplingWPerK: 3 };
    const two = syntheticTwoNode({ startMs: START, hours: 12, stepS: 60, noiseK: 0.1, startC: 88, ambient: (h) => -6 - 0.4 * h, seed: 3, ...truth });
    const r2 = fitCooldown(two, { startMs: two.t[0], endMs: two.t[two.t.length - 1] }, { heatCapacityJPerK: 58_100, oilHeatCapacityJPerK: truth.oilJPerK, engineHeatCapacityJPerK: truth.engineJPerK });
    expect(r2.twoNode?.supported).toBe(true);
    expect(r2.recommended).toBe('two-node');
    expect(r2.twoNode!.oilLossWPerK!.value).toBeCloseTo(1.8, 1);
    expect(r2.twoNode!.engineLossWPerK!.value).toBeCloseTo(5, 1);
    expect(Math.abs(r2.twoNode!.couplingWPerK!.value - 3) / 3).toBeLessThan(0.05);
    expect(r2.twoNode!.rmseK!).toBeLessThan(r2.oneNode.rmseK);
    const tc = twoNodeTimeConstants(truth.oilJPerK, truth.engineJPerK, 1.8, 5, 3);
    expect(r2.twoNode!.tauSlowH!).toBeCloseTo(tc.slowH, 1);
  });

  it('chart series are at most 400 points, data and curves side by side', () => {
    const s = make(0.2);
    const r = fitCooldown(s, { startMs: s.t[0], endMs: s.t[s.t.length - 1] }, { heatCapacityJPerK: 1e5, twoNode: false });
    expect(r.chart.tMs.length).toBeLessThanOrEqual(400);
    expect(r.chart.oneNodeC.length).toBe(r.chart.tMs.length);
    expect(r.chart.ambientC?.length).toBe(r.chart.tMs.length);
  });

  it('refuses a window with no real cool-down', () => {
    const s = syntheticOneNode({ startMs: START, hours: 5, stepS: 60, noiseK: 0.1, tauH, startC: -5, ambient: () => -5, seed: 2 });
    expect(() => fitCooldown(s, { startMs: s.t[0], endMs: s.t[s.t.length - 1] }, { heatCapacityJPerK: 1e5 })).toThrow(FitRefused);
    expect(() => fitCooldown(s, { startMs: s.t[0], endMs: s.t[5] }, { heatCapacityJPerK: 1e5 })).toThrow(/at least 8|30 minutes/);
  });
});

describe('suggesting the cool-down window', () => {
  it('starts at the peak after shutdown and ends where a heater warms the oil again', () => {
    const cool = syntheticOneNode({ startMs: START, hours: 8, stepS: 60, noiseK: 0.15, tauH: 2, startC: 85, ambient: () => -6, seed: 9 });
    // 30 minutes of warm-up before, 60 minutes of a heater after.
    const pre = Array.from({ length: 30 }, (_, i) => 70 + i * 0.5);
    const post = Array.from({ length: 60 }, (_, i) => cool.oil[cool.oil.length - 1] + i * 0.3);
    const n = pre.length + cool.t.length + post.length;
    const t = Float64Array.from({ length: n }, (_, i) => START - 30 * 60_000 + i * 60_000);
    const oil = Float64Array.from([...pre, ...cool.oil, ...post]);
    const w = suggestWindow({ t, oil, ambient: null, heater: null })!;
    expect(Math.abs(w.startIndex - 30)).toBeLessThanOrEqual(3);
    expect(w.endReason).toBe('rise');
    expect(w.endIndex).toBeGreaterThan(30 + cool.t.length - 30);
    expect(w.endIndex).toBeLessThanOrEqual(30 + cool.t.length + 2);
  });

  it('ends where a heater column says the heater came on', () => {
    const s = syntheticOneNode({ startMs: START, hours: 8, stepS: 60, noiseK: 0.1, tauH: 2, startC: 85, ambient: () => -6, seed: 4 });
    const heater = new Uint8Array(s.t.length);
    for (let i = 300; i < s.t.length; i++) heater[i] = 1;
    const w = suggestWindow({ ...s, heater })!;
    expect(w.endReason).toBe('heater');
    expect(w.endIndex).toBeLessThan(300);
  });

  it('finds nothing in a log that never cools', () => {
    const t = Float64Array.from({ length: 200 }, (_, i) => START + i * 60_000);
    expect(suggestWindow({ t, oil: Float64Array.from(t, () => 5), ambient: null, heater: null })).toBeNull();
  });
});
