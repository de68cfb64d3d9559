// Fitting a logged cool-down: the one-node time constant and heat loss, and two nodes where the data
// allow, with the statistics to judge them.
import { simulate } from '@/lib/thermal';
import { fitCurve, type LeastSquaresResult } from './leastSquares';
import { oneNodeCurve, oneNodeGuess } from './oneNode';
import type { LogSeries } from './types';

/** Fitting works on at most this many points (bin means of longer windows). */
export const MAX_FIT_POINTS = 1500;
const MAX_TWO_NODE_POINTS = 500;
const CHART_POINTS = 400;

export interface FitWindow {
  startMs: number;
  endMs: number;
}

export interface FitOptions {
  /** Heat capacity of the one node (oil and engine together), J/K: from the profile unless the person gives one. */
  heatCapacityJPerK: number;
  /** For the two-node fit: the oil node's and the engine node's heat capacities, J/K. */
  oilHeatCapacityJPerK?: number;
  engineHeatCapacityJPerK?: number;
  /** Try the two-node fit (default true). */
  twoNode?: boolean;
}

export interface Estimate {
  value: number;
  sigma: number;
}

export interface OneNodeFit {
  tauH: Estimate;
  lossWPerK: Estimate;
  /** With a logged ambient: the offset of the surroundings from it, K; without: the surroundings, °C. */
  level: Estimate;
  startC: Estimate;
  rmseK: number;
  r2: number;
  n: number;
  iterations: number;
  converged: boolean;
  aic: number;
}

export interface TwoNodeFit {
  supported: boolean;
  /** Why the data do or do not support a second node. */
  reason: string;
  oilLossWPerK?: Estimate;
  engineLossWPerK?: Estimate;
  couplingWPerK?: Estimate;
  level?: Estimate;
  startC?: Estimate;
  tauFastH?: number;
  tauSlowH?: number;
  oilHeatCapacityJPerK?: number;
  engineHeatCapacityJPerK?: number;
  rmseK?: number;
  r2?: number;
  aic?: number;
}

export interface FitReport {
  window: FitWindow & { rows: number; points: number };
  surroundings: 'logged' | 'constant';
  heatCapacityJPerK: number;
  oneNode: OneNodeFit;
  twoNode: TwoNodeFit | null;
  recommended: 'one-node' | 'two-node';
  /** For the chart: data and fitted curves at up to 400 of the fitted points. */
  chart: { tMs: number[]; oilC: number[]; ambientC: number[] | null; oneNodeC: number[]; twoNodeC: number[] | null };
}

export class FitRefused extends Error {}

export interface FitData {
  t0Ms: number;
  tS: Float64Array;
  y: Float64Array;
  ambient: Float64Array | null;
  rows: number;
}

/** Linear interpolation over NaN gaps (ends held flat); null if no value at all. */
export function fillGaps(v: Float64Array): Float64Array | null {
  const n = v.length;
  const out = Float64Array.from(v);
  let prev = -1;
  for (let i = 0; i < n; i++) {
    if (Number.isNaN(v[i])) continue;
    if (prev < 0) for (let j = 0; j < i; j++) out[j] = v[i];
    else for (let j = prev + 1; j < i; j++) out[j] = v[prev] + ((v[i] - v[prev]) * (j - prev)) / (i - prev);
    prev = i;
  }
  if (prev < 0) return null;
  for (let j = prev + 1; j < n; j++) out[j] = v[prev];
  return out;
}

