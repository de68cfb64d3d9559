// The weather model behind the local fake forecast service. Pure and deterministic: the weather at a
// place and instant depends only on latitude, longitude, elevation and that instant. No clock, no
// Math.random. It is a plausible invented climate for the demo and for tests, not a forecast:
//   - a seasonal normal by latitude and day of year (coldest near 20 January in the northern
//     hemisphere, mirrored half a year in the southern), tuned so an inland site at 50-60° N has
//     December nights around −5 to −15 °C;
//   - a daily cycle with its minimum at sunrise and its maximum mid-afternoon, larger under clear,
//     calm skies and on long days;
//   - passing weather systems: a few travelling waves with periods of 3-10 days (so nearby airfields
//     see much the same weather, moving west to east) plus day-to-day noise from a hash of the
//     rounded location and the day;
//   - cloud that follows the systems (mild winter spells are grey, cold ones clear), wind that is
//     calmer at night and under clear skies, a dew point always below the temperature.

const HOUR_MS = 3_600_000;
const DAY_MS = 86_400_000;
const YEAR_DAYS = 365.2422;
const DEG = Math.PI / 180;
/** Standard-atmosphere lapse rate, K per metre. */
const LAPSE_K_PER_M = 0.0065;

export interface FakeWeather {
  tempC: number;
  dewPointC: number;
  windMps: number;
  /** 0..1 */
  cloudFraction: number;
}

// ---------------------------------------------------------------------------------------------
// Deterministic hashing

/** 32-bit integer hash of a list of integers (FNV-1a style mixing plus an avalanche finish). */
export function hash32(...ints: number[]): number {
  let h = 0x811c9dc5;
  for (const n of ints) {
    h ^= n | 0;
    h = Math.imul(h, 0x01000193);
    h ^= h >>> 13;
    h = Math.imul(h, 0x5bd1e995);
  }
  h ^= h >>> 15;
  h = Math.imul(h, 0x2c1b3c6d);
  h ^= h >>> 12;
  return h >>> 0;
}

/** Hash to [0, 1). */
function hash01(...ints: number[]): number {
  return hash32(...ints) / 4294967296;
}

/** 0 below 0, 1 above 1, a smooth S between. */
export function smoothstep(x: number): number {
  const c = Math.min(1, Math.max(0, x));
  return c * c * (3 - 2 * c);
}

/** Smooth day-to-day noise in [-1, 1] for a location cell, keyed by the day number. */
function dayNoise(cellLat: number, cellLon: number, days: number, salt: number): number {
  const d0 = Math.floor(days);
  const a = 2 * hash01(cellLat, cellLon, d0, salt) - 1;
  const b = 2 * hash01(cellLat, cellLon, d0 + 1, salt) - 1;
  return a + (b - a) * smoothstep(days - d0);
}

// ---------------------------------------------------------------------------------------------
// Season and sun

/** Day of year (fractional, 0 = 1 January 00:00 UTC). */
function dayOfYear(ms: number): number {
  const y = new Date(ms).getUTCFullYear();
  return (ms - Date.UTC(y, 0, 1)) / DAY_MS;
}

/** 1 in the depth of the hemisphere's winter, 0 in its summer. */
function winterness(latitude: number, doy: number): number {
  const coldestDoy = latitude >= 0 ? 19 : 19 + YEAR_DAYS / 2;
  return (1 + Math.cos((2 * Math.PI * (doy - coldestDoy)) / YEAR_DAYS)) / 2;
}

/** Sea-level daily-mean normal temperature for a latitude and day of year, °C. */
export function seasonalNormalC(latitude: number, doy: number): number {
  const a = Math.abs(latitude);
  const annualMean = 28 - 0.5 * Math.max(0, a - 10);
  const halfRange = Math.min(18, 1 + 0.25 * Math.max(0, a - 10));
  return annualMean + halfRange * (1 - 2 * winterness(latitude, doy));
}

/** Solar declination (simple cosine form), radians. */
function declination(doy: number): number {
  return -23.44 * DEG * Math.cos((2 * Math.PI * (doy + 10)) / 365);
}

