// Every heater of the aircraft (lib/planner/joint.ts) on random physical nights (cases.ts). The
// checks are laws of the linear model, not outside values: two heaters on one control on the same
// node are one heater of their total power; a joint plan never costs more than a heater alone that meets it.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { oneControl, planDeparture, planJointly, withHeater, type PlanRequest } from '@/lib/planner';
import { simulate } from '@/lib/thermal';
import { caseArb } from './cases';

describe('every heater of the aircraft', () => {
  it('two heaters on one control, where their nodes coincide, plan as one heater of the total power', () => {
    let n = 0;
    fc.assert(
      fc.property(caseArb({ hours: [10, 14] }), fc.double({ min: 0.2, max: 0.8, noNaN: true }), (c, share) => {
        const P = c.heater.powerW;
        const base: PlanRequest = { model: c.model, departureMs: c.departureMs, readyC: c.readyC, heater: c.heater, tariff: c.tariff, mode: 'least-cost' };
        const one = planDeparture(base);
        const two = planDeparture({ ...base, heater: oneControl([{ node: c.heater.node, powerW: share * P }, { node: c.heater.node, powerW: (1 - share) * P }]) });
        expect(two.status).toBe(one.status);
        expect(two.heaterOn).toEqual(one.heaterOn);
        expect(two.oilAtDepartureC).toBeCloseTo(one.oilAtDepartureC, 6);
        n++;
      }),
      { numRuns: 25, seed: 3 },
    );
    expect(n).toBeGreaterThanOrEqual(25);
  });

  it('each part heats its own node: the re-simulated plan equals the two heaters switched together', () => {
    fc.assert(
      fc.property(caseArb({ hours: [10, 14] }), (c) => {
        if (!c.model.engine) return;
        const heater = oneControl([{ node: 'oil', powerW: 200 }, { node: 'engine', powerW: 200 }]);
        const r = planDeparture({ model: c.model, departureMs: c.departureMs, readyC: c.readyC, heater, tariff: c.tariff, mode: 'single-start' });
        const m = withHeater(c.model, heater, r.heaterOn);
        expect(m.heaters!.filter((h) => h.node === 'engine').length).toBe(r.heaterOn.length);
        expect(simulate(m, { atMs: [c.departureMs] }).oilC[0]).toBeCloseTo(r.oilAtDepartureC, 6);
      }),
      { numRuns: 15, seed: 4 },
    );
  });

  it('joint plans never cost more than either heater alone that meets the window', () => {
    let met = 0;
    fc.assert(
      fc.property(caseArb({ hours: [10, 14] }), fc.integer({ min: 0, max: 60 }), (c, holdMinutes) => {
        const groups = [
          { heater: { node: 'oil' as const, powerW: c.heater.powerW }, mode: 'least-cost' as const },
          { heater: { node: c.model.engine ? ('engine' as const) : ('oil' as const), powerW: 150 }, mode: 'single-start' as const },
        ];
        const req = { model: c.model, departureMs: c.departureMs, readyC: c.readyC, tariff: c.tariff, holdMinutes };
        const joint = planJointly(req, groups);
        for (const g of groups) {
          const alone = planDeparture({ ...req, heater: g.heater, mode: g.mode });
          if (alone.status === 'short') continue;
          met++;
          expect(joint.result.status).not.toBe('short');
          expect(joint.result.cost!).toBeLessThanOrEqual(alone.cost! + 1e-9);
        }
      }),
      { numRuns: 20, seed: 5 },
    );
    expect(met).toBeGreaterThanOrEqual(10);
  });
});
