// Random but physical planning cases for the planner's property tests (fast-check arbitraries).
// The numbers are ranges around the engine-class presets of lib/thermal (estimates there); they are
// inputs, not check values: the checks compare the planner with the LP solver and with
// re-simulation through lib/thermal.
import fc from 'fast-check';
import { simulate, type SoakModel } from '@/lib/thermal';
import { withHeater, type Interval, type PlanRequest, type TariffPeriod } from '@/lib/planner';

export const H = 3_600_000;
export const START = Date.parse('2025-01-15T16:00:00Z');

export interface Case {
  model: SoakModel;
  departureMs: number;
  readyC: number;
  heater: PlanRequest['heater'];
  tariff: TariffPeriod[];
}

/** A night: one- or two-node engine, tie-down or hangar, hourly outside points, a three-period tariff. */
export const caseArb = (o: { hours?: [number, number]; floor?: boolean } = {}) =>
  fc
    .record({
      two: fc.boolean(),
      hangar: fc.boolean(),
      cover: fc.boolean(),
      Co: fc.double({ min: 1e4, max: 1e5, noNaN: true }),
      Go: fc.double({ min: 1, max: 12, noNaN: true }),
      Ce: fc.double({ min: 4e4, max: 2e5, noNaN: true }),
      Ge: fc.double({ min: 3, max: 15, noNaN: true }),
      Goe: fc.double({ min: 0.5, max: 20, noNaN: true }),
      T0: fc.double({ min: 40, max: 90, noNaN: true }),
      out0: fc.double({ min: -15, max: 5, noNaN: true }),
      steps: fc.array(fc.double({ min: -2, max: 1.5, noNaN: true }), { minLength: 20, maxLength: 20 }),
      depHours: fc.double({ min: o.hours?.[0] ?? 10, max: o.hours?.[1] ?? 16, noNaN: true }),
      readyC: fc.double({ min: 5, max: 25, noNaN: true }),
      powerW: fc.double({ min: 100, max: 800, noNaN: true }),
      engineHeater: fc.boolean(),
      prices: fc.tuple(fc.double({ min: 0.05, max: 0.5, noNaN: true }), fc.double({ min: 0.05, max: 0.5, noNaN: true }), fc.double({ min: 0.05, max: 0.5, noNaN: true })),
      cut1: fc.integer({ min: 3, max: 8 }),
      cut2: fc.integer({ min: 9, max: 14 }),
    })
    .map((r): Case => {
      const outside = [{ atMs: START, tempC: r.out0 }];
      r.steps.forEach((d, i) => outside.push({ atMs: START + (i + 1) * H, tempC: outside[i].tempC + d }));
      const model: SoakModel = {
        startMs: START,
        endMs: START + 20 * H,
        outside,
        shelter: r.hangar ? { kind: 'hangar', heatCapacityJPerK: 2.5e6, lossWPerK: 350 } : { kind: 'tie-down' },
        oil: { heatCapacityJPerK: r.Co, lossWPerK: r.Go, initialTempC: r.T0 },
        ...(r.two ? { engine: { heatCapacityJPerK: r.Ce, lossWPerK: r.Ge, initialTempC: r.T0 + 5 }, couplingWPerK: r.Goe } : {}),
        cover: r.cover,
      };
      // Departure on a whole minute, as bookings are.
      const departureMs = START + Math.round(r.depHours * 60) * 60_000;
      const tariff: TariffPeriod[] = [
        { fromMs: START - 12 * H, toMs: START + r.cut1 * H, pricePerKWh: r.prices[0] },
        { fromMs: START + r.cut1 * H, toMs: START + r.cut2 * H, pricePerKWh: r.prices[1] },
        { fromMs: START + r.cut2 * H, toMs: START + 36 * H, pricePerKWh: r.prices[2] },
      ];
      return { model, departureMs, readyC: r.readyC, heater: { node: r.two && r.engineHeater ? 'engine' : 'oil', powerW: r.powerW }, tariff };
    });

/** Lowest oil over [from, to] sampled every 30 s and at the heater edges (independent of the planner's own check). */
export function sampledMinimum(model: SoakModel, heater: PlanRequest['heater'], on: readonly Interval[], from: number, to: number): number {
  const times = new Set<number>();
  for (let t = from; t < to; t += 30_000) times.add(t);
  times.add(to);
  for (const i of on) for (const t of [i.fromMs, i.toMs]) if (t >= from && t <= to) times.add(t);
  const oil = simulate(withHeater(model, heater, on), { atMs: Float64Array.from(times).sort() }).oilC;
  return Math.min(...oil);
}

/** Oil at an instant for the model with the heater on over `on`, simulated directly. */
export function oilWith(model: SoakModel, heater: PlanRequest['heater'], on: readonly Interval[], atMs: number): number {
  const m = { ...model, heaters: on.map((i) => ({ node: heater.node, powerW: heater.powerW, fromMs: i.fromMs, toMs: i.toMs })) };
  return simulate(m, { atMs: [atMs] }).oilC[0];
}
