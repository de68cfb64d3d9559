// The minimum of a state and the first time it crosses a temperature, on the exact (continuous)
// solution: a walk on a fixed 10-minute grid (independent of any output interval) brackets the
// answer, and a root finder on the exact solution inside the step pins it down to under a millisecond.
import { derivative, stateAfter, walk, type Step } from './integrate';
import type { Plan, Segment } from './plan';

const GRID_MS = 600_000;
const TIME_TOL_MS = 0.5;

function grid(plan: Plan): Float64Array {
  const m = Math.floor((plan.endMs - plan.startMs) / GRID_MS);
  const g = new Float64Array(m + 1);
  for (let k = 0; k <= m; k++) g[k] = plan.startMs + k * GRID_MS;
  return g;
}

/** Root of f between a and b, f(a)·f(b) < 0 or f(b) = 0: Illinois false position, to under a millisecond. */
function rootOn(f: (s: number) => number, a: number, b: number, fa: number, fb: number): number {
  if (fb === 0) return b;
  if (fa === 0) return a;
  for (let it = 0; it < 200 && Math.abs(b - a) > TIME_TOL_MS; it++) {
    let s = (a * fb - b * fa) / (fb - fa);
    if (!Number.isFinite(s) || s === a || s === b) s = 0.5 * (a + b);
    const fs = f(s);
    if (fs === 0) return s;
    if (fs * fb < 0) {
      a = b;
      fa = fb;
    } else {
      fa /= 2;
    }
    b = s;
    fb = fs;
  }
  return b;
}

interface Candidate {
  seg: Segment;
  ta: number;
  h: number;
  xa: Float64Array;
  bound: number;
}

/** Stationary point of state i inside a step whose derivative changes sign; returns its time and value. */
function extremum(c: Candidate, i: number): { atMs: number; value: number } {
  const D = (s: number) => derivative(c.seg, stateAfter(c.seg, c.xa, c.ta, s), c.ta + s, i);
  const s = rootOn(D, 0, c.h, D(0), D(c.h));
  return { atMs: c.ta + s, value: stateAfter(c.seg, c.xa, c.ta, s)[i] };
}

function candidateOf(st: Step, i: number, dA: number, dB: number): Candidate {
  const h = st.tb - st.ta;
  const bound = Math.min(st.xa[i], st.xb[i]) - (h / 1000) * Math.max(Math.abs(dA), Math.abs(dB));
  return { seg: st.seg, ta: st.ta, h, xa: new Float64Array(st.xa), bound };
}

/** Lowest value of state i over [start, end] on the continuous solution, and when (epoch ms). */
export function minimumOf(plan: Plan, i: number): { atMs: number; value: number } {
  let best = { atMs: plan.startMs, value: plan.x0[i] };
  const cands: Candidate[] = [];
  walk(plan, grid(plan), (st) => {
    if (st.xb[i] < best.value) best = { atMs: st.tb, value: st.xb[i] };
    if (st.xa[i] < best.value) best = { atMs: st.ta, value: st.xa[i] };
    const dA = derivative(st.seg, st.xa, st.ta, i);
    const dB = derivative(st.seg, st.xb, st.tb, i);
    if (dA < 0 && dB > 0) cands.push(candidateOf(st, i, dA, dB));
  });
  cands.sort((a, b) => a.bound - b.bound);
  for (const c of cands) {
    if (c.bound >= best.value) break;
    const e = extremum(c, i);
    if (e.value < best.value) best = e;
  }
  return best;
}

/**
 * First time (epoch ms) state i equals `tempC`, crossing or touching it; the start if it starts
 * there; null if it never does within [start, end].
 */
export function firstCrossingOf(plan: Plan, i: number, tempC: number): number | null {
  if (plan.x0[i] === tempC) return plan.startMs;
  let found: number | null = null;
  walk(plan, grid(plan), (st) => {
    const fa = st.xa[i] - tempC;
    const fb = st.xb[i] - tempC;
    const f = (s: number) => stateAfter(st.seg, st.xa, st.ta, s)[i] - tempC;
    if (fa * fb <= 0) {
      found = st.ta + rootOn(f, 0, st.tb - st.ta, fa, fb);
      return true;
    }
    // Both ends on one side: the curve may still dip to the level and come back inside the step.
    const dA = derivative(st.seg, st.xa, st.ta, i);
    const dB = derivative(st.seg, st.xb, st.tb, i);
    const towards = fa > 0 ? dA < 0 && dB > 0 : dA > 0 && dB < 0;
    if (!towards) return false;
    const sgn = fa > 0 ? 1 : -1;
    const c = candidateOf(
      { ...st, xa: st.xa.map((v) => sgn * v) as Float64Array, xb: st.xb.map((v) => sgn * v) as Float64Array },
      i,
      sgn * dA,
      sgn * dB,
    );
    if (c.bound > sgn * tempC) return false;
    c.xa = new Float64Array(st.xa);
    const e = extremum(c, i);
    if ((e.value - tempC) * sgn > 0) return false;
    found = st.ta + rootOn(f, 0, e.atMs - st.ta, fa, e.value - tempC);
    return true;
  });
  return found;
}
