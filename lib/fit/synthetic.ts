// Synthetic cool-downs from known parameters, for the checks and the demo log. Noise from a seeded
// generator so every run draws the same numbers.
import { simulate } from '@/lib/thermal';
import { oneNodeCurve } from './oneNode';
import type { LogSeries } from './types';

/** A small seeded PRNG (mulberry32) and standard normal draws (Box–Muller). */
export function rng(seed: number) {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = () => {
    const u = Math.max(uniform(), 1e-12);
    const v = uniform();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
  return { uniform, normal };
}

export interface SyntheticOptions {
  startMs: number;
  hours: number;
  stepS: number;
  noiseK: number;
  seed?: number;
  /** Surroundings over time (h from the start), °C. */
  ambient: (h: number) => number;
  /** Write the ambient column (with its own noise) or leave it out. */
  logAmbient?: boolean;
}

/** A one-node cool-down: τ (h), start temperature; the ambient is logged exactly (its noise added after). */
export function syntheticOneNode(o: SyntheticOptions & { tauH: number; startC: number }): LogSeries {
  const n = Math.floor((o.hours * 3600) / o.stepS) + 1;
  const tS = Float64Array.from({ length: n }, (_, i) => i * o.stepS);
  const amb = Float64Array.from(tS, (s) => o.ambient(s / 3600));
  const clean = oneNodeCurve(tS, amb, o.tauH * 3600, 0, o.startC);
  return addNoise(o, tS, clean, amb);
}

/** A two-node cool-down through the soak model. */
export function syntheticTwoNode(
  o: SyntheticOptions & { oilJPerK: number; engineJPerK: number; oilLossWPerK: number; engineLossWPerK: number; couplingWPerK: number; startC: number; engineStartC?: number },
): LogSeries {
  const n = Math.floor((o.hours * 3600) / o.stepS) + 1;
  const tS = Float64Array.from({ length: n }, (_, i) => i * o.stepS);
  const amb = Float64Array.from(tS, (s) => o.ambient(s / 3600));
  const atMs = Array.from(tS, (s) => o.startMs + s * 1000);
  const sim = simulate(
    {
      startMs: atMs[0],
      endMs: atMs[n - 1],
      outside: atMs.map((t, i) => ({ atMs: t, tempC: amb[i] })),
      shelter: { kind: 'tie-down' },
      oil: { heatCapacityJPerK: o.oilJPerK, lossWPerK: o.oilLossWPerK, initialTempC: o.startC },
      engine: { heatCapacityJPerK: o.engineJPerK, lossWPerK: o.engineLossWPerK, initialTempC: o.engineStartC ?? o.startC },
      couplingWPerK: o.couplingWPerK,
    },
    { atMs },
  );
  return addNoise(o, tS, Float64Array.from(sim.oilC), amb);
}

function addNoise(o: SyntheticOptions, tS: Float64Array, clean: Float64Array, amb: Float64Array): LogSeries {
  const r = rng(o.seed ?? 1);
  const oil = Float64Array.from(clean, (v) => v + o.noiseK * r.normal());
  return {
    t: Float64Array.from(tS, (s) => o.startMs + s * 1000),
    oil,
    ambient: o.logAmbient === false ? null : amb,
    heater: null,
  };
}

