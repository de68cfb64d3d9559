// Stepping a compiled plan: exact state updates x ← Φ·x + Γ0·w0 + Γ1·w1 between any chosen times.
import { discretise, discretiseOnce, type Discretisation } from './discretise';
import type { Plan, Segment } from './plan';

/** Step length in seconds, rounded to the microsecond so equal steps share one cached exponential. */
function stepSeconds(ta: number, tb: number): number {
  return Math.round((tb - ta) * 1000) / 1e6;
}

let scratch = new Float64Array(0);

/** Φ padded to 3×3 into F, and the step's input terms: x ← Φx + P·Tout(step start) + Q. */
function loadStep(seg: Segment, h: number, n: number, F: Float64Array, P: Float64Array, Q: Float64Array): void {
  const d = discretise(seg.sys, h);
  F.fill(0);
  P.fill(0);
  Q.fill(0);
  for (let i = 0; i < n; i++) {
    let pi = 0;
    let qi = 0;
    let ri = 0;
    for (let k = 0; k < n; k++) {
      F[i * 3 + k] = d.phi[i * n + k];
      pi += d.gamma0[i * n + k] * seg.g[k];
      qi += d.gamma0[i * n + k] * seg.c[k];
      ri += d.gamma1[i * n + k] * seg.g[k];
    }
    P[i] = pi;
    Q[i] = qi + ri * seg.slope;
  }
}

/**
 * States at the given times (sorted, within [start, end]); returns one Float64Array per state
 * (index as in the plan: shelter, oil, engine). The hot path of the model: per step nine
 * multiply-adds on scalars (up to three states), one exponential per distinct (system, step length).
 */
export function sampleStates(plan: Plan, times: ArrayLike<number>, outsideOut?: Float64Array): Float64Array[] {
  const n = plan.n;
  if (n > 3) throw new Error('at most three states');
  const N = times.length;
  const out: Float64Array[] = [];
  for (let i = 0; i < n; i++) out.push(new Float64Array(N));
  if (n < 3 && scratch.length < N) scratch = new Float64Array(N);
  const o0 = out[0];
  const o1 = n > 1 ? out[1] : scratch;
  const o2 = n > 2 ? out[2] : scratch;
  if (!outsideOut && scratch.length < N) scratch = new Float64Array(N);
  const oT = outsideOut ?? scratch;
  const F = new Float64Array(9);
  const P = new Float64Array(3);
  const Q = new Float64Array(3);
  let x0 = plan.x0[0];
  let x1 = n > 1 ? plan.x0[1] : 0;
  let x2 = n > 2 ? plan.x0[2] : 0;
  let j = 0;
  let t = plan.startMs;
  for (; j < N && times[j] <= t; j++) {
    o0[j] = x0;
    o1[j] = x1;
    o2[j] = x2;
    oT[j] = plan.segs[0].tout0;
  }
  const segs = plan.segs;
  let f00 = 0, f01 = 0, f02 = 0, f10 = 0, f11 = 0, f12 = 0, f20 = 0, f21 = 0, f22 = 0;
  let p0 = 0, p1 = 0, p2 = 0, q0 = 0, q1 = 0, q2 = 0;
  let lastDt = -1;
  for (let si = 0; si < segs.length; si++) {
    const seg = segs[si];
    if (!Number.isNaN(seg.pin)) x0 = seg.pin; // the shelter is state 0 whenever it exists
    const t1 = seg.t1;
    const segT0 = seg.t0;
    const tout0 = seg.tout0;
    const slope = seg.slope / 1000;
    lastDt = -1; // P and Q belong to the segment
    // One step to each output in (t, t1], then one to t1 (unless an output fell on it).
    for (;;) {
      const rec = j < N && times[j] <= t1;
      const tn = rec ? times[j] : t1;
      const dt = tn - t;
      if (dt > 0) {
        if (dt !== lastDt) {
          loadStep(seg, stepSeconds(t, tn), n, F, P, Q);
          f00 = F[0]; f01 = F[1]; f02 = F[2];
          f10 = F[3]; f11 = F[4]; f12 = F[5];
          f20 = F[6]; f21 = F[7]; f22 = F[8];
          p0 = P[0]; p1 = P[1]; p2 = P[2];
          q0 = Q[0]; q1 = Q[1]; q2 = Q[2];
          lastDt = dt;
        }
        const tout = tout0 + slope * (t - segT0);
        const y0 = f00 * x0 + f01 * x1 + f02 * x2 + p0 * tout + q0;
        const y1 = f10 * x0 + f11 * x1 + f12 * x2 + p1 * tout + q1;
        x2 = f20 * x0 + f21 * x1 + f22 * x2 + p2 * tout + q2;
        x0 = y0;
        x1 = y1;
        t = tn;
      }
      if (!rec) break;
      o0[j] = x0;
      o1[j] = x1;
      o2[j] = x2;
      oT[j] = tout0 + slope * (tn - segT0);
      j++;
      // A run of outputs at the same spacing (the usual grid): count it, then step without checks.
      let k = j;
      while (k < N && times[k] <= t1 && times[k] - times[k - 1] === lastDt) k++;
      if (k > j) {
        let tout = tout0 + slope * (t - segT0);
        const dTout = slope * lastDt;
        for (; j < k; j++) {
          const y0 = f00 * x0 + f01 * x1 + f02 * x2 + p0 * tout + q0;
          const y1 = f10 * x0 + f11 * x1 + f12 * x2 + p1 * tout + q1;
          x2 = f20 * x0 + f21 * x1 + f22 * x2 + p2 * tout + q2;
          x0 = y0;
          x1 = y1;
          tout += dTout;
          o0[j] = x0;
          o1[j] = x1;
          o2[j] = x2;
          oT[j] = tout;
        }
        t = times[k - 1];
      }
    }
  }
  const lastSegment = segs[segs.length - 1];
  for (; j < N; j++) {
    o0[j] = x0;
    o1[j] = x1;
    o2[j] = x2;
    oT[j] = lastSegment.tout0 + (lastSegment.slope / 1000) * (t - lastSegment.t0);
  }
  return out;
}

