// Pure helpers over an HourlyForecast for pages, the soak model and the planner. No clock: `now` is passed in.
import type { ForecastHour } from './types';

const MINUTE_MS = 60_000;
const HOUR_MS = 3_600_000;

function ms(iso: string): number {
  return Date.parse(iso);
}

/**
 * Outside temperature at an instant, linear between forecast hours (the soak model's own assumption).
 * Undefined outside the forecast's span or for an invalid time.
 */
export function tempAt(hours: readonly ForecastHour[], atIso: string): number | undefined {
  const t = ms(atIso);
  if (!Number.isFinite(t) || hours.length === 0) return undefined;
  let lo = 0;
  let hi = hours.length - 1;
  if (t < ms(hours[lo].at) || t > ms(hours[hi].at)) return undefined;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (ms(hours[mid].at) <= t) lo = mid;
    else hi = mid;
  }
  const t0 = ms(hours[lo].at);
  const t1 = ms(hours[hi].at);
  if (t1 === t0) return hours[lo].tempC;
  return hours[lo].tempC + ((hours[hi].tempC - hours[lo].tempC) * (t - t0)) / (t1 - t0);
}

/**
 * The lowest outside temperature in [fromIso, toIso] and when it occurs. The forecast is read as a
 * line between hours, so the low is at a forecast hour or at a window end. Null when the window
 * and the forecast do not overlap or the window is invalid.
 */
export function nightLow(
  hours: readonly ForecastHour[],
  fromIso: string,
  toIso: string,
): { tempC: number; at: string } | null {
  const from = ms(fromIso);
  const to = ms(toIso);
  if (!Number.isFinite(from) || !Number.isFinite(to) || to < from) return null;
  let best: { tempC: number; at: number } | null = null;
  const consider = (tempC: number | undefined, at: number) => {
    if (tempC === undefined) return;
    if (!best || tempC < best.tempC) best = { tempC, at };
  };
  consider(tempAt(hours, new Date(from).toISOString()), from);
  for (const h of hours) {
    const t = ms(h.at);
    if (t > from && t < to) consider(h.tempC, t);
  }
  consider(tempAt(hours, new Date(to).toISOString()), to);
  const low = best as { tempC: number; at: number } | null;
  return low ? { tempC: low.tempC, at: new Date(low.at).toISOString() } : null;
}

/** The outside-temperature series for the soak model: sorted by time, one point per instant. */
export function toOutsideSeries(hours: readonly ForecastHour[]): { at: string; tempC: number }[] {
  return toSoakInputs(hours).outside.map((p) => ({ at: new Date(p.atMs).toISOString(), tempC: p.tempC }));
}

/**
 * The forecast as the soak model's inputs (lib/thermal SoakModel fields): outside air linear between
 * points, wind and cloud piecewise constant from each hour. Sorted, one point per instant.
 */
export function toSoakInputs(hours: readonly ForecastHour[]): {
  outside: { atMs: number; tempC: number }[];
  wind: { atMs: number; mps: number }[];
  cloud: { atMs: number; fraction: number }[];
  /** Dew point of the outside air (for frost on an airframe outside). */
  dewPoint: { atMs: number; c: number }[];
} {
  const seen = new Set<number>();
  const sorted = hours
    .map((h) => ({ h, t: ms(h.at) }))
    .filter((p) => Number.isFinite(p.t))
    .sort((a, b) => a.t - b.t)
    .filter((p) => (seen.has(p.t) ? false : (seen.add(p.t), true)));
  return {
    outside: sorted.map(({ h, t }) => ({ atMs: t, tempC: h.tempC })),
    wind: sorted.map(({ h, t }) => ({ atMs: t, mps: h.windMps })),
    cloud: sorted.map(({ h, t }) => ({ atMs: t, fraction: h.cloudFraction })),
    dewPoint: sorted.map(({ h, t }) => ({ atMs: t, c: h.dewPointC })),
  };
}

/** True when a forecast fetched at `fetchedAt` is older than `maxAgeMinutes` at `now` (or its time is unreadable). */
export function isStale(fetchedAt: string | Date, now: Date, maxAgeMinutes = 60): boolean {
  const fetched = typeof fetchedAt === 'string' ? ms(fetchedAt) : fetchedAt.getTime();
  if (!Number.isFinite(fetched)) return true;
  return now.getTime() - fetched > maxAgeMinutes * MINUTE_MS;
}

/** Age of a forecast in whole minutes at `now` (for "forecast is 3 h old" notices); never negative. */
export function ageMinutes(fetchedAt: string | Date, now: Date): number {
  const fetched = typeof fetchedAt === 'string' ? ms(fetchedAt) : fetchedAt.getTime();
  return Math.max(0, Math.floor((now.getTime() - fetched) / MINUTE_MS));
}

const SIGMA_POINTS: readonly (readonly [number, number])[] = [
  [0, 0.8],
  [12, 1.3],
  [24, 1.7],
  [48, 2.3],
  [72, 2.7],
  [120, 3.4],
  [168, 4.0],
  [240, 4.6],
  [384, 5.0],
];

/**
 * One standard deviation of the 2 m temperature forecast error, K, at a lead time in hours.
 * From memory (docs/sources.md, "Forecast data"): roughly 1–2 K at 12–24 h and 2–3 K at 48–72 h; the
 * values between and beyond are a smooth reading of that, capped at 5 K. Past hours (negative lead)
 * get the analysis-level value.
 */
export function forecastSigmaK(leadHours: number): number {
  if (!Number.isFinite(leadHours) || leadHours <= 0) return SIGMA_POINTS[0][1];
  for (let i = 1; i < SIGMA_POINTS.length; i++) {
    const [h1, s1] = SIGMA_POINTS[i];
    if (leadHours <= h1) {
      const [h0, s0] = SIGMA_POINTS[i - 1];
      return s0 + ((s1 - s0) * (leadHours - h0)) / (h1 - h0);
    }
  }
  return SIGMA_POINTS[SIGMA_POINTS.length - 1][1];
}

/** Lead time in hours from the forecast's fetch to an instant. */
export function leadHours(fetchedAt: string, atIso: string): number {
  return (ms(atIso) - ms(fetchedAt)) / HOUR_MS;
}