/** Day length in hours (0 in polar night, 24 in midnight sun). */
export function dayLengthHours(latitude: number, doy: number): number {
  const c = -Math.tan(latitude * DEG) * Math.tan(declination(doy));
  if (c >= 1) return 0;
  if (c <= -1) return 24;
  return (2 * Math.acos(c)) / DEG / 15;
}

interface DailyShape {
  /** Daily-cycle shape 0..1: 0 at sunrise, 1 at the afternoon maximum. */
  f: number;
  /** The shape's mean over the day, so the cycle leaves the daily mean where it is. */
  mean: number;
  dayLength: number;
}

/** Falling branch from the afternoon maximum to the next sunrise: fast at dusk, slow before dawn. */
function fall(x: number): number {
  return (1 - x) * Math.exp(-2 * x);
}
/** ∫₀¹ fall(x) dx = (1 − e⁻²)/2 − (1 − 3e⁻²)/4 */
const FALL_MEAN = (1 - Math.exp(-2)) / 2 - (1 - 3 * Math.exp(-2)) / 4;

function dailyShape(latitude: number, longitude: number, ms: number): DailyShape {
  const solarMs = ms + (longitude / 15) * HOUR_MS;
  const solarHour = (((solarMs % DAY_MS) + DAY_MS) % DAY_MS) / HOUR_MS;
  const doy = dayOfYear(ms);
  const dayLength = dayLengthHours(latitude, doy);
  // In polar night and midnight sun the cycle keeps a weak, clamped shape; its size is scaled elsewhere.
  const shapeLength = Math.min(21, Math.max(3, dayLength));
  const sunrise = 12 - shapeLength / 2;
  const peak = Math.min(14.5, sunrise + 0.75 * shapeLength);
  const rise = peak - sunrise;
  const fallSpan = 24 - rise;
  let f: number;
  if (solarHour >= sunrise && solarHour < peak) {
    f = (1 - Math.cos((Math.PI * (solarHour - sunrise)) / rise)) / 2;
  } else {
    const since = solarHour >= peak ? solarHour - peak : solarHour + 24 - peak;
    f = fall(since / fallSpan);
  }
  return { f, mean: (0.5 * rise + FALL_MEAN * fallSpan) / 24, dayLength };
}

// ---------------------------------------------------------------------------------------------
// Weather systems

/** Travelling waves: [amplitude weight, period in days, wavelength east-west km, north-south km, phase]. */
const SYSTEM_WAVES: readonly (readonly [number, number, number, number, number])[] = [
  [2.6, 3.3, 2600, 5200, 0.7],
  [2.1, 4.6, 3400, -6100, 2.9],
  [1.7, 6.1, 4100, 7400, 4.4],
  [1.2, 9.7, 5600, -9000, 1.3],
];
const SYSTEM_SD = Math.sqrt(SYSTEM_WAVES.reduce((s, w) => s + (w[0] * w[0]) / 2, 0) + 1 / 3);

const CLOUD_WAVES: readonly (readonly [number, number, number, number, number])[] = [
  [1.0, 1.7, 1500, 3100, 5.1],
  [0.8, 2.9, 2300, -3900, 0.4],
];
const WIND_WAVES: readonly (readonly [number, number, number, number, number])[] = [
  [1.0, 2.3, 1900, 4300, 3.3],
  [0.8, 3.7, 2800, -5200, 5.9],
];

function waves(
  set: readonly (readonly [number, number, number, number, number])[],
  days: number,
  xKm: number,
  yKm: number,
): number {
  let s = 0;
  for (const [amp, period, lx, ly, phase] of set) {
    s += amp * Math.sin(2 * Math.PI * (days / period - xKm / lx + yKm / ly) + phase);
  }
  return s;
}

function logistic(z: number): number {
  return 1 / (1 + Math.exp(-z));
}

function round1(v: number): number {
  return Math.round(v * 10) / 10;
}

/** A plausible invented site elevation (m) for a location, used when a request names none. */
export function fakeElevationM(latitude: number, longitude: number): number {
  return Math.round(60 + 340 * hash01(Math.round(latitude * 100), Math.round(longitude * 100), 7));
}

/**
 * A scenario's pull on one instant: the temperature moves by exactly deltaK·weight, cloud and wind
 * move towards the given values by the weight (0..1). The daily cycle is left as the model made it,
 * so the shift is the scenario's own number.
 */