/** Outside temperature inside a segment at time t. */
export function segOutside(seg: Segment, t: number): number {
  return seg.tout0 + (seg.slope * (t - seg.t0)) / 1000;
}

/** Advances x (in place) by h seconds within seg starting at time t, with the given discretisation. */
export function advance(seg: Segment, d: Discretisation, x: Float64Array, t: number): void {
  const n = x.length;
  const tout = segOutside(seg, t);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let k = 0; k < n; k++) {
      s += d.phi[i * n + k] * x[k] + d.gamma0[i * n + k] * (seg.g[k] * tout + seg.c[k]) + d.gamma1[i * n + k] * seg.g[k] * seg.slope;
    }
    y[i] = s;
  }
  x.set(y);
}

/** The exact state at t + dtMs from state x at time t inside seg (uncached exponential). */
export function stateAfter(seg: Segment, x: Float64Array, t: number, dtMs: number): Float64Array {
  const y = new Float64Array(x);
  if (dtMs > 0) advance(seg, discretiseOnce(seg.sys, dtMs / 1000), y, t);
  return y;
}

/** Time derivative of state i (K/s) at state x, time t, inside seg. */
export function derivative(seg: Segment, x: Float64Array, t: number, i: number): number {
  const n = x.length;
  let s = seg.g[i] * segOutside(seg, t) + seg.c[i];
  for (let k = 0; k < n; k++) s += seg.sys.A[i * n + k] * x[k];
  return s;
}

export interface Step {
  seg: Segment;
  ta: number;
  tb: number;
  xa: Float64Array;
  xb: Float64Array;
  d: Discretisation;
}

/**
 * Walks the plan from start to `untilMs` (default end) in steps that end at every segment boundary
 * and at every time in `stops` (sorted). `visit` returns true to stop early. xa/xb are reused buffers.
 */
export function walk(plan: Plan, stops: ArrayLike<number>, visit: (s: Step) => boolean | void, untilMs = plan.endMs): void {
  const n = plan.n;
  const xa = new Float64Array(plan.x0);
  const xb = new Float64Array(n);
  let j = 0;
  let t = plan.startMs;
  for (const seg of plan.segs) {
    if (seg.t0 >= untilMs) return;
    if (!Number.isNaN(seg.pin)) xa[plan.iS] = seg.pin;
    while (t < seg.t1 && t < untilMs) {
      while (j < stops.length && stops[j] <= t) j++;
      let tn = j < stops.length && stops[j] < seg.t1 ? stops[j] : seg.t1;
      if (tn > untilMs) tn = untilMs;
      const d = discretise(seg.sys, stepSeconds(t, tn));
      xb.set(xa);
      advance(seg, d, xb, t);
      if (visit({ seg, ta: t, tb: tn, xa, xb, d })) return;
      xa.set(xb);
      t = tn;
    }
  }
}
