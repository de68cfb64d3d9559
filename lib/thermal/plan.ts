// Compiles a SoakModel into segments: intervals between the inputs' own breakpoints (outside points,
// heater edges, wind and cloud changes, sun hours, thermostat events) over which the dynamics matrix
// and the constant inputs are fixed and the outside air is linear. Output times never create
// segments, so the answer does not depend on them.
import { makeSystem, type LinearSystem } from './discretise';
import { shelterPieces, type ShelterInterval, type ShelterPiece } from './shelter';
import { solarPieces } from './solar';
import type { NodeName, SoakModel } from './types';

import { DEFAULT_COVER_FACTOR, DEFAULT_WIND_COEFFICIENT } from './constants';

export interface Segment {
  t0: number;
  t1: number;
  sys: LinearSystem;
  /** Coefficient of the outside temperature in each state's derivative, 1/s. */
  g: Float64Array;
  /** Constant part of each state's derivative (heaters, sun, space heating), K/s. */
  c: number[];
  /** Outside temperature at t0 (°C) and its slope (K/s). */
  tout0: number;
  slope: number;
  /** Shelter pinned at this temperature (a heated hangar holding its set-point), NaN if floating. */
  pin: number;
  /** Loss conductance of each engine node to the shelter in this segment, W/K (for energy balances). */
  lossOil: number;
  lossEngine: number;
}

export interface Plan {
  n: number;
  /** State indices: shelter (−1 on a tie-down), oil, engine (−1 for one node). */
  iS: number;
  iO: number;
  iE: number;
  /** Heat capacity of each state, J/K. */
  caps: Float64Array;
  x0: Float64Array;
  startMs: number;
  endMs: number;
  segs: Segment[];
  heaterEnergyWh: number;
  shelterHeatingWh: number;
}

/** Index of the last point at or before t (t within the points' span). */
function bracket(pts: SoakModel['outside'], t: number): number {
  let lo = 0;
  let hi = pts.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (pts[mid].atMs <= t) lo = mid;
    else hi = mid;
  }
  return lo;
}

/** Outside temperature at t: linear between points, flat beyond the ends. */
export function outsideAt(pts: SoakModel['outside'], t: number): number {
  const n = pts.length;
  if (t <= pts[0].atMs) return pts[0].tempC;
  if (t >= pts[n - 1].atMs) return pts[n - 1].tempC;
  const a = pts[bracket(pts, t)];
  const b = pts[bracket(pts, t) + 1];
  return a.tempC + ((b.tempC - a.tempC) * (t - a.atMs)) / (b.atMs - a.atMs);
}

/** Slope of the outside temperature just after t, K/s. */
function outsideSlopeAfter(pts: SoakModel['outside'], t: number): number {
  if (t < pts[0].atMs || t >= pts[pts.length - 1].atMs) return 0;
  const a = pts[bracket(pts, t)];
  const b = pts[bracket(pts, t) + 1];
  return ((b.tempC - a.tempC) / (b.atMs - a.atMs)) * 1000;
}

/** Value of a piecewise-constant series at t: each point holds from its time to the next; the first holds before. */
export function stepAt<T extends { atMs: number }>(pts: readonly T[] | undefined, t: number, get: (p: T) => number, dflt: number): number {
  if (!pts || pts.length === 0) return dflt;
  let v = get(pts[0]);
  for (const p of pts) {
    if (p.atMs <= t) v = get(p);
    else break;
  }
  return v;
}

/** lo, the distinct values of the (each increasing) lists strictly between lo and hi, merged, then hi. */
function mergeBounds(lo: number, hi: number, ...lists: readonly (readonly number[])[]): number[] {
  const out = [lo];
  const pos = lists.map(() => 0);
  for (;;) {
    let best = Infinity;
    let bi = -1;
    for (let l = 0; l < lists.length; l++) {
      const list = lists[l];
      while (pos[l] < list.length && list[pos[l]] <= lo) pos[l]++;
      if (pos[l] < list.length && list[pos[l]] < best) {
        best = list[pos[l]];
        bi = l;
      }
    }
    if (bi < 0 || best >= hi) break;
    pos[bi]++;
    if (best !== out[out.length - 1]) out.push(best);
  }
  out.push(hi);
  return out;
}

