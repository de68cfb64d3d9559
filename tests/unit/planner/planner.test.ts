// planDeparture on random physical nights: against the LP solver, re-simulated through lib/thermal,
// against the closed-form shortest block, and for its baselines, fix and probability.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { heaterResponse, type SoakModel } from '@/lib/thermal';
import { forecastSigmaK } from '@/lib/weather/derive';
import { planDeparture, probabilityReady, slotGrid, solveCoverWithLpSolver, type PlanRequest } from '@/lib/planner';
import { caseArb, H, oilWith, sampledMinimum, START, type Case } from './cases';

const request = (c: Case, over: Partial<PlanRequest> = {}): PlanRequest => ({
  model: c.model,
  departureMs: c.departureMs,
  readyC: c.readyC,
  heater: c.heater,
  tariff: c.tariff,
  mode: 'least-cost',
  ...over,
});

/** The same problem built independently (forward heaterResponse of lib/thermal) and solved by the LP solver. */
function solverProblem(c: Case, slotMinutes: number, readyC: number) {
  const slots = slotGrid(c.model.startMs, c.departureMs, slotMinutes * 60_000);
  const r = heaterResponse(c.model, { node: c.heater.node, slots, atMs: c.departureMs });
  const a = Array.from(r.perWattK, (w) => w * c.heater.powerW);
  const price = (t0: number, t1: number) => {
    let s = 0;
    for (const p of c.tariff) s += Math.max(0, Math.min(t1, p.toMs) - Math.max(t0, p.fromMs)) * p.pricePerKWh;
    return s / (t1 - t0);
  };
  const cost = slots.map((s) => (c.heater.powerW * (s.toMs - s.fromMs)) / 3.6e9 * price(s.fromMs, s.toMs));
  return { slots, a, cost, need: readyC - r.baseOilC };
}

describe('least-cost plans against the LP solver', () => {
  it('5-minute slots: within one slot of the LP optimum (the LP bound adjusted for slot rounding), never below it on the pure slot grid; the on/off plan proven within 1e-6 of the on/off optimum, and the 1-minute switch-on never dearer', () => {
    fc.assert(
      fc.property(caseArb(), (c) => {
        const plan = planDeparture(request(c));
        if (plan.status !== 'warming') return;
        const p = solverProblem(c, 5, plan.targetC);
        const lp = solveCoverWithLpSolver(p.cost, [{ a: p.a, need: p.need }]);
        expect(lp.feasible).toBe(true);
        const slotCost = Math.max(...p.cost);
        // A switch-on inside a slot puts the heat at the slot's end, a little more effective than the
        // LP's pro-rata slot: the plan may beat the LP by a few per cent of one slot, no more.
        expect(plan.cost!).toBeGreaterThanOrEqual(lp.cost - 0.05 * slotCost);
        expect(plan.cost!).toBeLessThanOrEqual(lp.cost + slotCost + 1e-9);
        // On the pure slot grid: never below the LP optimum.
        const grid = planDeparture(request(c, { switchOnStepMinutes: 5 }));
        expect(grid.cost!).toBeGreaterThanOrEqual(lp.cost * (1 - 1e-6));
        expect(grid.cost!).toBeLessThanOrEqual(lp.cost + slotCost + 1e-9);
        expect(plan.cost!).toBeLessThanOrEqual(grid.cost! + 1e-12);
        // The planner's own relaxation (the exact greedy) is the solver's optimum.
        expect(plan.optimality!.lpBound).toBeCloseTo(lp.cost, 6);
        expect(plan.optimality!.certifiedGap).toBeLessThanOrEqual(1e-6);
      }),
      { numRuns: 30, seed: 11 },
    );
  });

  it('30-minute slots: the plan is within 0.1 % of the LP solver’s 0/1 optimum', () => {
    fc.assert(
      fc.property(caseArb({ hours: [8, 11] }), (c) => {
        const plan = planDeparture(request(c, { slotMinutes: 30 }));
        if (plan.status !== 'warming') return;
        const p = solverProblem(c, 30, plan.targetC);
        const milp = solveCoverWithLpSolver(p.cost, [{ a: p.a, need: p.need + 1e-7 }], { integer: true });
        expect(milp.feasible).toBe(true);
        expect(plan.cost!).toBeLessThanOrEqual(milp.cost * 1.001 + 1e-12);
      }),
      { numRuns: 25, seed: 12 },
    );
  });
});

/** The free oil at departure: floors a little above it bind for the last hours of the night. */
const freeAt = (c: Case) => oilWith(c.model, c.heater, [], c.departureMs);

