// Forecast client for the Open-Meteo `/v1/forecast` JSON API (and Thawline's local fake, which speaks
// the same format). Request: latitude, longitude, hourly=temperature_2m,dew_point_2m,wind_speed_10m,
// cloud_cover, timezone, forecast_days, past_days; we also ask for timeformat=unixtime (epoch seconds,
// always UTC) and wind_speed_unit=ms, and still convert other units if a server answers with them.
import { z } from 'zod';
import { HOURLY_VARIABLES, type ForecastHour, type HourlyForecast, type OpenMeteoForecastResponse } from './types';

export type ForecastErrorKind = 'timeout' | 'http' | 'malformed' | 'network';

/** The one error type the client throws for anything the service (or the way to it) did wrong. */
export class ForecastError extends Error {
  readonly kind: ForecastErrorKind;
  /** HTTP status for kind 'http'. */
  readonly status?: number;

  constructor(kind: ForecastErrorKind, message: string, options?: { status?: number; cause?: unknown }) {
    super(message, options?.cause === undefined ? undefined : { cause: options.cause });
    this.name = 'ForecastError';
    this.kind = kind;
    this.status = options?.status;
  }
}

export const DEFAULT_TIMEOUT_MS = 8000;
export const DEFAULT_FORECAST_HOURS = 72;
/** Open-Meteo's limits for forecast_days and past_days (from memory of its API docs). */
const MAX_FORECAST_DAYS = 16;
const MAX_PAST_DAYS = 92;
/** A forecast answer for a week is ~30 kB; anything far larger is not what we asked for. */
const MAX_BODY_CHARS = 5_000_000;

// ---------------------------------------------------------------------------------------------
// Response schema (zod v4)

const series = z.array(z.number().nullable());

const HourlySchema = z
  .object({
    time: z.union([z.array(z.number().int()), z.array(z.string())]),
    temperature_2m: series,
    dew_point_2m: series,
    wind_speed_10m: series,
    cloud_cover: series,
  })
  .superRefine((h, ctx) => {
    const n = h.time.length;
    for (const key of HOURLY_VARIABLES) {
      if (h[key].length !== n) {
        ctx.addIssue({
          code: 'custom',
          path: [key],
          message: `${key} has ${h[key].length} values but time has ${n}`,
        });
      }
    }
  });

const UnitsSchema = z.object({
  time: z.string(),
  temperature_2m: z.string(),
  dew_point_2m: z.string(),
  wind_speed_10m: z.string(),
  cloud_cover: z.string(),
});

export const OpenMeteoResponseSchema = z.object({
  latitude: z.number().min(-90).max(90),
  longitude: z.number().min(-180).max(180),
  elevation: z.number(),
  utc_offset_seconds: z.number().int(),
  timezone: z.string().optional(),
  hourly_units: UnitsSchema,
  hourly: HourlySchema,
});

// ---------------------------------------------------------------------------------------------
// Units

function temperatureToC(unit: string): ((v: number) => number) | null {
  if (unit === '°C') return (v) => v;
  if (unit === '°F') return (v) => ((v - 32) * 5) / 9;
  return null;
}

function windToMps(unit: string): ((v: number) => number) | null {
  switch (unit) {
    case 'm/s':
      return (v) => v;
    case 'km/h':
      return (v) => v / 3.6;
    case 'mp/h':
    case 'mph':
      return (v) => v * 0.44704;
    case 'kn':
    case 'kt':
      return (v) => (v * 1852) / 3600;
    default:
      return null;
  }
}

/** Local wall time "YYYY-MM-DDTHH:MM" (iso8601 mode) to a UTC instant, using the response's offset. */
function localIsoToUtcMs(s: string, offsetSeconds: number): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/.exec(s);
  if (!m) return Number.NaN;
  return Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5]) - offsetSeconds * 1000;
}

// ---------------------------------------------------------------------------------------------
// Pure conversion

/**
 * Validate an Open-Meteo response body (already JSON-parsed) and convert it to Thawline's
 * HourlyForecast. Throws ForecastError('malformed') when the shape, units or time axis are wrong.
 * Hours in which any of the four values is null are dropped (consumers interpolate linearly
 * between hours, so a dropped hour reads as the line between its neighbours).
 */
