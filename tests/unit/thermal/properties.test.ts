// Laws the model must obey whatever its parameters (fast-check).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { oilMinimum, simulate, type SoakModel } from '@/lib/thermal';
import { H, MIN, modelArb } from './models';

const RUNS = { numRuns: 40 };

/** Values agree to this many kelvin: exact integration leaves only rounding. */
const TOL = 1e-8;

describe('output interval', () => {
  it('gives the same answer for any output interval (at the common times, the end and the minimum)', () => {
    fc.assert(
      fc.property(modelArb(), fc.integer({ min: 1, max: 30 }), fc.integer({ min: 1, max: 30 }), (m, a, b) => {
        const sa = simulate(m, { outputEveryMinutes: a });
        const sb = simulate(m, { outputEveryMinutes: b });
        const last = (s: typeof sa) => s.oilC[s.oilC.length - 1];
        expect(Math.abs(last(sa) - last(sb))).toBeLessThan(TOL);
        const ka = b; // every b-th point of grid a is every a-th point of grid b
        for (let i = 0; i * ka < sa.atMs.length - 1 && i * a < sb.atMs.length - 1; i++) {
          expect(sa.atMs[i * ka]).toBe(sb.atMs[i * a]);
          expect(Math.abs(sa.oilC[i * ka] - sb.oilC[i * a])).toBeLessThan(TOL);
          expect(Math.abs(sa.shelterC[i * ka] - sb.shelterC[i * a])).toBeLessThan(TOL);
        }
        expect(sa.heaterEnergyWh).toBe(sb.heaterEnergyWh);
      }),
      RUNS,
    );
  });

  it('the minimum does not depend on it either (it is found on the continuous solution)', () => {
    fc.assert(
      fc.property(modelArb({ heaters: true }), (m) => {
        const min = oilMinimum(m);
        const fine = simulate(m, { outputEveryMinutes: 1 });
        let lowest = Infinity;
        for (const v of fine.oilC) lowest = Math.min(lowest, v);
        expect(min.oilC).toBeLessThanOrEqual(lowest + TOL);
        expect(min.oilC).toBeGreaterThan(lowest - 0.05); // within a minute of curvature
      }),
      { numRuns: 20 },
    );
  });
});

function withHeaters(m: SoakModel, heaters: SoakModel['heaters']): SoakModel {
  return { ...m, heaters };
}

describe('linearity and superposition', () => {
  it('in heater power: the rise from heater sets A and B together is the sum of their rises, and scales with power', () => {
    fc.assert(
      fc.property(modelArb(), modelArb(), fc.double({ min: 0.1, max: 5, noNaN: true }), (m, other, alpha) => {
        const nodes = m.engine ? ['oil', 'engine'] : ['oil'];
        const A = (m.heaters ?? []).filter((h) => nodes.includes(h.node));
        const B = (other.heaters ?? []).filter((h) => nodes.includes(h.node));
        const oil = (hs: SoakModel['heaters']) => simulate(withHeaters(m, hs), { outputEveryMinutes: 30 }).oilC;
        const o0 = oil([]);
        const oA = oil(A);
        const oB = oil(B);
        const oAB = oil([...A, ...B]);
        const oScaled = oil(A.map((h) => ({ ...h, powerW: alpha * h.powerW })));
        for (let j = 0; j < o0.length; j++) {
          expect(oAB[j] - o0[j]).toBeCloseTo(oA[j] - o0[j] + (oB[j] - o0[j]), 8);
          expect(oScaled[j] - o0[j]).toBeCloseTo(alpha * (oA[j] - o0[j]), 8);
        }
      }),
      RUNS,
    );
  });

  it('in outside temperature and initial state: run(a + b) = run(a, with heaters) + run(b, no heaters)', () => {
    fc.assert(
      fc.property(modelArb(), fc.array(fc.double({ min: -15, max: 15, noNaN: true }), { minLength: 30, maxLength: 30 }), (m, extra) => {
        const b: SoakModel = {
          ...m,
          outside: m.outside.map((p, i) => ({ atMs: p.atMs, tempC: extra[i % extra.length] })),
          oil: { ...m.oil, initialTempC: extra[0] },
          engine: m.engine && { ...m.engine, initialTempC: extra[1] },
          heaters: [],
        };
        const ab: SoakModel = {
          ...m,
          outside: m.outside.map((p, i) => ({ atMs: p.atMs, tempC: p.tempC + b.outside[i].tempC })),
          oil: { ...m.oil, initialTempC: m.oil.initialTempC + b.oil.initialTempC },
          engine: m.engine && { ...m.engine, initialTempC: m.engine.initialTempC + b.engine!.initialTempC },
        };
        const sa = simulate(m, { outputEveryMinutes: 20 });
        const sb = simulate(b, { outputEveryMinutes: 20 });
        const sab = simulate(ab, { outputEveryMinutes: 20 });
        for (let j = 0; j < sa.oilC.length; j++) {
          expect(sab.oilC[j]).toBeCloseTo(sa.oilC[j] + sb.oilC[j], 8);
          expect(sab.shelterC[j]).toBeCloseTo(sa.shelterC[j] + sb.shelterC[j], 8);
          if (sab.engineC) expect(sab.engineC[j]).toBeCloseTo(sa.engineC![j] + sb.engineC![j], 8);
        }
      }),
      RUNS,
    );
  });
});