describe('every plan, re-simulated through lib/thermal', () => {
  it('meets the ready temperature at departure, or is short with the heater on throughout', () => {
    fc.assert(
      fc.property(caseArb(), fc.constantFrom('least-cost' as const, 'single-start' as const), (c, mode) => {
        const plan = planDeparture(request(c, { mode }));
        const oil = oilWith(c.model, c.heater, plan.heaterOn, c.departureMs);
        expect(plan.oilAtDepartureC).toBeCloseTo(oil, 9);
        expect(plan.predictedOilAtDepartureC).toBeCloseTo(oil, 6);
        if (plan.status === 'short') {
          expect(plan.heaterOn).toEqual([{ fromMs: plan.earliestSwitchOnMs, toMs: c.departureMs }]);
          expect(oil).toBeLessThan(c.readyC);
        } else {
          expect(oil).toBeGreaterThanOrEqual(c.readyC - 1e-6);
        }
        if (plan.status === 'ready') expect(plan.heaterOn).toEqual([]);
      }),
      { numRuns: 40, seed: 13 },
    );
  });

  it('with a floor: meets it at every moment from where it is enforced to departure (sampled every 30 s)', () => {
    fc.assert(
      fc.property(caseArb({ hours: [8, 12] }), fc.double({ min: 0.5, max: 8, noNaN: true }), fc.double({ min: 0, max: 5, noNaN: true }), (c, delta, above) => {
        const floorC = freeAt(c) + delta;
        const plan = planDeparture(request(c, { floorC, slotMinutes: 15, readyC: floorC + above }));
        if (plan.status === 'short') return;
        const min = sampledMinimum(c.model, c.heater, plan.heaterOn, plan.floor!.enforcedFromMs, c.departureMs);
        expect(min).toBeGreaterThanOrEqual(floorC - 1e-4);
        expect(plan.floor!.met).toBe(true);
        expect(oilWith(c.model, c.heater, plan.heaterOn, c.departureMs)).toBeGreaterThanOrEqual(plan.readyC - 1e-6);
      }),
      { numRuns: 25, seed: 14 },
    );
  });

  it('with a floor: within 0.1 % of the LP solver’s 0/1 optimum (floor rows at slot ends)', () => {
    fc.assert(
      fc.property(caseArb({ hours: [8, 10] }), fc.double({ min: 0.5, max: 8, noNaN: true }), fc.double({ min: 0, max: 5, noNaN: true }), (c, delta, above) => {
        const floorC = freeAt(c) + delta;
        const readyC = floorC + above;
        const plan = planDeparture(request(c, { floorC, slotMinutes: 30, readyC }));
        if (plan.status !== 'warming' || plan.floor!.breachBeforeHeat) return;
        const slots = slotGrid(c.model.startMs, c.departureMs, 30 * 60_000);
        const r = heaterResponse(c.model, { node: c.heater.node, slots, atMs: c.departureMs });
        const P = c.heater.powerW;
        const rows = [{ a: Array.from(r.perWattK, (w) => w * P), need: plan.targetC + 1e-7 - r.baseOilC }];
        r.slotEnds.baseOilC.forEach((b, j) => rows.push({ a: Array.from(r.slotEnds.perWattK[j], (w) => w * P), need: floorC + 1e-7 - b }));
        const p = solverProblem(c, 30, plan.targetC);
        const milp = solveCoverWithLpSolver(p.cost, rows, { integer: true });
        expect(milp.feasible).toBe(true);
        // The planner also holds the floor between slot ends, so it may need more than the solver's slot-end programme, never less.
        expect(plan.cost!).toBeGreaterThanOrEqual(milp.cost * (1 - 1e-6));
        if (plan.floor!.dipRows === 0) {
          expect(plan.cost!).toBeLessThanOrEqual(milp.cost * 1.001 + 1e-12);
        }
      }),
      { numRuns: 25, seed: 15 },
    );
  });
});

