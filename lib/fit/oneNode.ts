// The one-node cool-down: C·dT/dt = −G·(T − T∞(t)), τ = C/G, with the surroundings T∞ either the logged
// ambient plus a constant offset (sensor bias, radiant exchange) or one constant temperature.
//
// Over an interval where the surroundings are linear, T∞ = Ta + b·t, the exact solution is
//   T(t) = T∞(t) − b·τ + (T0 − Ta + b·τ)·e^(−t/τ)
// (Incropera §5.1–5.2 lumped capacitance, integrated for linear surroundings; docs/sources.md). The logged
// ambient is linear between its samples, so the curve is exact sample to sample.

/** Oil temperature at each time (s from the start) for the one-node model. `ambient` null: constant `level`. */
export function oneNodeCurve(tS: ArrayLike<number>, ambient: ArrayLike<number> | null, tauS: number, level: number, startC: number): Float64Array {
  const n = tS.length;
  const out = new Float64Array(n);
  if (n === 0) return out;
  out[0] = startC;
  if (!ambient) {
    for (let i = 1; i < n; i++) out[i] = level + (startC - level) * Math.exp(-(tS[i] - tS[0]) / tauS);
    return out;
  }
  let T = startC;
  for (let i = 1; i < n; i++) {
    const h = tS[i] - tS[i - 1];
    const a0 = ambient[i - 1] + level;
    const a1 = ambient[i] + level;
    const b = (a1 - a0) / h;
    const e = Math.exp(-h / tauS);
    T = a1 - b * tauS + (T - a0 + b * tauS) * e;
    out[i] = T;
  }
  return out;
}

/**
 * Starting guesses: the surroundings from the ambient (offset 0) or, without one, from three points
 * (exponential through equally spaced samples); τ from the time the difference falls to 1/e.
 */
export function oneNodeGuess(tS: ArrayLike<number>, y: ArrayLike<number>, ambient: ArrayLike<number> | null): { tauS: number; level: number; startC: number } {
  const n = y.length;
  const span = tS[n - 1] - tS[0];
  const avg = (i: number) => {
    const k = Math.max(1, Math.floor(n / 40));
    let s = 0;
    let c = 0;
    for (let j = Math.max(0, i - k); j <= Math.min(n - 1, i + k); j++, c++) s += y[j];
    return s / c;
  };
  const startC = y[0];
  let level: number;
  let eq: (i: number) => number;
  if (ambient) {
    level = 0;
    eq = (i) => ambient[i];
  } else {
    const y0 = avg(0);
    const mid = Math.floor((n - 1) / 2);
    const y1 = avg(mid);
    const y2 = avg(2 * mid);
    const den = y0 + y2 - 2 * y1;
    level = Math.abs(den) > 1e-6 ? (y0 * y2 - y1 * y1) / den : y2 - 1;
    if (!Number.isFinite(level) || level > y2) level = y2 - 0.5;
    const lv = level;
    eq = () => lv;
  }
  const d0 = startC - eq(0);
  let tauS = span / 3;
  for (let i = 1; i < n; i++) {
    if (y[i] - eq(i) <= d0 / Math.E) {
      tauS = tS[i] - tS[0];
      break;
    }
  }
  return { tauS: Math.max(tauS, span / 1000), level, startC };
}
