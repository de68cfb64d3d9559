// The exact integration cross-checked against a general-purpose solver (mathjs solveODE, RK45).
import { describe, expect, it } from 'vitest';
import { outsideAt, simulate, type SoakModel } from '@/lib/thermal';
import { solveODE } from './solveOde';

const H = 3_600_000;

/** T-hangar, two engine nodes, an outside curve with kinks, a heater on each node. */
const model: SoakModel = {
  startMs: 0,
  endMs: 14 * H,
  outside: [
    { atMs: 0, tempC: -2 },
    { atMs: 2 * H, tempC: -6 },
    { atMs: 5 * H, tempC: -13 },
    { atMs: 9 * H, tempC: -15 },
    { atMs: 12 * H, tempC: -9 },
  ],
  shelter: { kind: 'hangar', heatCapacityJPerK: 2.5e6, lossWPerK: 350 },
  oil: { heatCapacityJPerK: 16_600, lossWPerK: 2.8, initialTempC: 80 },
  engine: { heatCapacityJPerK: 82_800, lossWPerK: 7.8, initialTempC: 85 },
  couplingWPerK: 12,
  cover: true,
  coverFactor: 0.5,
  heaters: [
    { node: 'oil', powerW: 200, fromMs: 9.5 * H, toMs: 14 * H },
    { node: 'engine', powerW: 200, fromMs: 11 * H, toMs: 13.25 * H },
  ],
};

function rhs(t: number, y: number[]): number[] {
  const ms = t * 1000;
  const [Ts, To, Te] = y;
  const Tout = outsideAt(model.outside, ms);
  const P = (node: string) => (model.heaters ?? []).reduce((s, h) => s + (h.node === node && h.fromMs <= ms && ms < h.toMs ? h.powerW : 0), 0);
  const Go = 2.8 * 0.5;
  const Ge = 7.8 * 0.5;
  return [
    (-350 * (Ts - Tout)) / 2.5e6,
    (-Go * (To - Ts) - 12 * (To - Te) + P('oil')) / 16_600,
    (-Ge * (Te - Ts) - 12 * (Te - To) + P('engine')) / 82_800,
  ];
}

describe('two engine nodes in a T-hangar against mathjs solveODE', () => {
  it('agrees at every hour and quarter to 1e-6 K (solver restarted at each kink, tol 1e-10)', () => {
    const kinks = [0, 2, 5, 9, 9.5, 11, 12, 13.25, 14].map((h) => h * 3600);
    const checks = Array.from({ length: 14 * 4 + 1 }, (_, i) => i * 900);
    const stops = [...new Set([...kinks, ...checks])].sort((a, b) => a - b);
    let y = [outsideAt(model.outside, 0), 80, 85];
    const ode = new Map<number, number[]>([[0, y]]);
    for (let i = 0; i + 1 < stops.length; i++) {
      const sol = solveODE(rhs, [stops[i], stops[i + 1]], y, { tol: 1e-10, maxStep: 300 });
      y = sol.y[sol.y.length - 1];
      ode.set(stops[i + 1], y);
    }
    const s = simulate(model, { outputEveryMinutes: 15 });
    let worst = 0;
    for (let j = 0; j < s.atMs.length; j++) {
      const ref = ode.get(s.atMs[j] / 1000)!;
      worst = Math.max(worst, Math.abs(s.shelterC[j] - ref[0]), Math.abs(s.oilC[j] - ref[1]), Math.abs(s.engineC![j] - ref[2]));
    }
    expect(worst).toBeLessThan(1e-6);
  });
});