describe('the usual rules beside the plan', () => {
  it('the all-night rule always costs more energy than the least-cost plan (or the same when the plan runs all night)', () => {
    fc.assert(
      fc.property(caseArb(), (c) => {
        const plan = planDeparture(request(c));
        const all = plan.baselines.allNight;
        expect(all.energyKWh).toBeGreaterThanOrEqual(plan.energyKWh - 1e-12);
        if (plan.status === 'warming') expect(all.energyKWh).toBeGreaterThan(plan.energyKWh);
        expect(all.saved.energyKWh).toBeCloseTo(all.energyKWh - plan.energyKWh, 12);
        expect(all.saved.cost!).toBeCloseTo(all.cost! - plan.cost!, 12);
        // Each rule re-simulated.
        for (const b of [all, ...plan.baselines.hoursBefore]) {
          const oil = oilWith(c.model, c.heater, [{ fromMs: b.fromMs, toMs: b.toMs }], c.departureMs);
          expect(b.oilAtDepartureC).toBeCloseTo(oil, 9);
          expect(b.meetsReady).toBe(oil >= c.readyC - 1e-5);
          expect(b.energyKWh).toBeCloseTo((c.heater.powerW * (b.toMs - b.fromMs)) / 3.6e9, 12);
        }
        expect(plan.baselines.hoursBefore.map((b) => b.hours)).toEqual([1, 2, 3, 4]);
      }),
      { numRuns: 30, seed: 16 },
    );
  });

  it('a rule wanting an earlier start than the earliest switch-on is clipped there', () => {
    const c = fc.sample(caseArb(), { numRuns: 1, seed: 3 })[0];
    const earliest = c.departureMs - 2.5 * H;
    const plan = planDeparture(request(c, { earliestSwitchOnMs: earliest }));
    const [h1, h2, h3, h4] = plan.baselines.hoursBefore;
    expect([h1.clipped, h2.clipped, h3.clipped, h4.clipped]).toEqual([false, false, true, true]);
    expect(h3.fromMs).toBe(earliest);
    expect(plan.baselines.allNight.fromMs).toBe(earliest);
  });
});

// One node on a tie-down with constant outside air, oil already at outside temperature: the
// textbook lumped case. Oil under constant power P: T(t) = Teq + (T0 − Teq)·e^(−t/τ), τ = C/G,
// Teq = T∞ + P/G (Incropera §5.1–5.2; Çengel §4-1); the shortest run ending at departure is
// d = τ·ln((Teq − Tstart)/(Teq − Tready)) (docs/sources.md, derived).
function lumped(C: number, G: number, outC: number): SoakModel {
  return {
    startMs: START,
    endMs: START + 24 * H,
    outside: [{ atMs: START, tempC: outC }],
    shelter: { kind: 'tie-down' },
    oil: { heatCapacityJPerK: C, lossWPerK: G, initialTempC: outC },
  };
}

describe('the closed-form shortest block (constant outside, one node)', () => {
  const cases = [
    { C: 60_000, G: 8, outC: -10, P: 300, readyC: 15, slot: 5 },
    { C: 100_000, G: 5, outC: -20, P: 500, readyC: 20, slot: 15 },
    { C: 30_000, G: 12, outC: 0, P: 250, readyC: 12, slot: 10 },
  ];
  for (const k of cases) {
    const tau = (k.C / k.G) * 1000; // ms
    const Teq = k.outC + k.P / k.G;
    const d = tau * Math.log((Teq - k.outC) / (Teq - k.readyC));
    const T = START + 16 * H;
    it(`single-start: latest switch-on = departure − d exactly (to 10 ms; bisection on the re-simulated model); the timer's switch-on within one step (1 min), or one slot on a pure slot grid (τ = ${(tau / H).toFixed(2)} h)`, () => {
      const req: PlanRequest = { model: lumped(k.C, k.G, k.outC), departureMs: T, readyC: k.readyC, heater: { node: 'oil', powerW: k.P }, mode: 'single-start', slotMinutes: k.slot };
      const plan = planDeparture(req);
      expect(Math.abs(plan.latestSwitchOnAtMs! - (T - d))).toBeLessThan(10);
      expect(plan.switchOnAtMs).toBe(T - Math.ceil(d / 60_000) * 60_000);
      expect(plan.heaterOn).toEqual([{ fromMs: plan.switchOnAtMs, toMs: T }]);
      const slot = k.slot * 60_000;
      const grid = planDeparture({ ...req, switchOnStepMinutes: k.slot });
      expect(grid.switchOnAtMs).toBe(T - Math.ceil(d / slot) * slot);
      expect(grid.switchOnAtMs!).toBeLessThanOrEqual(grid.latestSwitchOnAtMs!);
      expect(grid.latestSwitchOnAtMs! - grid.switchOnAtMs!).toBeLessThan(slot);
    });
    it(`least-cost with a flat price is that block: the last ceil(d/slot) slots before departure on a pure ${k.slot}-minute grid, and d to the minute with the default switch-on step`, () => {
      const slot = k.slot * 60_000;
      const req: PlanRequest = { model: lumped(k.C, k.G, k.outC), departureMs: T, readyC: k.readyC, heater: { node: 'oil', powerW: k.P }, mode: 'least-cost', slotMinutes: k.slot, flatPricePerKWh: 0.2 };
      const grid = planDeparture({ ...req, switchOnStepMinutes: k.slot });
      expect(grid.heaterOn).toEqual([{ fromMs: T - Math.ceil(d / slot) * slot, toMs: T }]);
      expect(grid.cost).toBeCloseTo(((k.P * Math.ceil(d / slot) * slot) / 3.6e9) * 0.2, 12);
      const fine = planDeparture(req);
      expect(fine.heaterOn).toEqual([{ fromMs: T - Math.ceil(d / 60_000) * 60_000, toMs: T }]);
      expect(fine.optimality!.switchOn).toBe('finer-step');
      // Within one minute of heat of the continuous optimum P·d.
      expect(fine.energyKWh - (k.P * d) / 3.6e9).toBeLessThan((k.P * 60_000) / 3.6e9);
      expect(fine.energyKWh).toBeGreaterThanOrEqual((k.P * d) / 3.6e9);
    });
  }
});

