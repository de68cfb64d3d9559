// The planner's view of the model. The model is linear in the heater powers, so the oil temperature
// at any time T is affine in the power of each heater slot:
//   oil(T) = base(T) + Σ_k perWatt[k] · P_k.
// base(T) is the run as given (its own heaters included; give none for the free response);
// perWatt[k] is the oil rise at T from 1 W held constant over slot k on the chosen node: the
// exact effect of that unit input over the slot, propagated to T. Computed in one forward pass over
// the slot edges and the model's breakpoints: per step every live slot's response vector is
// multiplied by Φ once, and slots still on get Γ0·e_node / C_node added.
import { sampleStates, walk } from './integrate';
import { compile, nodeIndex } from './plan';
import type { NodeName, SoakModel } from './types';

export interface HeaterSlot {
  fromMs: number;
  toMs: number;
}

export interface HeaterResponse {
  /** The evaluation time T, epoch ms. */
  atMs: number;
  /** Oil temperature at T for the model as given (its own heaters included), °C. */
  baseOilC: number;
  /** perWattK[k]: oil rise at T per watt in slot k, K/W (0 for slots starting at or after T). */
  perWattK: Float64Array;
  /** The same at every slot end, for floor constraints. */
  slotEnds: {
    /** End of slot j (clamped to the run's end), epoch ms. */
    atMs: Float64Array;
    /** Oil at the end of slot j for the model as given, °C. */
    baseOilC: Float64Array;
    /** perWattK[j][k]: oil rise at the end of slot j per watt in slot k, K/W (0 when slot k starts at or after it). */
    perWattK: Float64Array[];
  };
}

/**
 * Affine response of the oil temperature to heater power per slot, at `atMs` and at every slot
 * end. `node` is the node the heater heats. Slots are clipped to the run; they may overlap.
 */
export function heaterResponse(model: SoakModel, opts: { node: NodeName; slots: readonly HeaterSlot[]; atMs: number }): HeaterResponse {
  const plan = compile(model);
  const T = Math.min(Math.max(opts.atMs, plan.startMs), plan.endMs);
  const ni = nodeIndex(plan, opts.node);
  if (ni < 0) throw new Error(`the model has no "${opts.node}" node`);
  const K = opts.slots.length;
  const n = plan.n;
  const io = plan.iO;
  const from = new Float64Array(K);
  const to = new Float64Array(K);
  for (let k = 0; k < K; k++) {
    from[k] = Math.min(Math.max(opts.slots[k].fromMs, plan.startMs), plan.endMs);
    to[k] = Math.min(Math.max(opts.slots[k].toMs, plan.startMs), plan.endMs);
  }
  const stops = Array.from(new Set([...from, ...to, T])).sort((a, b) => a - b);
  const last = Math.max(T, ...to, plan.startMs);

  const r = new Float64Array(K * n);
  const tmp = new Float64Array(n);
  const perWattK = new Float64Array(K);
  const endRows: Float64Array[] = Array.from({ length: K }, () => new Float64Array(K));
  const invC = 1 / plan.caps[ni];
  // Slots ending at a time, so rows are filled when the walk reaches it.
  const endsAt = new Map<number, number[]>();
  for (let j = 0; j < K; j++) endsAt.set(to[j], [...(endsAt.get(to[j]) ?? []), j]);
  const record = (t: number) => {
    if (t === T) for (let k = 0; k < K; k++) perWattK[k] = r[k * n + io];
    const js = endsAt.get(t);
    if (js) for (const j of js) for (let k = 0; k < K; k++) endRows[j][k] = r[k * n + io];
  };
  record(plan.startMs);
  if (last > plan.startMs) {
    walk(
      plan,
      stops,
      ({ ta, tb, d }) => {
        for (let k = 0; k < K; k++) {
          if (from[k] >= tb) continue; // not started: still zero
          const on = from[k] <= ta && to[k] >= tb;
          const off = k * n;
          for (let i = 0; i < n; i++) {
            let s = on ? d.gamma0[i * n + ni] * invC : 0;
            for (let m = 0; m < n; m++) s += d.phi[i * n + m] * r[off + m];
            tmp[i] = s;
          }
          for (let i = 0; i < n; i++) r[off + i] = tmp[i];
        }
        record(tb);
      },
      last,
    );
  }

  const baseTimes = Array.from(new Set([...to, T])).sort((a, b) => a - b);
  const baseStates = sampleStates(plan, baseTimes)[io];
  const baseAt = new Map<number, number>();
  baseTimes.forEach((t, i) => baseAt.set(t, baseStates[i]));
  return {
    atMs: T,
    baseOilC: baseAt.get(T)!,
    perWattK,
    slotEnds: { atMs: to, baseOilC: to.map((t) => baseAt.get(t)!), perWattK: endRows },
  };
}

/**
 * Sensitivity of the oil temperature at `atMs` to each outside-temperature point, K per K
 * (`model.outside[i]`), for carrying forecast error into a readiness probability: with point
 * errors e_i, oil(T) ≈ oil(T) + Σ_i s_i·e_i. Exact for a tie-down and an unheated hangar (the
 * model is linear in the outside temperature); for a heated hangar it is the local derivative
 * (the thermostat clips). Computed by perturbing one point at a time.
 */
export function outsideSensitivity(model: SoakModel, atMs: number): Float64Array {
  const T = [Math.min(Math.max(atMs, model.startMs), model.endMs)];
  const plan0 = compile(model);
  const base = sampleStates(plan0, T)[plan0.iO][0];
  const delta = 1e-3;
  const out = new Float64Array(model.outside.length);
  for (let i = 0; i < model.outside.length; i++) {
    if (model.outside[i].atMs > T[0] && i > 0 && model.outside[i - 1].atMs >= T[0]) continue; // cannot reach back in time
    const outside = model.outside.map((p, k) => (k === i ? { atMs: p.atMs, tempC: p.tempC + delta } : p));
    const plan = compile({ ...model, outside });
    out[i] = (sampleStates(plan, T)[plan.iO][0] - base) / delta;
  }
  return out;
}
