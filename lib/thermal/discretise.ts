// Exact discretisation of dx/dt = A·x + w(t) with w linear in time over a step (first-order hold).
//
// With w(s) = w0 + w1·s on [0, h]:  x(h) = Φ·x(0) + Γ0·w0 + Γ1·w1, where
//   Φ = e^{A h},  Γ0 = ∫0^h e^{A(h−σ)} dσ,  Γ1 = ∫0^h e^{A(h−σ)} σ dσ.
// All three come from one matrix exponential of the augmented matrix (time scaled by h so the
// blocks are of order one):
//   expm([[A h, I, 0], [0, 0, I], [0, 0, 0]]) = [[Φ, Γ0/h, Γ1/h²], [0, I, I/2·…], …].
// mathjs `expm` is slow per call (~0.2 ms), so results are cached per (A, h): a run with a 1-minute
// output grid needs only a handful of exponentials, and the state updates are plain Float64 work.
import { expm, matrix, type Matrix } from 'mathjs';

/** A linear system's dynamics matrix, row-major n×n, units 1/s. */
export interface LinearSystem {
  n: number;
  A: Float64Array;
  /** Step length (s) → discretisation; lives as long as the system stays in the process cache. */
  steps: Map<number, Discretisation>;
}

/** Φ, Γ0, Γ1 for one step length, row-major n×n; units: Φ 1, Γ0 s, Γ1 s². */
export interface Discretisation {
  h: number;
  phi: Float64Array;
  gamma0: Float64Array;
  gamma1: Float64Array;
}

const SYSTEM_CACHE_LIMIT = 2048;
const systems = new Map<number, LinearSystem[]>();
let systemCount = 0;
let expmCalls = 0;

/** Number of matrix exponentials computed so far in this process (for the bench and tests). */
export function expmCount(): number {
  return expmCalls;
}

const bits = new Float64Array(1);
const words = new Uint32Array(bits.buffer);

function hashOf(A: Float64Array): number {
  let h = 0x811c9dc5 ^ A.length;
  for (let i = 0; i < A.length; i++) {
    bits[0] = A[i];
    h = Math.imul(h ^ words[0], 0x01000193);
    h = Math.imul(h ^ words[1], 0x01000193);
  }
  return h >>> 0;
}

function same(a: Float64Array, b: Float64Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/**
 * The process-wide system with this matrix (created if new), so its cached discretisations are
 * shared by every run with the same parameters — a fleet of aircraft of a few classes in a few
 * shelters needs a few dozen exponentials, not one set per aircraft.
 */
export function makeSystem(n: number, A: Float64Array): LinearSystem {
  const h = hashOf(A);
  const bucket = systems.get(h);
  if (bucket) for (const s of bucket) if (s.n === n && same(s.A, A)) return s;
  if (systemCount >= SYSTEM_CACHE_LIMIT) {
    systems.clear();
    systemCount = 0;
  }
  const sys: LinearSystem = { n, A: new Float64Array(A), steps: new Map() };
  if (bucket) bucket.push(sys);
  else systems.set(h, [sys]);
  systemCount++;
  return sys;
}

/** ‖A‖∞·h above which the step is halved before the exponential (mathjs expm searches a bounded table). */
const MAX_SCALED_NORM = 512;

function expmStep(sys: LinearSystem, h: number): Discretisation {
  const n = sys.n;
  const m = 3 * n;
  const rows: number[][] = [];
  for (let i = 0; i < m; i++) rows.push(new Array<number>(m).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) rows[i][j] = sys.A[i * n + j] * h;
    rows[i][n + i] = 1;
    rows[n + i][2 * n + i] = 1;
  }
  expmCalls++;
  const E = (expm(matrix(rows)) as Matrix).toArray() as number[][];
  const phi = new Float64Array(n * n);
  const gamma0 = new Float64Array(n * n);
  const gamma1 = new Float64Array(n * n);
  const h2 = h * h;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      phi[i * n + j] = E[i][j];
      gamma0[i * n + j] = E[i][n + j] * h;
      gamma1[i * n + j] = E[i][2 * n + j] * h2;
    }
  }
  return { h, phi, gamma0, gamma1 };
}

function matMul(n: number, a: Float64Array, b: Float64Array): Float64Array {
  const c = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let k = 0; k < n; k++) for (let j = 0; j < n; j++) c[i * n + j] += a[i * n + k] * b[k * n + j];
  return c;
}

/**
 * Two steps of h as one of 2h: Φ' = Φ², Γ0' = Φ·Γ0 + Γ0, Γ1' = Φ·Γ1 + h·Γ0 + Γ1
 * (split ∫0^{2h} at h; exact, and stable for the decaying systems of the model).
 */
function doubled(n: number, d: Discretisation): Discretisation {
  const { h, phi, gamma0, gamma1 } = d;
  const g0 = matMul(n, phi, gamma0);
  const g1 = matMul(n, phi, gamma1);
  for (let i = 0; i < n * n; i++) {
    g1[i] += h * gamma0[i] + gamma1[i];
    g0[i] += gamma0[i];
  }
  return { h: 2 * h, phi: matMul(n, phi, phi), gamma0: g0, gamma1: g1 };
}

function compute(sys: LinearSystem, h: number): Discretisation {
  const n = sys.n;
  let norm = 0;
  for (let i = 0; i < n; i++) {
    let row = 0;
    for (let j = 0; j < n; j++) row += Math.abs(sys.A[i * n + j]);
    norm = Math.max(norm, row);
  }
  const halvings = Math.max(0, Math.ceil(Math.log2((norm * h) / MAX_SCALED_NORM)));
  let d = expmStep(sys, h / 2 ** halvings);
  for (let k = 0; k < halvings; k++) d = doubled(n, d);
  return { ...d, h };
}

/** Discretisation of `sys` for a step of h seconds, cached with the system. */
export function discretise(sys: LinearSystem, h: number): Discretisation {
  let d = sys.steps.get(h);
  if (!d) {
    d = compute(sys, h);
    if (sys.steps.size >= 256) sys.steps.clear();
    sys.steps.set(h, d);
  }
  return d;
}

/** Uncached discretisation, for the odd sub-step lengths of root finding. */
export function discretiseOnce(sys: LinearSystem, h: number): Discretisation {
  return sys.steps.get(h) ?? compute(sys, h);
}