/** The window's rows, as bin means when there are more than `max` (means keep the curve and lower the noise). */
export function windowData(s: LogSeries, w: FitWindow, max = MAX_FIT_POINTS): FitData {
  let i0 = 0;
  while (i0 < s.t.length && s.t[i0] < w.startMs) i0++;
  let i1 = s.t.length - 1;
  while (i1 >= 0 && s.t[i1] > w.endMs) i1--;
  const rows = i1 - i0 + 1;
  if (rows < 8) throw new FitRefused(`The window holds ${Math.max(rows, 0)} rows; a fit needs at least 8.`);
  const amb = s.ambient ? fillGaps(s.ambient.subarray(i0, i1 + 1)) : null;
  const bins = Math.min(rows, max);
  const tS = new Float64Array(bins);
  const y = new Float64Array(bins);
  const a = amb ? new Float64Array(bins) : null;
  const t0Ms = s.t[i0];
  for (let b = 0; b < bins; b++) {
    const from = i0 + Math.floor((b * rows) / bins);
    const to = i0 + Math.floor(((b + 1) * rows) / bins);
    let st = 0;
    let sy = 0;
    let sa = 0;
    for (let i = from; i < to; i++) {
      st += s.t[i] - t0Ms;
      sy += s.oil[i];
      if (amb) sa += amb[i - i0];
    }
    const c = to - from;
    tS[b] = st / c / 1000;
    y[b] = sy / c;
    if (a) a[b] = sa / c;
  }
  return { t0Ms, tS, y, ambient: a, rows };
}

const est = (value: number, sigma: number): Estimate => ({ value, sigma });

/** τ bounds in hours (default 0.02–500 h: engines; a textbook thermocouple needs seconds). */
export function fitOneNode(d: FitData, C: number, bounds: { tauMinH?: number; tauMaxH?: number } = {}): { fit: OneNodeFit; ls: LeastSquaresResult } {
  const g = oneNodeGuess(d.tS, d.y, d.ambient);
  const H = 3600;
  const model = (p: readonly number[]) => oneNodeCurve(d.tS, d.ambient, p[0] * H, p[1], p[2]);
  const lo = d.ambient ? -40 : -80;
  const hi = d.ambient ? 40 : 150;
  const ls = fitCurve(model, d.y, [g.tauS / H, g.level, g.startC], { min: [bounds.tauMinH ?? 0.02, lo, -80], max: [bounds.tauMaxH ?? 500, hi, 250] });
  const tauH = ls.p[0];
  const G = C / (tauH * H);
  const sG = (C / (tauH * tauH * H)) * ls.sigma[0];
  return {
    ls,
    fit: {
      tauH: est(tauH, ls.sigma[0]),
      lossWPerK: est(G, sG),
      level: est(ls.p[1], ls.sigma[1]),
      startC: est(ls.p[2], ls.sigma[2]),
      rmseK: ls.rmse,
      r2: ls.r2,
      n: ls.n,
      iterations: ls.iterations,
      converged: ls.converged,
      aic: ls.aic,
    },
  };
}

/** Every `k`-th point so that at most `max` remain (first and last kept). */
function thin(n: number, max: number): number[] {
  if (n <= max) return Array.from({ length: n }, (_, i) => i);
  const idx: number[] = [];
  for (let j = 0; j < max; j++) idx.push(Math.round((j * (n - 1)) / (max - 1)));
  return idx;
}

/** The two-node oil curve through the soak model (lib/thermal), engine mass starting at the oil's temperature. */
function twoNodeCurve(d: FitData, Co: number, Ce: number, p: readonly number[]): Float64Array {
  const [lnGo, lnGe, lnGoe, startC, level] = p;
  const atMs = Array.from(d.tS, (s) => d.t0Ms + s * 1000);
  const outside = d.ambient ? atMs.map((t, i) => ({ atMs: t, tempC: d.ambient![i] + level })) : [{ atMs: atMs[0], tempC: level }];
  const s = simulate(
    {
      startMs: atMs[0],
      endMs: atMs[atMs.length - 1],
      outside,
      shelter: { kind: 'tie-down' },
      oil: { heatCapacityJPerK: Co, lossWPerK: Math.exp(lnGo), initialTempC: startC },
      engine: { heatCapacityJPerK: Ce, lossWPerK: Math.exp(lnGe), initialTempC: startC },
      couplingWPerK: Math.exp(lnGoe),
    },
    { atMs },
  );
  return s.oilC;
}

