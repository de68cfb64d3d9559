// The planner's affine response: base + Σ perWatt·P equals a direct run with those heaters.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { heaterResponse, outsideSensitivity, simulate, type SoakModel } from '@/lib/thermal';
import { H, modelArb } from './models';

describe('heaterResponse', () => {
  it('predicts the oil at T and at every slot end for any slot powers (superposition)', () => {
    fc.assert(
      fc.property(
        modelArb({ hours: 12 }),
        fc.constantFrom<'oil' | 'engine'>('oil', 'engine'),
        fc.array(fc.double({ min: 0, max: 500, noNaN: true }), { minLength: 24, maxLength: 24 }),
        fc.integer({ min: 1, max: 12 * 4 }),
        (m, node0, powers, tq) => {
          const node = m.engine ? node0 : 'oil';
          // 24 half-hour slots over the 12 h run; T on a quarter hour.
          const slots = powers.map((_, k) => ({ fromMs: k * 0.5 * H, toMs: (k + 1) * 0.5 * H }));
          const T = tq * 0.25 * H;
          const r = heaterResponse(m, { node, slots, atMs: T });
          const withPlan: SoakModel = {
            ...m,
            heaters: [...(m.heaters ?? []), ...slots.map((s, k) => ({ node, powerW: powers[k], fromMs: s.fromMs, toMs: s.toMs }))],
          };
          const times = [...new Set([T, ...slots.map((s) => s.toMs)])].sort((a, b) => a - b);
          const direct = simulate(withPlan, { atMs: times });
          const at = (t: number) => direct.oilC[times.indexOf(t)];
          const predicted = r.baseOilC + powers.reduce((s, p, k) => s + p * r.perWattK[k], 0);
          expect(predicted).toBeCloseTo(at(T), 7);
          for (let j = 0; j < slots.length; j++) {
            const pj = r.slotEnds.baseOilC[j] + powers.reduce((s, p, k) => s + p * r.slotEnds.perWattK[j][k], 0);
            expect(pj).toBeCloseTo(at(slots[j].toMs), 7);
          }
          // Causality: slots starting at or after T do nothing at T.
          slots.forEach((s, k) => {
            if (s.fromMs >= T) expect(r.perWattK[k]).toBe(0);
          });
        },
      ),
      { numRuns: 25 },
    );
  });

  it('gives the base run at T when the model has its own heaters and no slots', () => {
    const m: SoakModel = {
      startMs: 0,
      endMs: 6 * H,
      outside: [{ atMs: 0, tempC: -10 }],
      shelter: { kind: 'tie-down' },
      oil: { heatCapacityJPerK: 30_000, lossWPerK: 5, initialTempC: 50 },
      heaters: [{ node: 'oil', powerW: 100, fromMs: H, toMs: 2 * H }],
    };
    const r = heaterResponse(m, { node: 'oil', slots: [], atMs: 5 * H });
    expect(r.baseOilC).toBeCloseTo(simulate(m, { atMs: [5 * H] }).oilC[0], 12);
  });
});

describe('outsideSensitivity', () => {
  it('predicts the oil at T when every outside point shifts (linear shelters)', () => {
    fc.assert(
      fc.property(modelArb({ hours: 10 }), fc.array(fc.double({ min: -3, max: 3, noNaN: true }), { minLength: 11, maxLength: 11 }), (m, errs) => {
        const T = 8 * H;
        const s = outsideSensitivity(m, T);
        const shifted: SoakModel = { ...m, outside: m.outside.map((p, i) => ({ atMs: p.atMs, tempC: p.tempC + errs[i % errs.length] })) };
        const predicted = simulate(m, { atMs: [T] }).oilC[0] + m.outside.reduce((acc, _, i) => acc + s[i] * errs[i % errs.length], 0);
        expect(predicted).toBeCloseTo(simulate(shifted, { atMs: [T] }).oilC[0], 6);
      }),
      { numRuns: 15 },
    );
  });
});
