// Thawline's soak model: how a parked engine's oil cools (and warms under a heater) overnight.
//
// Pure TypeScript — no database, network, clock or framework. Inputs are plain data (`SoakModel`,
// times as epoch ms); outputs are typed arrays or plain objects.
//
// The model (docs/soak-model.md): a linear lumped heat balance.
//   shelter air  Cs·dTs/dt = −Gs·(Ts − Tout) + a·A·I_sun + P_space   (hangar / T-hangar; heated
//                hangars hold their set-point while the heating power allows; tie-down: Ts = Tout)
//   oil          Co·dTo/dt = −Go·(To − Ts) − Goe·(To − Te) + Po
//   engine mass  Ce·dTe/dt = −Ge·(Te − Ts) − Goe·(Te − To) + Pe      (optional second node)
// A cover multiplies Go, Ge by the cover factor; wind on a tie-down multiplies them by 1 + k·√v.
// The shelter does not feel the engines (one-way coupling), so a shelter's air is the same for
// every aircraft in it and its thermostat is solved exactly on its own first.
//
// Integration is exact: between breakpoints of the inputs (outside points — linear between them —,
// heater edges, wind and cloud changes, clock hours of the sun, thermostat events) the update is
// x ← Φ·x + Γ0·w0 + Γ1·w1 from one matrix exponential (first-order hold, mathjs `expm`), cached
// per step length. Output times only cut steps, never change inputs, so results do not depend on
// the output interval beyond rounding.
//
// What to call:
//   simulate(model, { outputEveryMinutes })  the Soak forecast as typed arrays (the hot path)
//   stateAt / statesAt                       exact temperatures at chosen instants
//   oilMinimum, firstOilCrossing             lowest oil and when; first time oil reaches a level
//   runSimulation(parsed)                    the simulate contract (CLI and POST /api/v1/simulations)
// For the planner (the model is linear, so oil(T) is affine in each heater slot's power):
//   heaterResponse(model, { node, slots, atMs })
//       → baseOilC (the model as given; pass it without heaters for the free response),
//         perWattK[k] (K per W in slot k, at T) and slotEnds (the same at every slot end, for an
//         overnight floor): oil(T) = baseOilC + Σ perWattK[k]·P_k, exactly.
//   outsideSensitivity(model, atMs)          K of oil at T per K at each outside point (forecast error)
// Presets (presets.ts), frost point (frost.ts) and oil volume (oil.ts) are re-exported here.
import { firstCrossingOf, minimumOf } from './analysis';
import { sampleStates } from './integrate';
import { compile } from './plan';
import { outputTimes, seriesOf } from './run';
import type { SoakModel, SoakSeries } from './types';

export type { SoakModel, SoakSeries, ThermalNode, HeaterInterval, ShelterModel, HangarShelter, TieDownShelter, NodeName } from './types';
export { heaterResponse, outsideSensitivity, type HeaterResponse, type HeaterSlot } from './response';
export { runSimulation, toSoakModel, outputTimes, type SimulationOutput, type SimulationPoint } from './run';
export { outsideAt } from './plan';
export { expmCount } from './discretise';
export { sunElevationDeg, clearSkyGhi, cloudFactor } from './solar';
export * from './constants';
export * from './presets';
export * from './frost';
export * from './oil';

/**
 * The Soak forecast: states at every `outputEveryMinutes` from start to end inclusive (end always
 * included), or at the given sorted times `atMs` within [start, end].
 */
export function simulate(model: SoakModel, o: { outputEveryMinutes: number } | { atMs: ArrayLike<number> }): SoakSeries {
  const plan = compile(model);
  const times = 'atMs' in o ? Float64Array.from(o.atMs) : outputTimes(model.startMs, model.endMs, o.outputEveryMinutes);
  return seriesOf(plan, times);
}

/** Exact temperatures at one instant in [start, end]. */
export function stateAt(model: SoakModel, atMs: number): { shelterC: number; oilC: number; engineC: number | null } {
  return (({ shelterC, oilC, engineC }) => ({ shelterC: shelterC[0], oilC: oilC[0], engineC: engineC ? engineC[0] : null }))(
    simulate(model, { atMs: [atMs] }),
  );
}

/** The lowest oil temperature over the run on the continuous solution, and when (epoch ms). */
export function oilMinimum(model: SoakModel): { atMs: number; oilC: number } {
  const plan = compile(model);
  const m = minimumOf(plan, plan.iO);
  return { atMs: m.atMs, oilC: m.value };
}

/**
 * The first time (epoch ms) the oil reaches `tempC` — falling to it or rising to it — exact to
 * under a millisecond (root finding on the exact solution); null if it never does in the run.
 */
export function firstOilCrossing(model: SoakModel, tempC: number): number | null {
  const plan = compile(model);
  return firstCrossingOf(plan, plan.iO, tempC);
}

/** The raw states at sorted times (shelter, oil, engine order as present), for benchmarks and tests. */
export function statesAt(model: SoakModel, atMs: ArrayLike<number>): Float64Array[] {
  return sampleStates(compile(model), atMs);
}
