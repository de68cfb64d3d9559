// lib/thermal/planner-support: the adjoint sensitivities the planner uses, checked against the
// model's own forward response (heaterResponse) and against direct simulation. The model is linear
// (docs/soak-model.md), so these agree to rounding.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { heaterResponse, simulate } from '@/lib/thermal';
import { oilResponses, slotTransitions } from '@/lib/thermal/planner-support';
import { slotGrid } from '@/lib/planner';
import { caseArb, oilWith, START } from './cases';

const RUNS = { numRuns: 25, seed: 20250115 };

describe('oilResponses (adjoint)', () => {
  it('gives the same oil rise per watt per slot as heaterResponse, at departure and at slot ends', () => {
    fc.assert(
      fc.property(caseArb(), fc.integer({ min: 5, max: 30 }), (c, slotMin) => {
        const slots = slotGrid(START + 1_234_000, c.departureMs, slotMin * 60_000);
        const ref = heaterResponse(c.model, { node: c.heater.node, slots, atMs: c.departureMs });
        const js = [0, Math.floor(slots.length / 2), slots.length - 1];
        const [atT, ...rows] = oilResponses(c.model, { node: c.heater.node, slots, times: [c.departureMs, ...js.map((j) => slots[j].toMs)] });
        const scale = Math.max(...ref.perWattK);
        expect(Math.abs(atT.baseOilC - ref.baseOilC)).toBeLessThan(1e-9);
        ref.perWattK.forEach((w, k) => expect(Math.abs(atT.perWattK[k] - w)).toBeLessThan(1e-9 * scale));
        js.forEach((j, i) => {
          expect(Math.abs(rows[i].baseOilC - ref.slotEnds.baseOilC[j])).toBeLessThan(1e-9);
          ref.slotEnds.perWattK[j].forEach((w, k) => expect(Math.abs(rows[i].perWattK[k] - w)).toBeLessThan(1e-9 * scale));
        });
      }),
      RUNS,
    );
  });

  it('gives the oil change per kelvin of the outside forecast (per point and for a uniform shift) as simulation does', () => {
    fc.assert(
      fc.property(caseArb(), fc.integer({ min: 0, max: 20 }), (c, i) => {
        const [r] = oilResponses(c.model, { node: c.heater.node, slots: [], times: [c.departureMs] });
        const shifted = (d: number, only?: number) => ({
          ...c.model,
          outside: c.model.outside.map((p, k) => ({ ...p, tempC: p.tempC + (only === undefined || only === k ? d : 0) })),
        });
        const at = (m: typeof c.model) => simulate(m, { atMs: [c.departureMs] }).oilC[0];
        // Linear model: a 1 K difference is exact.
        expect(r.uniformShiftKPerK).toBeCloseTo(at(shifted(1)) - at(c.model), 8);
        expect(r.perOutsideK[i]).toBeCloseTo(at(shifted(1, i)) - at(c.model), 8);
        const sum = r.perOutsideK.reduce((s, v) => s + v, 0);
        expect(sum).toBeCloseTo(r.uniformShiftKPerK, 10);
      }),
      RUNS,
    );
  });
});

describe('slotTransitions and co-states', () => {
  it('carry the heat the planner adds exactly: z at each slot end equals planned minus free, re-simulated', () => {
    fc.assert(
      fc.property(caseArb(), fc.array(fc.boolean(), { minLength: 200, maxLength: 200 }), (c, bits) => {
        const slots = slotGrid(START + 600_000, c.departureMs, 15 * 60_000);
        const on = slots.filter((_, k) => bits[k]);
        const tr = slotTransitions(c.model, { node: c.heater.node, powerW: c.heater.powerW, slots });
        const H = tr.nodes.length;
        let z = new Float64Array(H);
        const ends = slots.map((s) => s.toMs);
        const planned = simulate({ ...c.model, heaters: on.map((i) => ({ ...c.heater, ...i })) }, { atMs: ends });
        const free = simulate(c.model, { atMs: ends });
        slots.forEach((_, k) => {
          const next = new Float64Array(H);
          for (let h = 0; h < H; h++) {
            next[h] = bits[k] ? tr.g[k][h] : 0;
            for (let q = 0; q < H; q++) next[h] += tr.M[k][h * H + q] * z[q];
          }
          z = next;
          expect(z[0]).toBeCloseTo(planned.oilC[k] - free.oilC[k], 8);
          if (H > 1) expect(z[1]).toBeCloseTo(planned.engineC![k] - free.engineC![k], 8);
        });
        // The co-state at a slot start reads the oil at departure from the heat added so far.
        const [r] = oilResponses(c.model, { node: c.heater.node, slots, times: [c.departureMs] });
        const k = Math.floor(slots.length / 2);
        const before = on.filter((i) => i.toMs <= slots[k].fromMs);
        const zk = [oilWith(c.model, c.heater, before, slots[k].fromMs) - simulate(c.model, { atMs: [slots[k].fromMs] }).oilC[0]];
        if (H > 1) {
          const m = { ...c.model, heaters: before.map((i) => ({ ...c.heater, ...i })) };
          zk.push(simulate(m, { atMs: [slots[k].fromMs] }).engineC![0] - simulate(c.model, { atMs: [slots[k].fromMs] }).engineC![0]);
        }
        const viaCoState = zk.reduce((s, v, h) => s + v * r.coStateAtSlotStart[k * H + h], 0);
        expect(viaCoState).toBeCloseTo(oilWith(c.model, c.heater, before, c.departureMs) - r.baseOilC, 8);
      }),
      { numRuns: 15, seed: 7 },
    );
  });
});
