import { describe, expect, it } from 'vitest';
import { add, inv, matrix, multiply, subtract, transpose, type Matrix } from 'mathjs';
import { initialState, nowcastModel, plausibleReading, predict, transition, update, type NowcastEngine } from '@/lib/nowcast/kalman';

// Parameters: estimate (a two-node engine with time constants of two to three hours, as the presets).
const ENGINE: NowcastEngine = {
  oil: { heatCapacityJPerK: 15_000, lossWPerK: 2 },
  engine: { heatCapacityJPerK: 90_000, lossWPerK: 10 },
  couplingWPerK: 5,
};
const STEP_S = 300;
const NOISE = { processK2PerHour: 0.01, measurementK2: 0.04 };

/** Shelter air over a night: 2 °C falling to −8 °C over 10 h, then flat (invented for the test). */
function shelter(tS: number): number {
  return Math.max(-8, 2 - (10 * tS) / 36_000);
}

/** The truth: the same linear model stepped exactly (no filter), with a heater on the oil from 8 h. */
function truthRun(engine: NowcastEngine, steps: number) {
  const m = nowcastModel(engine);
  let s = initialState(m, [80, 75], 0);
  const out: Float64Array[] = [s.x];
  for (let k = 0; k < steps; k++) {
    const t0 = k * STEP_S;
    const powerW = t0 >= 8 * 3600 ? { oil: 200 } : {};
    s = predict(m, s, STEP_S, { shelterC0: shelter(t0), shelterC1: shelter(t0 + STEP_S), powerW }, { processK2PerHour: 0, measurementK2: 0 });
    out.push(s.x);
  }
  return out;
}

describe('Kalman nowcast', () => {
  it('tracks the truth to 0.05 K with noise-free oil readings of a simulated night', () => {
    const steps = 12 * 12;
    const truth = truthRun(ENGINE, steps);
    const m = nowcastModel(ENGINE);
    let s = initialState(m, [78, 70], 25); // started a few kelvin off
    let worst = 0;
    for (let k = 0; k < steps; k++) {
      const t0 = k * STEP_S;
      const powerW = t0 >= 8 * 3600 ? { oil: 200 } : {};
      s = predict(m, s, STEP_S, { shelterC0: shelter(t0), shelterC1: shelter(t0 + STEP_S), powerW }, NOISE);
      s = update(m, s, 'oil', truth[k + 1][0], NOISE.measurementK2);
      if (k >= 24) worst = Math.max(worst, Math.abs(s.x[0] - truth[k + 1][0]), Math.abs(s.x[1] - truth[k + 1][1]));
    }
    // ≤ 0.05 K: the tracking requirement (estimate of what a probe-corrected nowcast needs).
    expect(worst).toBeLessThanOrEqual(0.05);
  });

  it('with a biased model (losses 40 % too high) converges to the readings', () => {
    const steps = 12 * 12;
    const truth = truthRun(ENGINE, steps);
    const biased: NowcastEngine = {
      oil: { heatCapacityJPerK: 15_000, lossWPerK: 2.8 },
      engine: { heatCapacityJPerK: 90_000, lossWPerK: 14 },
      couplingWPerK: 5,
    };
    const m = nowcastModel(biased);
    let open = initialState(m, [80, 75], 0);
    let s = initialState(m, [80, 75], 1);
    const noise = { processK2PerHour: 2, measurementK2: 0.04 }; // model error taken as process noise
    let lastErr = 0;
    let openErr = 0;
    for (let k = 0; k < steps; k++) {
      const t0 = k * STEP_S;
      const u = { shelterC0: shelter(t0), shelterC1: shelter(t0 + STEP_S), powerW: t0 >= 8 * 3600 ? { oil: 200 } : {} };
      open = predict(m, open, STEP_S, u, noise);
      s = update(m, predict(m, s, STEP_S, u, noise), 'oil', truth[k + 1][0], noise.measurementK2);
      lastErr = Math.abs(s.x[0] - truth[k + 1][0]);
      openErr = Math.abs(open.x[0] - truth[k + 1][0]);
    }
    expect(openErr).toBeGreaterThan(3); // the model alone drifts away
    expect(lastErr).toBeLessThan(0.2); // the filter stays on the readings
  });

  it('steady-state gain equals the discrete algebraic Riccati solution (mathjs)', () => {
    // Standard result: for a detectable, stabilisable time-invariant system the Riccati recursion
    // P ← ΦPΦᵀ − ΦPHᵀ(HPHᵀ+R)⁻¹HPΦᵀ + Q converges to the DARE solution and the filter's gain to
    // K = PHᵀ(HPHᵀ+R)⁻¹ (Anderson & Moore, Optimal Filtering, 1979, ch. 4) — from memory.
    const m = nowcastModel(ENGINE);
    const { phi, Q } = transition(m, STEP_S, NOISE);
    const F = matrix([[phi[0], phi[1]], [phi[2], phi[3]]]);
    const Qm = matrix([[Q[0], Q[1]], [Q[2], Q[3]]]);
    const H = matrix([[1, 0]]);
    const R = matrix([[NOISE.measurementK2]]);
    let P: Matrix = matrix([[1, 0], [0, 1]]);
    for (let i = 0; i < 20_000; i++) {
      const S = add(multiply(multiply(H, P), transpose(H)), R) as Matrix;
      const PHt = multiply(P, transpose(H)) as Matrix;
      const corr = multiply(multiply(multiply(F, PHt), inv(S)), multiply(transpose(PHt), transpose(F))) as Matrix;
      const next = add(subtract(multiply(multiply(F, P), transpose(F)), corr), Qm) as Matrix;
      const diff = Math.max(...(subtract(next, P) as Matrix).toArray().flat().map((v) => Math.abs(v as number)));
      P = next;
      if (diff < 1e-15) break;
    }
    const S = add(multiply(multiply(H, P), transpose(H)), R) as Matrix;
    const Kdare = (multiply(multiply(P, transpose(H)), inv(S)) as Matrix).toArray().flat() as number[];

    let s = initialState(m, [10, 10], 1);
    let gain: Float64Array = new Float64Array(2);
    for (let k = 0; k < 2000; k++) {
      s = predict(m, s, STEP_S, { shelterC0: 0, shelterC1: 0 }, NOISE);
      const u = update(m, s, 'oil', 0, NOISE.measurementK2);
      gain = u.gain;
      s = u;
    }
    expect(gain[0]).toBeCloseTo(Kdare[0], 9);
    expect(gain[1]).toBeCloseTo(Kdare[1], 9);
  });

  it('flags impossible readings', () => {
    expect(plausibleReading(12)).toBe(true);
    expect(plausibleReading(Number.NaN)).toBe(false);
    expect(plausibleReading(850)).toBe(false);
  });
});
