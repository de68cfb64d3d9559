// The honest chance: every error source propagated to the oil at departure, and plans that aim at a
// chance keep it when the truth is drawn from the same error model (coverage by simulation).
import { describe, expect, it } from 'vitest';
import { simulate, type SoakModel } from '@/lib/thermal';
import { withHeater, type PlanRequest } from '@/lib/planner';
import { chanceBreakdown, mixtureChance, oilForChance, planForChance, type ErrorModel } from '@/lib/planner/chance';
import { normalCdf } from '@/lib/planner/probability';
import { H, START } from './cases';

/** A seeded generator (mulberry32) and normal draws (Box–Muller), so the checks are repeatable. */
function rng(seed: number) {
  let a = seed >>> 0;
  const u = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return { u, n: () => Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u()) };
}

// A two-node engine on a tie-down through a cold night (inputs in the range of the class presets).
const model = (cover: boolean): SoakModel => ({
  startMs: START,
  endMs: START + 20 * H,
  outside: Array.from({ length: 21 }, (_, i) => ({ atMs: START + i * H, tempC: -8 - 0.6 * i })),
  shelter: { kind: 'tie-down' },
  oil: { heatCapacityJPerK: 4e4, lossWPerK: 4, initialTempC: 80 },
  engine: { heatCapacityJPerK: 1.2e5, lossWPerK: 9, initialTempC: 85 },
  couplingWPerK: 6,
  cover,
});
const DEPART = START + 15 * H;
const req = (m: SoakModel): PlanRequest => ({ model: m, departureMs: DEPART, readyC: 20, heater: { node: 'oil', powerW: 400 }, mode: 'single-start', nowMs: START, forecastIssuedAtMs: START });
const errors: ErrorModel = { lossRelSigma: 0.2, powerRelSigma: 0.08, coverOffProbability: 0.1 };

/** One draw of the truth: the outside shifted, losses and power scaled, the cover maybe off. */
function truthOil(m: SoakModel, on: PlanRequest['heater'], intervals: { fromMs: number; toMs: number }[], r: ReturnType<typeof rng>, sigmaOutsideK: number, withCover: boolean) {
  const shift = sigmaOutsideK * r.n();
  const g = Math.exp(errors.lossRelSigma * r.n());
  const p = Math.exp(errors.powerRelSigma * r.n());
  const truth: SoakModel = {
    ...m,
    outside: m.outside.map((o) => ({ ...o, tempC: o.tempC + shift })),
    oil: { ...m.oil, lossWPerK: m.oil.lossWPerK * g },
    engine: m.engine ? { ...m.engine, lossWPerK: m.engine.lossWPerK * g } : undefined,
    cover: withCover && m.cover ? r.u() >= errors.coverOffProbability : false,
  };
  return simulate(withHeater(truth, { node: on.node, powerW: on.powerW * p }, intervals), { atMs: [DEPART] }).oilC[0];
}

describe('the error budget', () => {
  it('the delta-method σ agrees with sampling the same sources within 10 %', () => {
    const m = model(false);
    const plan = planForChance(req(m), 0.9, errors);
    const b = plan.breakdown;
    expect(b.aircraftK).toBeGreaterThan(b.forecastK); // a preset aircraft: the model, not the forecast, dominates
    const r = rng(7);
    const sigmaOutsideK = plan.result.uncertainty.sigmaOutsideK;
    const oils = Array.from({ length: 1500 }, () => truthOil(m, req(m).heater, plan.result.heaterOn, r, sigmaOutsideK, false));
    const mean = oils.reduce((s, v) => s + v, 0) / oils.length;
    const sd = Math.sqrt(oils.reduce((s, v) => s + (v - mean) ** 2, 0) / (oils.length - 1));
    expect(Math.abs(b.sigmaK - sd) / sd).toBeLessThan(0.1);
  });

  it('the cover is a two-point mixture: its chance lies between the two normal chances', () => {
    const p = mixtureChance(25, 20, 3, 10, 0.1);
    expect(p).toBeCloseTo(0.9 * normalCdf(5 / 3) + 0.1 * normalCdf(-5 / 3), 12);
    expect(mixtureChance(oilForChance(0.9, 20, 3, 10, 0.1), 20, 3, 10, 0.1)).toBeCloseTo(0.9, 6);
  });

  it('outcome bias moves the expected oil and the chance', () => {
    const m = model(false);
    const on = [{ fromMs: DEPART - 4 * H, toMs: DEPART }];
    const base = chanceBreakdown({ model: m, heater: req(m).heater, heaterOn: on, departureMs: DEPART, readyC: 20, forecastSigmaK: 1, errors });
    const biased = chanceBreakdown({ model: m, heater: req(m).heater, heaterOn: on, departureMs: DEPART, readyC: 20, forecastSigmaK: 1, errors: { ...errors, biasK: -3, outcomeSigmaK: 2 } });
    expect(biased.expectedOilC).toBeCloseTo(base.expectedOilC - 3, 9);
    expect(biased.sigmaK).toBeGreaterThan(base.sigmaK);
    expect(biased.probabilityReady).toBeLessThan(base.probabilityReady);
  });
});

describe('coverage by simulation: plans at a stated chance are ready that often', () => {
  for (const [target, cover] of [
    [0.7, false],
    [0.9, false],
    [0.95, true],
  ] as const) {
    it(`${Math.round(target * 100)} % target${cover ? ' (cover usually on)' : ''}: the share ready lies in the 99.9 % binomial interval`, () => {
      const m = model(cover);
      const plan = planForChance(req(m), target, errors);
      expect(plan.meetsTarget).toBe(true);
      expect(plan.result.probabilityReady).toBeGreaterThanOrEqual(target - 1e-3);
      const r = rng(100 + Math.round(target * 100));
      const N = 1500;
      let ready = 0;
      for (let i = 0; i < N; i++) if (truthOil(m, req(m).heater, plan.result.heaterOn, r, plan.result.uncertainty.sigmaOutsideK, cover) >= 20) ready++;
      // Normal approximation to the binomial, z = 3.29 for 99.9 % two-sided; the planner aims a little
      // above the target (its switch-on steps), so the share may sit above it by a step's worth too.
      const p = plan.result.probabilityReady;
      const half = 3.29 * Math.sqrt((p * (1 - p)) / N);
      expect(ready / N).toBeGreaterThanOrEqual(target - half);
      expect(ready / N).toBeLessThanOrEqual(p + half + 0.02);
    });
  }
});