describe('short plans and what would fix them', () => {
  it('constant outside, one node: the oil reaches ready at earliest + d with the heater kept on, and the power needed is exact', () => {
    const C = 60_000;
    const G = 8;
    const outC = -10;
    const P = 300;
    const readyC = 15;
    const T = START + 10 * H;
    const earliest = T - 1 * H;
    const tau = (C / G) * 1000;
    const Teq = outC + P / G;
    const d = tau * Math.log((Teq - outC) / (Teq - readyC)); // ≈ 1.98 h > 1 h available
    const req: PlanRequest = { model: lumped(C, G, outC), departureMs: T, readyC, heater: { node: 'oil', powerW: P }, mode: 'least-cost', earliestSwitchOnMs: earliest };
    const plan = planDeparture(req);
    expect(plan.status).toBe('short');
    expect(Math.abs(plan.fix!.readyAtMs! - (earliest + d))).toBeLessThan(5);
    // P·(1 − e^(−1 h/τ))/G = ready − out → the power for a one-hour run.
    const need = ((readyC - outC) * G) / (1 - Math.exp(-H / tau));
    expect(plan.fix!.powerNeededW).toBe(Math.ceil(need));
    expect(planDeparture({ ...req, heater: { node: 'oil', powerW: plan.fix!.powerNeededW! } }).status).toBe('warming');
    expect(planDeparture({ ...req, heater: { node: 'oil', powerW: plan.fix!.powerNeededW! - 2 } }).status).toBe('short');
  });

  it('no ready time when the heater can never get there (Teq < ready)', () => {
    const plan = planDeparture({ model: lumped(60_000, 8, -10), departureMs: START + 10 * H, readyC: 15, heater: { node: 'oil', powerW: 100 }, mode: 'least-cost' });
    expect(plan.status).toBe('short');
    expect(plan.fix!.readyAtMs).toBeNull();
    expect(plan.fix!.powerNeededW!).toBeGreaterThan(200);
  });

  it('on random nights: the power needed turns a short plan into a warming one', () => {
    fc.assert(
      fc.property(caseArb(), (c) => {
        const plan = planDeparture(request(c, { readyC: c.readyC + 10 }));
        if (plan.status !== 'short') return;
        const fixed = planDeparture(request(c, { readyC: c.readyC + 10, heater: { ...c.heater, powerW: plan.fix!.powerNeededW! } }));
        expect(fixed.status).toBe('warming');
        if (plan.fix!.readyAtMs !== null) {
          const keptOn = oilWith({ ...c.model, endMs: plan.fix!.readyAtMs + H }, c.heater, [{ fromMs: plan.earliestSwitchOnMs, toMs: plan.fix!.readyAtMs + H }], plan.fix!.readyAtMs);
          expect(keptOn).toBeCloseTo(c.readyC + 10, 4);
        }
      }),
      { numRuns: 25, seed: 17 },
    );
  });
});