export function compile(model: SoakModel): Plan {
  const { startMs, endMs } = model;
  if (!(endMs > startMs)) throw new Error('end must be after start');
  const sh = model.shelter;
  const hangar = sh.kind === 'hangar';
  const two = model.engine !== undefined;
  const iS = hangar ? 0 : -1;
  const iO = hangar ? 1 : 0;
  const iE = two ? iO + 1 : -1;
  const n = iO + (two ? 2 : 1);
  const coverF = model.cover ? (model.coverFactor ?? DEFAULT_COVER_FACTOR) : 1;
  const windK = model.windCoefficient ?? DEFAULT_WIND_COEFFICIENT;
  const Goe = two ? (model.couplingWPerK ?? 0) : 0;
  const Co = model.oil.heatCapacityJPerK;
  const Ce = two ? model.engine!.heatCapacityJPerK : 1;
  const outTimes: number[] = [];
  for (const p of model.outside) if (p.atMs > startMs && p.atMs < endMs) outTimes.push(p.atMs);

  // 1. The shelter, solved on its own.
  let pieces: ShelterPiece[] = [];
  let shelterHeatingWh = 0;
  const caps = new Float64Array(n);
  const x0 = new Float64Array(n);
  if (hangar) {
    const sun =
      model.site && (sh.solarApertureM2 ?? 0) > 0
        ? solarPieces(startMs, endMs, model.site, sh.solarApertureM2!, model.cloud ?? [])
        : [];
    const bounds = mergeBounds(startMs, endMs, outTimes, sun.map((p) => p.toMs));
    const intervals: ShelterInterval[] = [];
    let si = 0;
    for (let k = 0; k + 1 < bounds.length; k++) {
      const t0 = bounds[k];
      while (si < sun.length && sun[si].toMs <= t0) si++;
      const sunW = si < sun.length && sun[si].fromMs <= t0 ? sun[si].gainW : 0;
      intervals.push({ t0, t1: bounds[k + 1], tout0: outsideAt(model.outside, t0), slope: outsideSlopeAfter(model.outside, t0), sunW });
    }
    const heated = sh.setpointC !== undefined && sh.heatingPowerW !== undefined;
    const T0s = sh.initialTempC ?? (heated ? sh.setpointC! : outsideAt(model.outside, startMs));
    const res = shelterPieces(
      { heatCapacityJPerK: sh.heatCapacityJPerK, lossWPerK: sh.lossWPerK, initialTempC: T0s, setpointC: heated ? sh.setpointC : undefined, heatingPowerW: heated ? sh.heatingPowerW : undefined },
      intervals,
    );
    pieces = res.pieces;
    shelterHeatingWh = res.heatingWh;
    caps[iS] = sh.heatCapacityJPerK;
    x0[iS] = T0s;
  }
  caps[iO] = Co;
  x0[iO] = model.oil.initialTempC;
  if (two) {
    caps[iE] = Ce;
    x0[iE] = model.engine!.initialTempC;
  }

  // 2. All breakpoints.
  const heaters = model.heaters ?? [];
  // A hangar's pieces already end at every outside point and sun piece.
  const edges: number[] = [];
  for (const h of heaters) edges.push(h.fromMs, h.toMs);
  edges.sort((a, b) => a - b);
  const bounds = hangar
    ? mergeBounds(startMs, endMs, pieces.map((p) => p.t0), edges)
    : mergeBounds(startMs, endMs, outTimes, edges, (model.wind ?? []).map((w) => w.atMs));

  // 3. Segments. The dynamics matrix depends only on the shelter mode and the wind: build each once.
  const systems = new Map<number, { sys: LinearSystem; g: Float64Array; Go: number; Ge: number }>();
  const systemFor = (held: boolean, v: number) => {
    const key = held ? -1 : v;
    let s = systems.get(key);
    if (s) return s;
    const lossScale = coverF * (hangar ? 1 : 1 + windK * Math.sqrt(v));
    const Go = model.oil.lossWPerK * lossScale;
    const Ge = two ? model.engine!.lossWPerK * lossScale : 0;
    const A = new Float64Array(n * n);
    const g = new Float64Array(n);
    if (hangar) {
      if (!held) {
        A[iS * n + iS] = -sh.lossWPerK / sh.heatCapacityJPerK;
        g[iS] = sh.lossWPerK / sh.heatCapacityJPerK;
      }
      A[iO * n + iS] = Go / Co;
      if (two) A[iE * n + iS] = Ge / Ce;
    } else {
      g[iO] = Go / Co;
      if (two) g[iE] = Ge / Ce;
    }
    A[iO * n + iO] = -(Go + Goe) / Co;
    if (two) {
      A[iO * n + iE] = Goe / Co;
      A[iE * n + iO] = Goe / Ce;
      A[iE * n + iE] = -(Ge + Goe) / Ce;
    }
    s = { sys: makeSystem(n, A), g, Go, Ge };
    systems.set(key, s);
    return s;
  };
  const wind = hangar ? [] : (model.wind ?? []);
  const segs: Segment[] = [];
  let pi = 0;
  let wi = 0;
  let oi = 0;
  const outside = model.outside;
  for (let k = 0; k + 1 < bounds.length; k++) {
    const t0 = bounds[k];
    const t1 = bounds[k + 1];
    let piece: ShelterPiece | null = null;
    if (hangar) {
      while (pi + 1 < pieces.length && pieces[pi].t1 <= t0) pi++;
      piece = pieces[pi];
    }
    while (wi + 1 < wind.length && wind[wi + 1].atMs <= t0) wi++;
    const v = wind.length ? Math.max(0, wind[wi].mps) : 0;
    const held = piece?.mode === 'held';
    const s = systemFor(held, v);
    const c = n === 3 ? [0, 0, 0] : n === 2 ? [0, 0] : [0];
    if (hangar && !held) c[iS] = (piece!.heatW + piece!.sunW) / sh.heatCapacityJPerK;
    let pOil = 0;
    let pEng = 0;
    for (const h of heaters) {
      if (h.fromMs <= t0 && h.toMs >= t1) {
        if (h.node === 'oil') pOil += h.powerW;
        else pEng += h.powerW;
      }
    }
    c[iO] = pOil / Co;
    if (two) c[iE] = pEng / Ce;
    // Outside: linear between points, flat beyond the ends; segments never straddle a point.
    while (oi + 1 < outside.length && outside[oi + 1].atMs <= t0) oi++;
    let tout0: number;
    let slope = 0;
    if (t0 < outside[0].atMs) tout0 = outside[0].tempC;
    else if (oi + 1 >= outside.length) tout0 = outside[outside.length - 1].tempC;
    else {
      const a = outside[oi];
      const b = outside[oi + 1];
      slope = (b.tempC - a.tempC) / (b.atMs - a.atMs);
      tout0 = a.tempC + slope * (t0 - a.atMs);
      slope *= 1000;
    }
    segs.push({
      t0,
      t1,
      sys: s.sys,
      g: s.g,
      c,
      tout0,
      slope,
      pin: held ? (sh as { setpointC: number }).setpointC : NaN,
      lossOil: s.Go,
      lossEngine: s.Ge,
    });
  }

  let heaterJ = 0;
  for (const h of heaters) {
    const on = Math.min(h.toMs, endMs) - Math.max(h.fromMs, startMs);
    if (on > 0) heaterJ += (h.powerW * on) / 1000;
  }
  return { n, iS, iO, iE, caps, x0, startMs, endMs, segs, heaterEnergyWh: heaterJ / 3600, shelterHeatingWh };
}

/** Index of the state of a node in a plan, or −1. */
export function nodeIndex(plan: Plan, node: NodeName | 'shelter'): number {
  return node === 'oil' ? plan.iO : node === 'engine' ? plan.iE : plan.iS;
}
