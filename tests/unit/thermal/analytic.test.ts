// The soak model against closed-form lumped-capacitance solutions and textbook worked examples.
import { describe, expect, it } from 'vitest';
import { firstOilCrossing, oilMinimum, simulate, stateAt, type SoakModel } from '@/lib/thermal';

const H = 3_600_000;

/** One node on a tie-down with outside air linear from Ta at rate b (K/h): the closed form applies. */
function linearAmbient(o: { tauH: number; T0: number; Ta: number; bPerH: number; hours: number; G?: number; powerW?: number }): SoakModel {
  const G = o.G ?? 10;
  return {
    startMs: 0,
    endMs: o.hours * H,
    outside: [
      { atMs: 0, tempC: o.Ta },
      { atMs: o.hours * H, tempC: o.Ta + o.bPerH * o.hours },
    ],
    shelter: { kind: 'tie-down' },
    oil: { heatCapacityJPerK: G * o.tauH * 3600, lossWPerK: G, initialTempC: o.T0 },
    heaters: o.powerW ? [{ node: 'oil', powerW: o.powerW, fromMs: 0, toMs: o.hours * H }] : [],
  };
}

describe('linear surroundings T∞ = Ta + b·t (docs/sources.md: derived; arithmetic checked)', () => {
  const m = linearAmbient({ tauH: 3, T0: 20, Ta: 5, bPerH: -1, hours: 6 });

  it('τ = 3 h, T0 = 20 °C, Ta = 5 °C, b = −1 K/h → 15.598, 9.415, 3.624 °C at 1, 3, 6 h', () => {
    const s = simulate(m, { outputEveryMinutes: 60 });
    expect(s.oilC[1]).toBeCloseTo(15.598, 3);
    expect(s.oilC[3]).toBeCloseTo(9.415, 3);
    expect(s.oilC[6]).toBeCloseTo(3.624, 3);
  });

  it('matches T(t) = T∞(t) − bτ + (T0 − Ta + bτ)·e^(−t/τ) to rounding at every minute', () => {
    const s = simulate(m, { outputEveryMinutes: 1 });
    const closed = (h: number) => 5 - h + 3 + (20 - 5 - 3) * Math.exp(-h / 3);
    let worst = 0;
    for (let j = 0; j < s.atMs.length; j++) worst = Math.max(worst, Math.abs(s.oilC[j] - closed(s.atMs[j] / H)));
    expect(worst).toBeLessThan(1e-9);
  });

  it('finds an interior minimum exactly: outside rising after a hot start', () => {
    // b > 0: dT/dt = 0 at t* = τ·ln((T0 − Ta + bτ)/(bτ)) (derived from the closed form).
    const mm = linearAmbient({ tauH: 2, T0: 30, Ta: -10, bPerH: 2, hours: 12 });
    const tStar = 2 * Math.log((30 + 10 + 4) / 4);
    const Tstar = -10 + 2 * tStar - 4 + 44 * Math.exp(-tStar / 2);
    const min = oilMinimum(mm);
    expect(min.atMs / H).toBeCloseTo(tStar, 4);
    expect(min.oilC).toBeCloseTo(Tstar, 9);
  });
});

describe('stiff nodes', () => {
  it('a node with τ = 1 ms tracks its surroundings over hour-long steps: T = T∞(t) − b·τ', () => {
    const m = linearAmbient({ tauH: 1e-3 / 3600, T0: 80, Ta: -10, bPerH: 2, hours: 5, G: 1000 });
    const s = simulate(m, { outputEveryMinutes: 60 });
    for (let j = 1; j < s.atMs.length; j++) expect(s.oilC[j]).toBeCloseTo(-10 + 2 * (s.atMs[j] / H) - (2 / 3600) * 1e-3, 9);
  });
});

describe('shortest heater run d = τ·ln((Teq − Tstart)/(Teq − Tready)) (docs/sources.md: derived)', () => {
  it('a 400 W heater on a 3 h node from −10 °C reaches 15 °C when the formula says', () => {
    const m = linearAmbient({ tauH: 3, T0: -10, Ta: -10, bPerH: 0, hours: 10, G: 10, powerW: 400 });
    const Teq = -10 + 400 / 10;
    const d = 3 * Math.log((Teq + 10) / (Teq - 15));
    const at = firstOilCrossing(m, 15);
    expect(at).not.toBeNull();
    expect(at! / H).toBeCloseTo(d, 6);
  });
});

/** A lumped sphere of diameter D in a fluid at constant T∞: C = ρ·(πD³/6)·cp, G = h·πD². */
function sphere(o: { D: number; rho: number; cp: number; h: number; T0: number; Tinf: number; seconds: number }): SoakModel {
  const V = (Math.PI * o.D ** 3) / 6;
  const A = Math.PI * o.D ** 2;
  return {
    startMs: 0,
    endMs: o.seconds * 1000,
    outside: [{ atMs: 0, tempC: o.Tinf }],
    shelter: { kind: 'tie-down' },
    oil: { heatCapacityJPerK: o.rho * V * o.cp, lossWPerK: o.h * A, initialTempC: o.T0 },
  };
}

describe('Çengel, Heat Transfer, Example 4-1 (published): 1 mm steel-like sphere', () => {
  const k = 35;
  const p = { D: 0.001, rho: 8500, cp: 320, h: 210 };

  it('is a lumped case: Bi = h·(D/6)/k ≈ 0.001, b = hA/(ρVcp) = 0.462 1/s', () => {
    expect((p.h * (p.D / 6)) / k).toBeCloseTo(0.001, 4);
    const m = sphere({ ...p, T0: 0, Tinf: 100, seconds: 30 });
    expect(m.oil.lossWPerK / m.oil.heatCapacityJPerK).toBeCloseTo(0.462, 2); // 0.4632 unrounded
  });

  it('reaches 99 % of the temperature change in ≈ 10 s (9.94 s)', () => {
    const m = sphere({ ...p, T0: 0, Tinf: 100, seconds: 30 });
    const at = firstOilCrossing(m, 99);
    expect(at! / 1000).toBeCloseTo(9.94, 2);
    expect(stateAt(m, 9940).oilC).toBeCloseTo(99, 1);
  });
});

describe('Incropera, Example 5.1 (from memory for the statement; arithmetic checked): thermocouple junction', () => {
  // h = 400 W/m²·K, k = 20 W/m·K, c = 400 J/kg·K, ρ = 8500 kg/m³, τ = 1 s → D = 6hτ/(ρc) = 0.706 mm.
  const h = 400;
  const D = (6 * h * 1) / (8500 * 400);

  it('τ = 1 s gives D = 0.706 mm, and Bi = h·(D/6)/k ≪ 0.1', () => {
    expect(D * 1000).toBeCloseTo(0.706, 3);
    expect((h * (D / 6)) / 20).toBeLessThan(0.1);
  });

  it('from 25 °C to 199 °C in a 200 °C gas stream takes t = ln(175)·τ ≈ 5.16 s', () => {
    const m = sphere({ D, rho: 8500, cp: 400, h, T0: 25, Tinf: 200, seconds: 20 });
    expect(m.oil.heatCapacityJPerK / m.oil.lossWPerK).toBeCloseTo(1, 9);
    const at = firstOilCrossing(m, 199);
    expect(at! / 1000).toBeCloseTo(Math.log(175), 3);
    expect(at! / 1000).toBeCloseTo(5.16, 2);
  });
});