/** Time constants (h) of the two-node system: the eigenvalues of its 2×2 matrix. */
export function twoNodeTimeConstants(Co: number, Ce: number, Go: number, Ge: number, Goe: number): { fastH: number; slowH: number } {
  const a = -(Go + Goe) / Co;
  const b = Goe / Co;
  const c = Goe / Ce;
  const dd = -(Ge + Goe) / Ce;
  const tr = a + dd;
  const det = a * dd - b * c;
  const disc = Math.sqrt(Math.max(tr * tr - 4 * det, 0));
  const l1 = (tr - disc) / 2;
  const l2 = (tr + disc) / 2;
  return { fastH: -1 / l1 / 3600, slowH: -1 / l2 / 3600 };
}

export function fitTwoNode(full: FitData, one: OneNodeFit, Co: number, Ce: number): TwoNodeFit {
  const spanH = (full.tS[full.tS.length - 1] - full.tS[0]) / 3600;
  if (full.tS.length < 40) return { supported: false, reason: `Too few points for two nodes (${full.tS.length}; at least 40).` };
  if (spanH < 2 * Math.min(one.tauH.value, 3)) {
    return { supported: false, reason: `The window (${spanH.toFixed(1)} h) is too short to tell two time constants apart; log at least ${(2 * Math.min(one.tauH.value, 3)).toFixed(1)} h.` };
  }
  // Fewer points for the slower two-node model: a subsample.
  const d = full.tS.length > MAX_TWO_NODE_POINTS ? rebin(full, MAX_TWO_NODE_POINTS) : full;
  const G1 = one.lossWPerK.value;
  const model = (p: readonly number[]) => twoNodeCurve(d, Co, Ce, p);
  const lo = full.ambient ? -40 : -80;
  const hi = full.ambient ? 40 : 150;
  let best: LeastSquaresResult | null = null;
  for (const [fo, fe, fc] of [
    [0.3, 0.7, 1],
    [0.15, 0.85, 0.3],
    [0.5, 0.5, 3],
  ]) {
    const p0 = [Math.log(fo * G1), Math.log(fe * G1), Math.log(fc * G1), one.startC.value, one.level.value];
    const ls = fitCurve(model, d.y, p0, { min: [Math.log(1e-3), Math.log(1e-3), Math.log(1e-3), -80, lo], max: [Math.log(1e4), Math.log(1e4), Math.log(1e5), 250, hi], maxIterations: 120 });
    if (!best || ls.sse < best.sse) best = ls;
  }
  const ls = best!;
  // The one-node fit on the same points, for a fair comparison.
  const oneSame = d === full ? null : fitCurve((p) => oneNodeCurve(d.tS, d.ambient, p[0] * 3600, p[1], p[2]), d.y, [one.tauH.value, one.level.value, one.startC.value], { min: [0.02, lo, -80], max: [500, hi, 250] });
  const aic1 = oneSame ? oneSame.aic : one.aic;
  const [Go, Ge, Goe] = ls.p.slice(0, 3).map(Math.exp);
  // Standard errors of G from those of ln G: σ_G ≈ G·σ_lnG.
  const sig = ls.sigma;
  const tc = twoNodeTimeConstants(Co, Ce, Go, Ge, Goe);
  const base: TwoNodeFit = {
    supported: false,
    reason: '',
    oilLossWPerK: est(Go, Go * sig[0]),
    engineLossWPerK: est(Ge, Ge * sig[1]),
    couplingWPerK: est(Goe, Goe * sig[2]),
    startC: est(ls.p[3], sig[3]),
    level: est(ls.p[4], sig[4]),
    tauFastH: tc.fastH,
    tauSlowH: tc.slowH,
    oilHeatCapacityJPerK: Co,
    engineHeatCapacityJPerK: Ce,
    rmseK: ls.rmse,
    r2: ls.r2,
    aic: ls.aic,
  };
  const dAic = aic1 - ls.aic;
  const loose = [sig[0], sig[1], sig[2]].some((s) => !Number.isFinite(s) || s > 0.5);
  if (dAic < 10) {
    base.reason = `Two nodes fit no better than one (AIC lower by ${dAic.toFixed(1)}, needs at least 10): use the one-node fit.`;
  } else if (loose) {
    base.reason = 'Two nodes fit better, but the data do not pin down all three conductances (an uncertainty above 50 %): use the one-node fit or log a longer cool-down.';
  } else if (tc.slowH / tc.fastH < 1.5) {
    base.reason = 'The two time constants are too close to tell apart: use the one-node fit.';
  } else {
    base.supported = true;
    base.reason = `Two nodes fit clearly better (AIC lower by ${dAic.toFixed(0)}) with every conductance within 50 %.`;
  }
  return base;
}