export interface WeatherNudge {
  weight: number;
  deltaK: number;
  cloudFraction?: number;
  windMps?: number;
}

/** The fake weather at a place and UTC instant (epoch ms). Unrounded values. */
export function fakeWeatherAt(
  latitude: number,
  longitude: number,
  elevationM: number,
  ms: number,
  nudges: readonly WeatherNudge[] = [],
): FakeWeather {
  const days = ms / DAY_MS;
  const doy = dayOfYear(ms);
  const w = winterness(latitude, doy);
  const absLat = Math.abs(latitude);
  const xKm = longitude * 111.32 * Math.cos(latitude * DEG);
  const yKm = latitude * 110.57;
  const cellLat = Math.round(latitude * 4);
  const cellLon = Math.round(longitude * 4);

  // Passing systems: larger in winter and away from the tropics.
  const latFactor = Math.min(1.3, Math.max(0.3, (absLat - 5) / 45));
  const systemScale = (0.7 + 0.9 * w) * latFactor;
  const systemsRaw = waves(SYSTEM_WAVES, days, xKm, yKm) + dayNoise(cellLat, cellLon, days, 11);
  const anomalyK = systemScale * systemsRaw;
  const anomalyZ = systemsRaw / SYSTEM_SD;

  // Cloud: mid-latitude winters are mostly grey; mild spells bring cloud, cold spells clear skies.
  const cloudZ =
    -0.3 +
    0.9 * w * latFactor +
    (1.3 * w - 0.3) * anomalyZ +
    waves(CLOUD_WAVES, days, xKm, yKm) +
    0.8 * dayNoise(cellLat, cellLon, days * 2, 23);
  const cloudFraction = logistic(1.6 * cloudZ);

  const shape = dailyShape(latitude, longitude, ms);

  // Wind: systems and cloud bring it, clear nights are calm, afternoons mix it down.
  const windBase =
    2.2 + 1.4 * w * latFactor + 1.2 * waves(WIND_WAVES, days, xKm, yKm) + 1.6 * cloudFraction +
    0.8 * dayNoise(cellLat, cellLon, days * 3, 37);
  const windMps = Math.max(0.3, windBase * (0.65 + 0.6 * shape.f));

  // Daily cycle: range grows with clear skies and day length, shrinks with wind.
  const dayFactor = Math.min(1.2, Math.max(0.35, 0.35 + (0.65 * shape.dayLength) / 12));
  const rangeK = ((2.5 + 9 * (1 - cloudFraction)) * dayFactor) / (1 + 0.15 * windMps);
  const dailyMeanC = seasonalNormalC(latitude, doy) - LAPSE_K_PER_M * elevationM + anomalyK;
  let tempC = dailyMeanC + rangeK * (shape.f - shape.mean);

  let cloud = cloudFraction;
  let wind = windMps;
  for (const n of nudges) {
    const k = Math.min(1, Math.max(0, n.weight));
    if (k === 0) continue;
    tempC += n.deltaK * k;
    if (n.cloudFraction !== undefined) cloud += (n.cloudFraction - cloud) * k;
    if (n.windMps !== undefined) wind += (n.windMps - wind) * k;
  }

  const dewPointC = tempC - dewPointDepressionK(cloud, wind, shape.f, w);
  return { tempC, dewPointC, windMps: wind, cloudFraction: cloud };
}

/** How far the dew point sits below the temperature: small at night and under cloud, larger on clear afternoons. */
export function dewPointDepressionK(cloudFraction: number, windMps: number, dailyShapeF: number, winter: number): number {
  return (0.5 + (1 - cloudFraction) * (1 + 4 * dailyShapeF) + 0.1 * windMps) * (0.6 + 0.4 * (1 - winter));
}

/** The same values rounded as Open-Meteo rounds them (0.1 °C, 0.1 m/s, whole per cent). */
export function roundedWeather(w: FakeWeather): FakeWeather {
  const tempC = round1(w.tempC);
  return {
    tempC,
    dewPointC: Math.min(round1(w.dewPointC), round1(tempC - 0.1)),
    windMps: round1(w.windMps),
    cloudFraction: Math.round(w.cloudFraction * 100) / 100,
  };
}