export function parseForecastResponse(
  body: unknown,
  meta: { fetchedAt: string; source: HourlyForecast['source'] },
): HourlyForecast {
  const parsed = OpenMeteoResponseSchema.safeParse(body);
  if (!parsed.success) {
    throw new ForecastError('malformed', `forecast response failed validation: ${z.prettifyError(parsed.error)}`, {
      cause: parsed.error,
    });
  }
  const r = parsed.data;
  const u = r.hourly_units;
  const toC = temperatureToC(u.temperature_2m);
  const dewToC = temperatureToC(u.dew_point_2m);
  const toMps = windToMps(u.wind_speed_10m);
  if (!toC || !dewToC || !toMps || u.cloud_cover !== '%' || (u.time !== 'unixtime' && u.time !== 'iso8601')) {
    throw new ForecastError('malformed', `forecast response has unexpected units: ${JSON.stringify(u)}`);
  }

  const h = r.hourly;
  const hours: ForecastHour[] = [];
  let previousMs = -Infinity;
  for (let i = 0; i < h.time.length; i++) {
    const t = h.time[i];
    const ms =
      u.time === 'unixtime'
        ? typeof t === 'number'
          ? t * 1000
          : Number.NaN
        : typeof t === 'string'
          ? localIsoToUtcMs(t, r.utc_offset_seconds)
          : Number.NaN;
    if (!Number.isFinite(ms)) {
      throw new ForecastError('malformed', `forecast time[${i}] is not a ${u.time} time: ${JSON.stringify(t)}`);
    }
    if (ms <= previousMs) {
      throw new ForecastError('malformed', `forecast time axis is not strictly increasing at index ${i}`);
    }
    previousMs = ms;
    const temp = h.temperature_2m[i];
    const dew = h.dew_point_2m[i];
    const wind = h.wind_speed_10m[i];
    const cloud = h.cloud_cover[i];
    if (temp === null || dew === null || wind === null || cloud === null) continue;
    const tempC = toC(temp);
    hours.push({
      at: new Date(ms).toISOString(),
      tempC,
      // Rounding in the service can put the dew point a hair above the temperature; it never is.
      dewPointC: Math.min(dewToC(dew), tempC),
      windMps: Math.max(0, toMps(wind)),
      cloudFraction: Math.min(1, Math.max(0, cloud / 100)),
    });
  }
  if (hours.length === 0) {
    throw new ForecastError('malformed', 'forecast response has no usable hours');
  }
  return {
    fetchedAt: meta.fetchedAt,
    source: meta.source,
    latitude: r.latitude,
    longitude: r.longitude,
    elevationM: r.elevation,
    hours,
  };
}

// ---------------------------------------------------------------------------------------------
// Request

export interface FetchForecastParams {
  /** Service root, e.g. "https://api.open-meteo.com" or "http://localhost:3000/api/fake-weather";
   *  "/v1/forecast" is appended to the path unless it already ends with it; a query string is kept. */
  baseUrl: string;
  latitude: number;
  longitude: number;
  /** Hours ahead that must be covered (default 72); rounded up to whole days from local midnight. */
  hours?: number;
  /** Whole days before today to include too (default 1, so the soak can start at last evening's shutdown). */
  pastDays?: number;
  /** Zone whose midnight starts the series; times are returned as UTC either way (default "GMT"). */
  timezone?: string;
  timeoutMs?: number;
  fetchImpl?: typeof fetch;
  /** Caller's own cancel signal, besides the timeout. */
  signal?: AbortSignal;
  /** Clock for fetchedAt (default: the system clock). */
  now?: () => Date;
  /** Overrides the source label; otherwise "fake" when the server says so in x-forecast-source. */
  source?: HourlyForecast['source'];
}

