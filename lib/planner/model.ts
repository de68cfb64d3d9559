// Small operations on a SoakModel for the planner: add heaters, restart from a state, re-simulate.
import { oilMinimum, simulate, stateAt, type HeaterInterval, type NodeName, type SoakModel } from '@/lib/thermal';
import type { Interval } from './types';

/** The heaters switched together (one control): the parts when given, else the heater itself. */
export function partsOf(heater: { node: NodeName; powerW: number; parts?: readonly { node: NodeName; powerW: number }[] }): { node: NodeName; powerW: number }[] {
  return heater.parts?.length ? [...heater.parts] : [{ node: heater.node, powerW: heater.powerW }];
}

/** The model with the planned heater (each of its parts on its own node) on over `on` (its own heaters kept). */
export function withHeater(model: SoakModel, heater: { node: NodeName; powerW: number; parts?: readonly { node: NodeName; powerW: number }[] }, on: readonly Interval[]): SoakModel {
  const planned: HeaterInterval[] = partsOf(heater).flatMap((h) => on.map((i) => ({ node: h.node, powerW: h.powerW, fromMs: i.fromMs, toMs: i.toMs })));
  return { ...model, heaters: [...(model.heaters ?? []), ...planned] };
}

/**
 * The same run restarted at `atMs` from its exact state there (the model is Markov in shelter,
 * oil and engine temperatures), ending at `endMs` (default: the run's end; later ends extend the
 * run with the outside held flat beyond its last point).
 */
export function restartAt(model: SoakModel, atMs: number, endMs = model.endMs): SoakModel {
  const s = stateAt(model, atMs);
  return {
    ...model,
    startMs: atMs,
    endMs,
    oil: { ...model.oil, initialTempC: s.oilC },
    engine: model.engine && s.engineC !== null ? { ...model.engine, initialTempC: s.engineC } : model.engine,
    shelter: model.shelter.kind === 'hangar' ? { ...model.shelter, initialTempC: s.shelterC } : model.shelter,
  };
}

/**
 * Lowest oil over [fromMs, toMs] (fromMs < toMs): sampled every `gridMs` and at every heater edge
 * and outside point (where the curve can have a kink), so between samples the curve is smooth and
 * can dip below them by well under 1e-4 K at a one-minute grid; with `exact`, the lowest sample's
 * neighbourhood is then searched on the continuous solution (lib/thermal oilMinimum).
 */
export function oilMinimumBetween(
  model: SoakModel,
  fromMs: number,
  toMs: number,
  o: { exact?: boolean; gridMs?: number } = {},
): { atMs: number; oilC: number } {
  const grid = o.gridMs ?? 60_000;
  const set = new Set<number>();
  for (let t = fromMs; t < toMs; t += grid) set.add(t);
  set.add(toMs);
  for (const h of model.heaters ?? []) for (const t of [h.fromMs, h.toMs]) if (t > fromMs && t < toMs) set.add(t);
  for (const p of model.outside) if (p.atMs > fromMs && p.atMs < toMs) set.add(p.atMs);
  const times = Float64Array.from(set).sort();
  const oil = simulate(model, { atMs: times }).oilC;
  let i = 0;
  for (let j = 1; j < oil.length; j++) if (oil[j] < oil[i]) i = j;
  let best = { atMs: times[i], oilC: oil[i] };
  if (o.exact && times.length > 1) {
    const a = times[Math.max(0, i - 1)];
    const b = times[Math.min(times.length - 1, i + 1)];
    const m = a > model.startMs ? restartAt(model, a, b) : { ...model, endMs: b };
    const e = oilMinimum(m);
    if (e.oilC < best.oilC) best = e;
  }
  return best;
}

/** Oil at departure, re-simulated through lib/thermal. */
export function oilAt(model: SoakModel, atMs: number): number {
  return stateAt(model, atMs).oilC;
}