/** A subsample of the points (first and last kept), so the start temperature means the same in both fits. */
function rebin(d: FitData, max: number): FitData {
  const idx = thin(d.tS.length, max);
  return {
    t0Ms: d.t0Ms,
    tS: Float64Array.from(idx, (i) => d.tS[i]),
    y: Float64Array.from(idx, (i) => d.y[i]),
    ambient: d.ambient ? Float64Array.from(idx, (i) => d.ambient![i]) : null,
    rows: d.rows,
  };
}

/** Fits the cool-down in the window of a logged series. */
export function fitCooldown(s: LogSeries, w: FitWindow, o: FitOptions): FitReport {
  const d = windowData(s, w);
  if (d.tS[d.tS.length - 1] - d.tS[0] < 1800) throw new FitRefused('The window is shorter than 30 minutes: choose a longer cool-down.');
  const drop = d.y[0] - Math.min(...d.y);
  if (drop < 2) throw new FitRefused(`The oil falls only ${drop.toFixed(1)} K in the window: a fit needs a cool-down of several kelvin.`);
  const { fit: one, ls } = fitOneNode(d, o.heatCapacityJPerK);
  let two: TwoNodeFit | null = null;
  let twoCurve: Float64Array | null = null;
  if (o.twoNode !== false && o.oilHeatCapacityJPerK && o.engineHeatCapacityJPerK) {
    two = fitTwoNode(d, one, o.oilHeatCapacityJPerK, o.engineHeatCapacityJPerK);
    if (two.oilLossWPerK) {
      twoCurve = twoNodeCurve(d, o.oilHeatCapacityJPerK, o.engineHeatCapacityJPerK, [
        Math.log(two.oilLossWPerK.value),
        Math.log(two.engineLossWPerK!.value),
        Math.log(two.couplingWPerK!.value),
        two.startC!.value,
        two.level!.value,
      ]);
    }
  } else if (o.twoNode !== false) {
    two = { supported: false, reason: 'The profile has one node: give the oil and engine heat capacities to try two.' };
  }
  const idx = thin(d.tS.length, CHART_POINTS);
  const r3 = (v: number) => Math.round(v * 1000) / 1000;
  return {
    window: { startMs: w.startMs, endMs: w.endMs, rows: d.rows, points: d.tS.length },
    surroundings: d.ambient ? 'logged' : 'constant',
    heatCapacityJPerK: o.heatCapacityJPerK,
    oneNode: one,
    twoNode: two,
    recommended: two?.supported ? 'two-node' : 'one-node',
    chart: {
      tMs: idx.map((i) => Math.round(d.t0Ms + d.tS[i] * 1000)),
      oilC: idx.map((i) => r3(d.y[i])),
      ambientC: d.ambient ? idx.map((i) => r3(d.ambient![i])) : null,
      oneNodeC: idx.map((i) => r3(ls.fitted[i])),
      twoNodeC: twoCurve ? idx.map((i) => r3(twoCurve![i])) : null,
    },
  };
}