describe('the chance of being ready', () => {
  it('is 0.5 when the prediction equals the ready temperature, and falls as readyC rises', () => {
    expect(probabilityReady(15, 15, 1.3)).toBe(0.5);
    // Φ(1) = 0.8413 (standard normal table).
    expect(probabilityReady(16.3, 15, 1.3)).toBeCloseTo(0.841345, 5);
    // A night whose oil at departure still feels the outside air.
    const c = fc.sample(caseArb(), { numRuns: 20, seed: 5 }).find((x) => planDeparture(request(x, { readyC: -90 })).uncertainty.sigmaOilK > 0.1)!;
    const first = planDeparture(request(c, { readyC: -90 }));
    const free = first.freeOilAtDepartureC;
    const sigma = first.uncertainty.sigmaOilK;
    // No heat needed: P = Φ((free − ready)/σ), falling as readyC rises towards the prediction.
    const ks = [2, 1, 0.5, 0.25, 0.01];
    const ps = ks.map((k) => planDeparture(request(c, { readyC: free - k * sigma })));
    ps.forEach((p, i) => {
      expect(p.status).toBe('ready');
      expect(p.probabilityReady).toBeCloseTo(probabilityReady(free, free - ks[i] * sigma, sigma), 12);
    });
    for (let i = 1; i < ps.length; i++) expect(ps[i].probabilityReady).toBeLessThan(ps[i - 1].probabilityReady);
    expect(ps[ps.length - 1].probabilityReady).toBeCloseTo(0.5, 2);
    expect(planDeparture(request(c, { readyC: free + 5 })).probabilityReady).toBeGreaterThanOrEqual(0.5);
  });

  it('σ_oil = |∂oil/∂(uniform shift)| × σ(lead) with the forecast error of lib/weather (docs/sources.md "Forecast data", from memory)', () => {
    const c = fc.sample(caseArb(), { numRuns: 1, seed: 6 })[0];
    const now = START + 2 * H;
    const plan = planDeparture(request(c, { nowMs: now }));
    const lead = (c.departureMs - now) / H;
    expect(plan.uncertainty.leadHours).toBeCloseTo(lead, 12);
    expect(plan.uncertainty.sigmaOutsideK).toBe(forecastSigmaK(lead));
    const shifted = { ...c.model, outside: c.model.outside.map((p) => ({ ...p, tempC: p.tempC + 1 })) };
    const s = oilWith(shifted, c.heater, plan.heaterOn, c.departureMs) - plan.oilAtDepartureC;
    expect(plan.uncertainty.sensitivityKPerK).toBeCloseTo(s, 8);
    expect(plan.uncertainty.sigmaOilK).toBeCloseTo(Math.abs(s) * forecastSigmaK(lead), 8);
    // Correlated per-hour errors never exceed the fully correlated uniform shift with the largest σ.
    const perHour = planDeparture(request(c, { nowMs: now, uncertainty: { correlationHours: 6 } }));
    expect(perHour.uncertainty.method).toBe('per-hour');
    expect(perHour.uncertainty.sigmaOilK).toBeGreaterThan(0);
    expect(perHour.uncertainty.sigmaOilK).toBeLessThanOrEqual(Math.abs(s) * forecastSigmaK(lead) + 1e-9);
  });

  it('with targetProbability the plan is at least that likely to be ready', () => {
    fc.assert(
      fc.property(caseArb(), fc.double({ min: 0.6, max: 0.98, noNaN: true }), (c, target) => {
        const plan = planDeparture(request(c, { targetProbability: target }));
        if (plan.status === 'warming') expect(plan.probabilityReady).toBeGreaterThanOrEqual(target - 1e-9);
      }),
      { numRuns: 15, seed: 18 },
    );
  });
});

describe('the floor before heat can act', () => {
  it('reports a free curve already below the floor at the earliest switch-on, and enforces the floor from when full heat restores it', () => {
    const m = lumped(60_000, 8, -10);
    m.oil.initialTempC = 60;
    const T = START + 12 * H;
    const earliest = START + 8 * H; // the oil is long since near −10 °C
    const plan = planDeparture({ model: m, departureMs: T, readyC: 15, floorC: 0, heater: { node: 'oil', powerW: 400 }, mode: 'least-cost', earliestSwitchOnMs: earliest });
    const f = plan.floor!;
    expect(f.breachBeforeHeat).toBeDefined();
    expect(f.breachBeforeHeat!.oilAtSwitchOnC).toBeLessThan(0);
    expect(f.breachBeforeHeat!.fromMs).toBeLessThan(earliest);
    // Full heat from the earliest switch-on: 0 °C after τ·ln((Teq − T1)/(Teq − 0)).
    const tau = (60_000 / 8) * 1000;
    const Teq = -10 + 400 / 8;
    const T1 = f.breachBeforeHeat!.oilAtSwitchOnC;
    expect(Math.abs(f.enforcedFromMs - (earliest + tau * Math.log((Teq - T1) / Teq)))).toBeLessThan(5);
    expect(plan.status).toBe('warming');
    expect(plan.heaterOn[0].fromMs).toBe(earliest);
    expect(f.met).toBe(true);
  });
});
