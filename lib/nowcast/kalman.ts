// Kalman nowcast on the soak model: pure, no I/O, no clock.
//
// The engine nodes (oil, optionally engine mass) obey dx/dt = A·x + w(t), linear, with the shelter
// air and the heater powers as inputs w. Over a step h with w linear in time the exact update is
// x ← Φ·x + Γ0·w0 + Γ1·w1 (lib/thermal/discretise.ts), which is the filter's transition. Process
// noise Q (K² per step, scaled by h) stands for what the model misses; measurement noise R for the probe.
// Standard discrete Kalman filter (predict, then update per reading): see docs/soak-model.md, Nowcast.
import { discretise, makeSystem, type LinearSystem } from '../thermal/discretise';

export type NowcastNode = 'oil' | 'engine';

/** Engine parameters of the nowcast (as in the soak model: J/K, W/K). */
export interface NowcastEngine {
  oil: { heatCapacityJPerK: number; lossWPerK: number };
  engine?: { heatCapacityJPerK: number; lossWPerK: number };
  couplingWPerK?: number;
}

export interface NowcastModel {
  n: number;
  nodes: NowcastNode[];
  sys: LinearSystem;
  /** Per node: loss to the shelter over C (1/s), 1/C (K/J). */
  lossOverC: number[];
  invC: number[];
}

export interface NowcastNoise {
  /** Process noise variance growth, K² per hour, per node. */
  processK2PerHour: number;
  /** Probe variance, K². */
  measurementK2: number;
}

export interface FilterState {
  x: Float64Array;
  /** Covariance, row-major n×n, K². */
  P: Float64Array;
}

export interface StepInputs {
  /** Shelter air at the start and end of the step, °C. */
  shelterC0: number;
  shelterC1: number;
  /** Heater power per node over the step, W (constant over the step). */
  powerW?: Partial<Record<NowcastNode, number>>;
}

export function nowcastModel(e: NowcastEngine): NowcastModel {
  const nodes: NowcastNode[] = e.engine ? ['oil', 'engine'] : ['oil'];
  const n = nodes.length;
  const g = e.couplingWPerK ?? 0;
  const A = new Float64Array(n * n);
  const Co = e.oil.heatCapacityJPerK;
  const Go = e.oil.lossWPerK;
  if (n === 1) {
    A[0] = -Go / Co;
  } else {
    const Ce = e.engine!.heatCapacityJPerK;
    const Ge = e.engine!.lossWPerK;
    A[0] = -(Go + g) / Co;
    A[1] = g / Co;
    A[2] = g / Ce;
    A[3] = -(Ge + g) / Ce;
  }
  const lossOverC = [Go / Co];
  const invC = [1 / Co];
  if (n === 2) {
    lossOverC.push(e.engine!.lossWPerK / e.engine!.heatCapacityJPerK);
    invC.push(1 / e.engine!.heatCapacityJPerK);
  }
  return { n, nodes, sys: makeSystem(n, A), lossOverC, invC };
}

export function initialState(model: NowcastModel, tempC: number[], varianceK2: number): FilterState {
  const n = model.n;
  const P = new Float64Array(n * n);
  for (let i = 0; i < n; i++) P[i * n + i] = varianceK2;
  return { x: Float64Array.from(tempC.slice(0, n)), P };
}

function mul(n: number, a: Float64Array, b: Float64Array): Float64Array {
  const c = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let k = 0; k < n; k++) for (let j = 0; j < n; j++) c[i * n + j] += a[i * n + k] * b[k * n + j];
  return c;
}

function transpose(n: number, a: Float64Array): Float64Array {
  const t = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) t[j * n + i] = a[i * n + j];
  return t;
}

/** Transition Φ and the process noise Q for a step of h seconds. */
export function transition(model: NowcastModel, h: number, noise: NowcastNoise): { phi: Float64Array; Q: Float64Array } {
  const d = discretise(model.sys, h);
  const n = model.n;
  const Q = new Float64Array(n * n);
  for (let i = 0; i < n; i++) Q[i * n + i] = (noise.processK2PerHour * h) / 3600;
  return { phi: d.phi, Q };
}

/** Predict over h seconds: x ← Φx + Γ0·w0 + Γ1·w1, P ← ΦPΦᵀ + Q. */
export function predict(model: NowcastModel, s: FilterState, h: number, u: StepInputs, noise: NowcastNoise): FilterState {
  if (!(h > 0)) return s;
  const n = model.n;
  const d = discretise(model.sys, h);
  const w0 = new Float64Array(n);
  const w1 = new Float64Array(n);
  const slope = (u.shelterC1 - u.shelterC0) / h;
  for (let i = 0; i < n; i++) {
    const p = u.powerW?.[model.nodes[i]] ?? 0;
    w0[i] = model.lossOverC[i] * u.shelterC0 + model.invC[i] * p;
    w1[i] = model.lossOverC[i] * slope;
  }
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let v = 0;
    for (let k = 0; k < n; k++) v += d.phi[i * n + k] * s.x[k] + d.gamma0[i * n + k] * w0[k] + d.gamma1[i * n + k] * w1[k];
    x[i] = v;
  }
  const P = mul(n, mul(n, d.phi, s.P), transpose(n, d.phi));
  for (let i = 0; i < n; i++) P[i * n + i] += (noise.processK2PerHour * h) / 3600;
  return { x, P };
}

/** Update with one reading of one node: K = P·Hᵀ/(H·P·Hᵀ + R), Joseph form for P. Returns the gain too. */
export function update(model: NowcastModel, s: FilterState, node: NowcastNode, readingC: number, measurementK2: number): FilterState & { gain: Float64Array } {
  const n = model.n;
  const j = model.nodes.indexOf(node);
  if (j < 0) throw new Error(`no ${node} node in this model`);
  const S = s.P[j * n + j] + measurementK2;
  const K = new Float64Array(n);
  for (let i = 0; i < n; i++) K[i] = s.P[i * n + j] / S;
  const innov = readingC - s.x[j];
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = s.x[i] + K[i] * innov;
  // Joseph form: P = (I − K H) P (I − K H)ᵀ + K R Kᵀ, stays symmetric and positive.
  const IKH = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    IKH[i * n + i] = 1;
    IKH[i * n + j] -= K[i];
  }
  const P = mul(n, mul(n, IKH, s.P), transpose(n, IKH));
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) P[a * n + b] += K[a] * measurementK2 * K[b];
  return { x, P, gain: K };
}

/** A reading a probe could not have taken (outside −60…+200 °C or not finite) is not trusted. */
export function plausibleReading(tempC: number): boolean {
  return Number.isFinite(tempC) && tempC > -60 && tempC < 200;
}
