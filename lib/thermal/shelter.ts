// The shelter air node alone. It does not feel the engines (one aircraft barely warms a hangar, and
// one shelter serves many aircraft), so it can be solved first, in closed form, interval by
// interval — which is how a heated hangar's thermostat is modelled exactly:
//
//   held: Ts = set-point, the heating supplies P_need(t) = Gs·(Tset − Tout(t)) − Q_sun, linear in t;
//         it stays held while 0 ≤ P_need ≤ P_max; the instant P_need leaves that range is exact.
//   max:  heating flat out, Ts < Tset floats; back to held when Ts rises to Tset (root of the exact solution).
//   off:  no heating, Ts > Tset floats (sun, a warm start); held again when Ts falls to Tset.
//
// An unheated hangar is always "off" with no set-point.

export type ShelterMode = 'held' | 'max' | 'off';

/** One input interval of the shelter: outside linear (°C at t0, K/s), sun constant. */
export interface ShelterInterval {
  t0: number;
  t1: number;
  tout0: number;
  slope: number;
  sunW: number;
}

/** A piece of the shelter's history with one mode. `heatW` is the space heating during a floating piece. */
export interface ShelterPiece {
  t0: number;
  t1: number;
  mode: ShelterMode;
  heatW: number;
  sunW: number;
}

export interface ShelterParams {
  heatCapacityJPerK: number;
  lossWPerK: number;
  initialTempC: number;
  /** Both present for a heated hangar. */
  setpointC?: number;
  heatingPowerW?: number;
}

/** Exact shelter temperature after s seconds floating with constant heat q (W) and outside a + b·s. */
export function floatingShelterC(T0: number, a: number, b: number, qW: number, C: number, G: number, s: number): number {
  const tau = C / G;
  const inf0 = a + qW / G;
  return inf0 + b * s - b * tau + (T0 - inf0 + b * tau) * Math.exp(-s / tau);
}

/** First s in (0, h] where F(s) = sign·(Ts(s) − Tset) reaches 0 from above; null if none. */
function firstReturn(
  T0: number,
  a: number,
  b: number,
  qW: number,
  C: number,
  G: number,
  Tset: number,
  sign: number,
  h: number,
): number | null {
  const tau = C / G;
  const K = T0 - (a + qW / G) + b * tau;
  const F = (s: number) => sign * (floatingShelterC(T0, a, b, qW, C, G, s) - Tset);
  // f(s) = α + b·s + K·e^{−s/τ} has at most one extremum, where e^{−s/τ} = bτ/K.
  const cuts = [0];
  const r = (b * tau) / K;
  if (K !== 0 && r > 0 && r < 1) {
    const se = -tau * Math.log(r);
    if (se > 0 && se < h) cuts.push(se);
  }
  cuts.push(h);
  for (let k = 0; k + 1 < cuts.length; k++) {
    let lo = cuts[k];
    let hi = cuts[k + 1];
    const Flo = F(lo);
    const Fhi = F(hi);
    if (!(Fhi <= 0) || !(Flo > 0)) continue;
    for (let it = 0; it < 200 && hi - lo > 1e-7; it++) {
      const mid = 0.5 * (lo + hi);
      if (F(mid) > 0) lo = mid;
      else hi = mid;
    }
    return hi;
  }
  return null;
}

/**
 * Splits the shelter's input intervals into pieces of constant mode. Returns the pieces and the
 * space-heating energy (Wh). `intervals` must be contiguous and increasing.
 */
export function shelterPieces(p: ShelterParams, intervals: readonly ShelterInterval[]): { pieces: ShelterPiece[]; heatingWh: number } {
  const C = p.heatCapacityJPerK;
  const G = p.lossWPerK;
  const heated = p.setpointC !== undefined && p.heatingPowerW !== undefined;
  const Tset = heated ? (p.setpointC as number) : 0;
  const Pmax = heated ? (p.heatingPowerW as number) : 0;
  const tol = 1e-9 * (Pmax + G * 100 + 1);
  const pieces: ShelterPiece[] = [];
  let heatingJ = 0;

  const decide = (Pn: number, dPn: number): ShelterMode => {
    if (Pn < -tol) return 'off';
    if (Pn > Pmax + tol) return 'max';
    if (Pn <= tol && dPn < 0) return 'off';
    if (Pn >= Pmax - tol && dPn > 0) return 'max';
    return 'held';
  };

  let Ts = p.initialTempC;
  let mode: ShelterMode = 'off';
  let fresh = true;
  for (const iv of intervals) {
    let t = iv.t0;
    let guard = 0;
    while (t < iv.t1) {
      if (guard++ > 64) throw new Error('shelter thermostat: too many mode changes in one interval');
      const s0 = (t - iv.t0) / 1000;
      const a = iv.tout0 + iv.slope * s0;
      const b = iv.slope;
      const h = (iv.t1 - t) / 1000;
      const Pn = G * (Tset - a) - iv.sunW;
      const dPn = -G * b;
      if (heated && (fresh || mode === 'held' || Ts === Tset)) {
        mode = Ts > Tset ? 'off' : Ts < Tset ? 'max' : decide(Pn, dPn);
        if (mode === 'held') Ts = Tset;
      }
      fresh = false;
      if (mode === 'held') {
        let sEnd = h;
        let next: ShelterMode | null = null;
        if (b > 0) {
          const sz = Pn / (G * b); // P_need falls to 0
          if (sz < h) [sEnd, next] = [Math.max(0, sz), 'off'];
        } else if (b < 0) {
          const sm = (Pn - Pmax) / (G * b); // P_need rises to P_max
          if (sm < h) [sEnd, next] = [Math.max(0, sm), 'max'];
        }
        const Pend = Pn + dPn * sEnd;
        heatingJ += 0.5 * (Pn + Pend) * sEnd;
        const tEnd = next ? t + sEnd * 1000 : iv.t1;
        if (tEnd > t) pieces.push({ t0: t, t1: tEnd, mode: 'held', heatW: 0, sunW: iv.sunW });
        t = tEnd;
        Ts = Tset;
        if (next) mode = next;
        continue;
      }
      const q = (mode === 'max' ? Pmax : 0) + iv.sunW;
      const sign = mode === 'max' ? -1 : 1;
      const sr = heated ? firstReturn(Ts, a, b, q, C, G, Tset, sign, h) : null;
      const sEnd = sr ?? h;
      const tEnd = sr === null ? iv.t1 : t + sEnd * 1000;
      if (mode === 'max') heatingJ += Pmax * sEnd;
      pieces.push({ t0: t, t1: tEnd, mode, heatW: mode === 'max' ? Pmax : 0, sunW: iv.sunW });
      if (sr === null) {
        Ts = floatingShelterC(Ts, a, b, q, C, G, h);
      } else {
        Ts = Tset;
        mode = decide(G * (Tset - (a + b * sEnd)) - iv.sunW, dPn);
      }
      t = tEnd;
    }
  }
  return { pieces, heatingWh: heatingJ / 3600 };
}
