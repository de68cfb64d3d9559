// Dew point, frost point and frost on the airframe of an aircraft on an open tie-down.
//
// Magnus form e = a·exp(b·T/(T + c)) hPa: over water a = 6.1094, b = 17.625, c = 243.04
// (Alduchov & Eskridge 1996, J. Appl. Meteor. 35:601); over ice a = 6.1121, b = 22.587, c = 273.86
// (from memory). Inverse: γ = ln(e/a), T = c·γ/(b − γ). Relative humidity is over water.

interface Magnus {
  a: number;
  b: number;
  c: number;
}
export const MAGNUS_WATER: Magnus = { a: 6.1094, b: 17.625, c: 243.04 };
export const MAGNUS_ICE: Magnus = { a: 6.1121, b: 22.587, c: 273.86 };

/** Saturation vapour pressure, hPa, over water (default) or ice. */
export function saturationVapourPressureHPa(tempC: number, over: 'water' | 'ice' = 'water'): number {
  const m = over === 'ice' ? MAGNUS_ICE : MAGNUS_WATER;
  return m.a * Math.exp((m.b * tempC) / (tempC + m.c));
}

function invert(m: Magnus, eHPa: number): number {
  const g = Math.log(eHPa / m.a);
  return (m.c * g) / (m.b - g);
}

/** Vapour pressure of air at `tempC` and relative humidity `rhPercent` (over water), hPa. */
export function vapourPressureHPa(tempC: number, rhPercent: number): number {
  return (rhPercent / 100) * saturationVapourPressureHPa(tempC, 'water');
}

export function dewPointC(tempC: number, rhPercent: number): number {
  return invert(MAGNUS_WATER, vapourPressureHPa(tempC, rhPercent));
}

export function frostPointC(tempC: number, rhPercent: number): number {
  return invert(MAGNUS_ICE, vapourPressureHPa(tempC, rhPercent));
}

/** Frost point of air whose dew point is `dewC` (same vapour pressure). */
export function frostPointFromDewPointC(dewC: number): number {
  return invert(MAGNUS_ICE, saturationVapourPressureHPa(dewC, 'water'));
}

export function relativeHumidityPercent(tempC: number, dewC: number): number {
  return (100 * saturationVapourPressureHPa(dewC, 'water')) / saturationVapourPressureHPa(tempC, 'water');
}

/**
 * Clear, calm night: a wing radiating to the sky sits below the air temperature (estimate: 3 K,
 * a plain figure for thin metal or composite skins under a clear sky).
 */
export const CLEAR_NIGHT_SKIN_DEFICIT_K = 3;

/**
 * Airframe skin temperature on a tie-down (estimate): air − 3 K·(1 − cloud)/(1 + v/2) at night —
 * cloud blocks the radiation to the sky, wind mixes warmer air to the skin; equal to the air
 * temperature while the sun is up (sun elevation > 0°).
 */
export function airframeSurfaceC(o: { airC: number; cloudFraction?: number; windMps?: number; sunElevationDeg?: number }): number {
  if (o.sunElevationDeg !== undefined && o.sunElevationDeg > 0) return o.airC;
  const n = Math.min(1, Math.max(0, o.cloudFraction ?? 0));
  const v = Math.max(0, o.windMps ?? 0);
  return o.airC - (CLEAR_NIGHT_SKIN_DEFICIT_K * (1 - n)) / (1 + v / 2);
}

export interface FrostHour {
  atMs: number;
  airC: number;
  dewPointC: number;
  cloudFraction?: number;
  windMps?: number;
  /** Without it the night-time deficit is applied (a conservative flag). */
  sunElevationDeg?: number;
}

export interface FrostFlag {
  atMs: number;
  airC: number;
  surfaceC: number;
  frostPointC: number;
  /** Frost can form: skin at or below the frost point and below 0 °C. */
  frost: boolean;
}

/** Evaluates each forecast hour; `frost` marks the hours when frost can form on the airframe. */
export function frostFlags(hours: readonly FrostHour[]): FrostFlag[] {
  return hours.map((h) => {
    const surfaceC = airframeSurfaceC(h);
    const fp = frostPointFromDewPointC(Math.min(h.dewPointC, h.airC));
    return { atMs: h.atMs, airC: h.airC, surfaceC, frostPointC: fp, frost: surfaceC <= fp && surfaceC < 0 };
  });
}