/** The request URL the client sends. */
export function buildForecastUrl(p: Pick<FetchForecastParams, 'baseUrl' | 'latitude' | 'longitude' | 'hours' | 'pastDays' | 'timezone'>): URL {
  if (!Number.isFinite(p.latitude) || p.latitude < -90 || p.latitude > 90) {
    throw new RangeError(`latitude must be within -90..90, got ${p.latitude}`);
  }
  if (!Number.isFinite(p.longitude) || p.longitude < -180 || p.longitude > 180) {
    throw new RangeError(`longitude must be within -180..180, got ${p.longitude}`);
  }
  const hours = p.hours ?? DEFAULT_FORECAST_HOURS;
  if (!Number.isFinite(hours) || hours < 1) throw new RangeError(`hours must be at least 1, got ${hours}`);
  const pastDays = p.pastDays ?? 1;
  if (!Number.isInteger(pastDays) || pastDays < 0 || pastDays > MAX_PAST_DAYS) {
    throw new RangeError(`pastDays must be an integer within 0..${MAX_PAST_DAYS}, got ${pastDays}`);
  }
  // The series starts at today's local midnight, so one extra day covers `hours` from any time of day.
  const forecastDays = Math.min(MAX_FORECAST_DAYS, Math.ceil(hours / 24) + 1);

  let url: URL;
  try {
    url = new URL(p.baseUrl);
  } catch {
    throw new RangeError(`baseUrl is not a URL: ${p.baseUrl}`);
  }
  // Query parameters already in baseUrl (e.g. the fake's fault= or scenario=) are kept.
  const path = url.pathname.replace(/\/+$/, '');
  url.pathname = /\/v1\/forecast$/.test(path) ? path : `${path}/v1/forecast`;
  const q = url.searchParams;
  q.set('latitude', String(p.latitude));
  q.set('longitude', String(p.longitude));
  q.set('hourly', HOURLY_VARIABLES.join(','));
  q.set('timezone', p.timezone ?? 'GMT');
  q.set('timeformat', 'unixtime');
  q.set('wind_speed_unit', 'ms');
  q.set('temperature_unit', 'celsius');
  q.set('forecast_days', String(forecastDays));
  q.set('past_days', String(pastDays));
  return url;
}

function isAbortError(e: unknown): boolean {
  return typeof e === 'object' && e !== null && 'name' in e && (e.name === 'AbortError' || e.name === 'TimeoutError');
}

/** The error reason Open-Meteo puts in a 4xx/5xx JSON body ({"error": true, "reason": "..."}), if any. */
function errorReason(text: string): string | undefined {
  try {
    const j: unknown = JSON.parse(text);
    if (j && typeof j === 'object' && 'reason' in j && typeof j.reason === 'string') return j.reason.slice(0, 300);
  } catch {
    /* not JSON */
  }
  return undefined;
}

/**
 * Fetch an hourly forecast. Resolves to an HourlyForecast; rejects only with ForecastError
 * (or RangeError for impossible arguments).
 */
export async function fetchForecast(params: FetchForecastParams): Promise<HourlyForecast> {
  const url = buildForecastUrl(params);
  const timeoutMs = params.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  const fetchImpl = params.fetchImpl ?? fetch;
  const now = params.now ?? (() => new Date());

  const controller = new AbortController();
  let timedOut = false;
  const timer = setTimeout(() => {
    timedOut = true;
    controller.abort();
  }, timeoutMs);
  const onOuterAbort = () => controller.abort();
  if (params.signal?.aborted) controller.abort();
  params.signal?.addEventListener('abort', onOuterAbort, { once: true });

  let status: number;
  let text: string;
  let sourceHeader: string | null;
  try {
    const res = await fetchImpl(url, { signal: controller.signal, headers: { accept: 'application/json' } });
    status = res.status;
    sourceHeader = res.headers.get('x-forecast-source');
    text = await res.text();
  } catch (e) {
    if (timedOut) throw new ForecastError('timeout', `forecast service did not answer within ${timeoutMs} ms`, { cause: e });
    if (isAbortError(e)) throw new ForecastError('network', 'forecast request was cancelled', { cause: e });
    throw new ForecastError('network', `forecast service unreachable: ${e instanceof Error ? e.message : String(e)}`, {
      cause: e,
    });
  } finally {
    clearTimeout(timer);
    params.signal?.removeEventListener('abort', onOuterAbort);
  }

  if (status < 200 || status > 299) {
    const reason = errorReason(text);
    throw new ForecastError('http', `forecast service answered HTTP ${status}${reason ? `: ${reason}` : ''}`, { status });
  }
  if (text.length > MAX_BODY_CHARS) {
    throw new ForecastError('malformed', `forecast response is too large (${text.length} characters)`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    throw new ForecastError('malformed', 'forecast response is not JSON', { cause: e });
  }
  const source = params.source ?? (sourceHeader === 'fake' ? 'fake' : 'remote');
  return parseForecastResponse(json, { fetchedAt: now().toISOString(), source });
}

export type { OpenMeteoForecastResponse };