/** Composite Simpson over an evenly spaced series (even number of intervals). */
function simpson(y: ArrayLike<number>, h: number): number {
  let s = y[0] + y[y.length - 1];
  for (let i = 1; i < y.length - 1; i++) s += (i % 2 ? 4 : 2) * y[i];
  return (s * h) / 3;
}

describe('energy balance', () => {
  it('heater energy = energy stored in the nodes + energy lost to the shelter air (fine Simpson quadrature)', () => {
    fc.assert(
      fc.property(modelArb({ hours: 6, wind: false }), (m) => {
        const stepS = 10;
        const s = simulate(m, { outputEveryMinutes: stepS / 60 });
        const cf = m.cover ? m.coverFactor! : 1;
        const Go = m.oil.lossWPerK * cf;
        const Ge = (m.engine?.lossWPerK ?? 0) * cf;
        const N = s.atMs.length;
        const loss = new Float64Array(N);
        for (let j = 0; j < N; j++) {
          loss[j] = Go * (s.oilC[j] - s.shelterC[j]) + (s.engineC ? Ge * (s.engineC[j] - s.shelterC[j]) : 0);
        }
        // Simpson panel by panel between heater edges (the integrand has kinks there; edges are whole minutes).
        const edges = new Set<number>([0, N - 1]);
        for (const h of m.heaters ?? []) for (const t of [h.fromMs, h.toMs]) edges.add(Math.round(t / (stepS * 1000)));
        const cuts = [...edges].sort((a, b) => a - b);
        let lostJ = 0;
        for (let k = 0; k + 1 < cuts.length; k++) {
          const [a, b] = [cuts[k], cuts[k + 1]];
          const seg = Array.from(s.oilC.subarray(a, b + 1), (_, i) => loss[a + i]);
          if ((b - a) % 2 === 0) lostJ += simpson(seg, stepS);
          else lostJ += simpson(seg.slice(0, -1), stepS) + ((seg[seg.length - 2] + seg[seg.length - 1]) * stepS) / 2;
        }
        const storedJ =
          m.oil.heatCapacityJPerK * (s.oilC[N - 1] - s.oilC[0]) + (m.engine && s.engineC ? m.engine.heatCapacityJPerK * (s.engineC[N - 1] - s.engineC[0]) : 0);
        const heaterJ = s.heaterEnergyWh * 3600;
        const scale = Math.max(1, Math.abs(heaterJ), Math.abs(storedJ), Math.abs(lostJ));
        expect(Math.abs(heaterJ - storedJ - lostJ) / scale).toBeLessThan(1e-5);
      }),
      { numRuns: 25 },
    );
  });
});

describe('cover', () => {
  it('a covered engine never cools faster than an uncovered one (outside not warming, engine starting warmer)', () => {
    fc.assert(
      fc.property(modelArb({ heaters: false }), (m0) => {
        // Outside non-increasing; nodes start at or above it; no sun, no heaters.
        const temps = m0.outside.map((p) => p.tempC).sort((a, b) => b - a);
        const outside = m0.outside.map((p, i) => ({ atMs: p.atMs, tempC: temps[i] }));
        const top = temps[0];
        const m: SoakModel = {
          ...m0,
          outside,
          oil: { ...m0.oil, initialTempC: Math.max(top, m0.oil.initialTempC) },
          engine: m0.engine && { ...m0.engine, initialTempC: Math.max(top, m0.engine.initialTempC) },
        };
        const covered = simulate({ ...m, cover: true }, { outputEveryMinutes: 15 });
        const bare = simulate({ ...m, cover: false }, { outputEveryMinutes: 15 });
        for (let j = 0; j < bare.oilC.length; j++) {
          expect(covered.oilC[j]).toBeGreaterThanOrEqual(bare.oilC[j] - 1e-9);
          if (bare.engineC) expect(covered.engineC![j]).toBeGreaterThanOrEqual(bare.engineC[j] - 1e-9);
        }
      }),
      RUNS,
    );
  });

  it('and on a windy tie-down wind only speeds the cooling', () => {
    fc.assert(
      fc.property(modelArb({ shelters: ['tie-down'], heaters: false }), (m0) => {
        const m = { ...m0, outside: [{ atMs: 0, tempC: -10 }], oil: { ...m0.oil, initialTempC: 60 }, engine: m0.engine && { ...m0.engine, initialTempC: 60 } };
        const calm = simulate({ ...m, wind: [] }, { outputEveryMinutes: 30 });
        const windy = simulate(m, { outputEveryMinutes: 30 });
        for (let j = 0; j < calm.oilC.length; j++) expect(windy.oilC[j]).toBeLessThanOrEqual(calm.oilC[j] + 1e-9);
      }),
      { numRuns: 20 },
    );
  });
});

void H;
void MIN;
