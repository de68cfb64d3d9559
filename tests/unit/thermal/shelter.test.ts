// Shelter air: a heated hangar's thermostat (exact switching times) and sun on the roof.
import { describe, expect, it } from 'vitest';
import { simulate, type SoakModel } from '@/lib/thermal';

const H = 3_600_000;
const engine = { heatCapacityJPerK: 99_000, lossWPerK: 10, initialTempC: 80 };

describe('heated hangar (set-point 10 °C, 10 kW, 500 W/K, 30 MJ/K)', () => {
  const Cs = 3e7;
  const Gs = 500;
  const Pmax = 10_000;
  const tau = Cs / Gs;
  // Outside falls 3 K/h from 0 °C for 10 h, rises 5 K/h to 0 °C at 16 h, then slowly to 5 °C at 30 h.
  const model: SoakModel = {
    startMs: 0,
    endMs: 30 * H,
    outside: [
      { atMs: 0, tempC: 0 },
      { atMs: 10 * H, tempC: -30 },
      { atMs: 16 * H, tempC: 0 },
      { atMs: 30 * H, tempC: 5 },
    ],
    shelter: { kind: 'hangar', heatCapacityJPerK: Cs, lossWPerK: Gs, setpointC: 10, heatingPowerW: Pmax },
    oil: engine,
  };
  const s = simulate(model, { outputEveryMinutes: 5 });
  // The heating holds 10 °C while Gs·(10 − Tout) ≤ Pmax, i.e. Tout ≥ −10 °C: until t = 10/3 h.
  const tEvent = 10 / 3;

  it('holds the set-point exactly while its power allows', () => {
    for (let j = 0; j < s.atMs.length && s.atMs[j] <= tEvent * H; j++) expect(s.shelterC[j]).toBe(10);
  });

  it('then floats on the exact solution with the heating flat out', () => {
    const b = -3 / 3600; // K/s
    for (const hours of [4, 6, 8, 10]) {
      const sec = (hours - tEvent) * 3600;
      const inf0 = -10 + Pmax / Gs; // outside at the event + P/G
      const expected = inf0 + b * sec - b * tau + (10 - inf0 + b * tau) * Math.exp(-sec / tau);
      const j = s.atMs.indexOf(hours * H);
      expect(s.shelterC[j]).toBeCloseTo(expected, 8);
      expect(s.shelterC[j]).toBeLessThan(10);
    }
  });

  it('comes back to the set-point when the outside warms, and holds it again', () => {
    const back = s.atMs.findIndex((t, j) => t > 10 * H && s.shelterC[j] === 10);
    expect(back).toBeGreaterThan(0);
    for (let j = back; j < s.atMs.length; j++) expect(s.shelterC[j]).toBe(10);
    expect(s.shelterC[back - 1]).toBeLessThan(10);
  });

  it('uses ∫P dt: held Gs·(Tset − Tout) then P_max (closed form over the first 10 h)', () => {
    const first = simulate({ ...model, endMs: 10 * H }, { outputEveryMinutes: 60 });
    const heldWh = Gs * (10 * tEvent + 1.5 * tEvent ** 2); // ∫0^t 500·(10 + 3t) dt, t in hours
    const maxWh = Pmax * (10 - tEvent);
    expect(first.shelterHeatingWh).toBeCloseTo(heldWh + maxWh, 6);
  });

  it('starting warmer than the set-point, it floats down and is caught at 10 °C at τ·ln(1.5)', () => {
    const warm: SoakModel = { ...model, outside: [{ atMs: 0, tempC: 0 }], shelter: { ...model.shelter, initialTempC: 15 } as SoakModel['shelter'] };
    const tCatch = (tau * Math.log(15 / 10)) / 3600;
    const w = simulate(warm, { atMs: [(tCatch - 0.01) * H, tCatch * H, (tCatch + 0.01) * H, 16 * H] });
    expect(w.shelterC[0]).toBeGreaterThan(10);
    expect(w.shelterC[1]).toBeCloseTo(10, 9);
    expect(w.shelterC[2]).toBe(10);
    expect(w.shelterC[3]).toBe(10);
    expect(w.shelterHeatingWh).toBeCloseTo(Gs * 10 * (30 - tCatch), 4);
  });
});

describe('sun on a hangar roof', () => {
  const start = Date.parse('2025-01-20T12:00:00Z'); // Helsinki-like latitude: midday sun low but up
  const base: SoakModel = {
    startMs: start,
    endMs: start + 24 * H,
    outside: [{ atMs: start, tempC: -10 }],
    shelter: { kind: 'hangar', heatCapacityJPerK: 2.5e6, lossWPerK: 350, initialTempC: -10, solarApertureM2: 5 },
    oil: { ...engine, initialTempC: -10 },
    site: { lat: 61, lon: 25 },
  };
  const run = (m: Partial<SoakModel>, aperture = 5) =>
    simulate({ ...base, ...m, shelter: { ...(base.shelter as object), solarApertureM2: aperture } as SoakModel['shelter'] }, { outputEveryMinutes: 30 });

  it('warms the shelter by day, linearly in the aperture, and not at all without a site', () => {
    const none = run({ site: undefined });
    const one = run({});
    const two = run({}, 10);
    for (let j = 0; j < none.shelterC.length; j++) {
      expect(none.shelterC[j]).toBeCloseTo(-10, 9);
      expect(two.shelterC[j] + 10).toBeCloseTo(2 * (one.shelterC[j] + 10), 8);
    }
    expect(Math.max(...one.shelterC)).toBeGreaterThan(-9);
  });

  it('adds nothing during hours with the sun below the horizon all hour', () => {
    // Late evening: with no gain since the previous noon's sun decayed, the excess keeps falling.
    const one = run({});
    const j21 = one.atMs.indexOf(start + 9 * H);
    const j23 = one.atMs.indexOf(start + 11 * H);
    const excess = (j: number) => one.shelterC[j] + 10;
    const tau = 2.5e6 / 350;
    expect(excess(j23)).toBeCloseTo(excess(j21) * Math.exp((-2 * 3600) / tau), 8);
  });

  it('an overcast sky (fraction 1) leaves 1 − 0.75 = 25 % of the gain (Kasten & Czeplak, from memory)', () => {
    const clear = run({});
    const overcast = run({ cloud: [{ atMs: start - H, fraction: 1 }] });
    for (let j = 0; j < clear.shelterC.length; j++) expect(overcast.shelterC[j] + 10).toBeCloseTo(0.25 * (clear.shelterC[j] + 10), 8);
  });
});
