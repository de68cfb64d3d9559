// The local fake of the Open-Meteo `/v1/forecast` service: the same request parameters and the same
// JSON answer, generated from the deterministic model in ./climate with an optional scenario
// (./scenario), plus injectable faults for tests. `fakeForecastResponse` is pure (time is passed in);
// `fakeForecastHttp` adds the HTTP envelope, scenario files and faults, for the app's route handler.
import { fakeElevationM, fakeWeatherAt, roundedWeather } from './climate';
import { loadScenario, scenarioNudges, ScenarioError, type Scenario } from './scenario';
import { isValidTimeZone, localDateOf, localIsoMinutes, localMidnightUtc, offsetSecondsAt, zoneAbbreviationAt } from './tz';
import { HOURLY_VARIABLES, type HourlyVariable, type OpenMeteoForecastResponse } from './types';

const HOUR_MS = 3_600_000;
const MAX_FORECAST_DAYS = 16;
const MAX_PAST_DAYS = 92;
const MAX_HOURS = (MAX_FORECAST_DAYS + MAX_PAST_DAYS) * 24;
/** Fixed so the answer is byte-for-byte deterministic. */
const GENERATION_TIME_MS = 0.05;

export const FAULTS = ['none', 'slow', 'error500', 'malformed'] as const;
export type Fault = (typeof FAULTS)[number];
export function isFault(v: unknown): v is Fault {
  return typeof v === 'string' && (FAULTS as readonly string[]).includes(v);
}
export const DEFAULT_SLOW_MS = 10_000;

/** A request the real service would refuse with HTTP 400. */
export class FakeRequestError extends Error {
  readonly status = 400;
  constructor(message: string) {
    super(message);
    this.name = 'FakeRequestError';
  }
}

/** Object form of the request; names follow Open-Meteo's query parameters. */
export interface FakeForecastQuery {
  latitude: number;
  longitude: number;
  /** Default: the four variables Thawline uses. */
  hourly?: readonly string[];
  timezone?: string;
  timeformat?: 'iso8601' | 'unixtime';
  temperature_unit?: 'celsius' | 'fahrenheit';
  wind_speed_unit?: 'kmh' | 'ms' | 'mph' | 'kn';
  elevation?: number;
  forecast_days?: number;
  past_days?: number;
  forecast_hours?: number;
  past_hours?: number;
  /** YYYY-MM-DD, with end_date. */
  start_date?: string;
  end_date?: string;
}

function toSearchParams(q: FakeForecastQuery): URLSearchParams {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(q)) {
    if (v === undefined) continue;
    p.set(k, Array.isArray(v) ? v.join(',') : String(v));
  }
  if (q.hourly === undefined) p.set('hourly', HOURLY_VARIABLES.join(','));
  return p;
}

function numberParam(p: URLSearchParams, name: string, min: number, max: number, integer: boolean): number | undefined {
  const raw = p.get(name);
  if (raw === null) return undefined;
  const v = raw.trim() === '' ? Number.NaN : Number(raw);
  if (!Number.isFinite(v) || v < min || v > max || (integer && !Number.isInteger(v))) {
    throw new FakeRequestError(
      `Parameter '${name}' must be ${integer ? 'an integer' : 'a number'} within ${min}..${max}, got '${raw.slice(0, 40)}'`,
    );
  }
  return v;
}

function choiceParam<T extends string>(p: URLSearchParams, name: string, choices: readonly T[], fallback: T): T {
  const raw = p.get(name);
  if (raw === null) return fallback;
  if (!(choices as readonly string[]).includes(raw)) {
    throw new FakeRequestError(`Parameter '${name}' must be one of ${choices.join(', ')}, got '${raw.slice(0, 40)}'`);
  }
  return raw as T;
}

function dateParam(p: URLSearchParams, name: string): { year: number; month: number; day: number } | undefined {
  const raw = p.get(name);
  if (raw === null) return undefined;
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(raw);
  const d = m ? new Date(Date.UTC(+m[1], +m[2] - 1, +m[3])) : null;
  if (!m || !d || d.getUTCMonth() !== +m[2] - 1 || d.getUTCDate() !== +m[3]) {
    throw new FakeRequestError(`Parameter '${name}' must be a date YYYY-MM-DD, got '${raw.slice(0, 40)}'`);
  }
  return { year: +m[1], month: +m[2], day: +m[3] };
}

/** The UTC instants (epoch ms) of the hours the request asks for. */
function timeAxis(p: URLSearchParams, zone: string, nowMs: number): number[] {
  const start = dateParam(p, 'start_date');
  const end = dateParam(p, 'end_date');
  const forecastHours = numberParam(p, 'forecast_hours', 0, MAX_FORECAST_DAYS * 24, true);
  const pastHours = numberParam(p, 'past_hours', 0, MAX_PAST_DAYS * 24, true);
  const forecastDays = numberParam(p, 'forecast_days', 0, MAX_FORECAST_DAYS, true) ?? 7;
  const pastDays = numberParam(p, 'past_days', 0, MAX_PAST_DAYS, true) ?? 0;

  let first: number;
  let endMs: number;
  if (start || end) {
    if (!start || !end) throw new FakeRequestError("Parameters 'start_date' and 'end_date' must be given together");
    first = localMidnightUtc(zone, start.year, start.month, start.day);
    endMs = localMidnightUtc(zone, end.year, end.month, end.day + 1);
    if (endMs <= first) throw new FakeRequestError("Parameter 'end_date' must not be before 'start_date'");
  } else if (forecastHours !== undefined || pastHours !== undefined) {
    const currentHour = Math.floor(nowMs / HOUR_MS) * HOUR_MS;
    first = currentHour - (pastHours ?? 0) * HOUR_MS;
    endMs = currentHour + (forecastHours ?? forecastDays * 24) * HOUR_MS;
  } else {
    const today = localDateOf(zone, nowMs);
    first = localMidnightUtc(zone, today.year, today.month, today.day - pastDays);
    endMs = localMidnightUtc(zone, today.year, today.month, today.day + forecastDays);
  }
  const count = Math.round((endMs - first) / HOUR_MS);
  if (count > MAX_HOURS) throw new FakeRequestError(`The request covers ${count} hours; at most ${MAX_HOURS} are served`);
  return Array.from({ length: Math.max(0, count) }, (_, i) => first + i * HOUR_MS);
}

const WIND_FROM_MPS: Record<'kmh' | 'ms' | 'mph' | 'kn', { unit: string; factor: number }> = {
  kmh: { unit: 'km/h', factor: 3.6 },
  ms: { unit: 'm/s', factor: 1 },
  mph: { unit: 'mp/h', factor: 1 / 0.44704 },
  kn: { unit: 'kn', factor: 3600 / 1852 },
};

/**
 * The fake service's JSON answer for a request, exactly in Open-Meteo's response shape.
 * Deterministic: the same parameters, `now` and scenario give the same answer; `now` only decides
 * which hours are "today" (and where a scenario's relative window falls).
 * Throws FakeRequestError for a request the service would refuse (HTTP 400).
 */
export function fakeForecastResponse(
  params: URLSearchParams | FakeForecastQuery,
  opts: { now: Date; scenario?: Scenario },
): OpenMeteoForecastResponse {
  const p = params instanceof URLSearchParams ? params : toSearchParams(params);
  const nowMs = opts.now.getTime();
  if (!Number.isFinite(nowMs)) throw new RangeError('now must be a valid date');

  const latitude = numberParam(p, 'latitude', -90, 90, false);
  const longitude = numberParam(p, 'longitude', -180, 180, false);
  if (latitude === undefined || longitude === undefined) {
    throw new FakeRequestError("Parameters 'latitude' and 'longitude' are required");
  }
  const requestedZone = p.get('timezone') ?? 'GMT';
  // The real service resolves "auto" from the coordinates; the fake has no zone map and answers in GMT.
  const zone = requestedZone === 'auto' ? 'GMT' : requestedZone;
  if (!isValidTimeZone(zone)) throw new FakeRequestError(`Invalid timezone '${requestedZone.slice(0, 60)}'`);
  const timeformat = choiceParam(p, 'timeformat', ['iso8601', 'unixtime'] as const, 'iso8601');
  const temperatureUnit = choiceParam(p, 'temperature_unit', ['celsius', 'fahrenheit'] as const, 'celsius');
  const windUnitName = choiceParam(
    p,
    p.has('wind_speed_unit') ? 'wind_speed_unit' : 'windspeed_unit',
    ['kmh', 'ms', 'mph', 'kn'] as const,
    'kmh',
  );
  const elevation = numberParam(p, 'elevation', -500, 9000, false) ?? fakeElevationM(latitude, longitude);

  const variables = p
    .getAll('hourly')
    .flatMap((v) => v.split(','))
    .map((v) => v.trim())
    .filter((v) => v !== '');
  for (const v of variables) {
    if (!(HOURLY_VARIABLES as readonly string[]).includes(v)) {
      throw new FakeRequestError(`Unknown hourly variable '${v.slice(0, 60)}' (the fake serves ${HOURLY_VARIABLES.join(', ')})`);
    }
  }
  const wanted = HOURLY_VARIABLES.filter((v) => variables.includes(v));

  const response: OpenMeteoForecastResponse = {
    latitude: Math.round(latitude * 1e4) / 1e4,
    longitude: Math.round(longitude * 1e4) / 1e4,
    generationtime_ms: GENERATION_TIME_MS,
    utc_offset_seconds: offsetSecondsAt(zone, nowMs),
    timezone: zone,
    timezone_abbreviation: zoneAbbreviationAt(zone, nowMs),
    elevation,
  };
  const axis = timeAxis(p, zone, nowMs);
  if (wanted.length === 0) return response;

  const wind = WIND_FROM_MPS[windUnitName];
  const tempOut = (c: number) => (temperatureUnit === 'fahrenheit' ? Math.round((c * 1.8 + 32) * 10) / 10 : c);
  const units: Record<HourlyVariable, string> = {
    temperature_2m: temperatureUnit === 'fahrenheit' ? '°F' : '°C',
    dew_point_2m: temperatureUnit === 'fahrenheit' ? '°F' : '°C',
    wind_speed_10m: wind.unit,
    cloud_cover: '%',
  };
  const series: Record<HourlyVariable, number[]> = {
    temperature_2m: [],
    dew_point_2m: [],
    wind_speed_10m: [],
    cloud_cover: [],
  };
  for (const ms of axis) {
    const w = roundedWeather(
      fakeWeatherAt(latitude, longitude, elevation, ms, scenarioNudges(opts.scenario, ms, nowMs, longitude)),
    );
    series.temperature_2m.push(tempOut(w.tempC));
    series.dew_point_2m.push(tempOut(w.dewPointC));
    series.wind_speed_10m.push(Math.round(w.windMps * wind.factor * 10) / 10);
    series.cloud_cover.push(Math.round(w.cloudFraction * 100));
  }

  const time = timeformat === 'unixtime' ? axis.map((ms) => ms / 1000) : axis.map((ms) => localIsoMinutes(zone, ms));
  response.hourly_units = { time: timeformat };
  response.hourly = { time };
  for (const v of wanted) {
    response.hourly_units[v] = units[v];
    response.hourly[v] = series[v];
  }
  return response;
}

// ---------------------------------------------------------------------------------------------
// HTTP envelope

export interface FakeHttpOptions {
  now: Date;
  /** Default scenario (e.g. from the environment); a `scenario=` query parameter wins. */
  scenarioName?: string;
  /** Default fault (e.g. from the environment); a `fault=` query parameter wins. */
  fault?: Fault;
  /** How long the 'slow' fault waits before answering (default 10 s, beyond the client's 8 s timeout). */
  slowMs?: number;
  /** Cancels a slow answer (pass the incoming request's signal); the promise then rejects with an AbortError. */
  signal?: AbortSignal;
}

export interface FakeHttpResult {
  status: number;
  body: string;
  headers: Record<string, string>;
}

const JSON_HEADERS: Record<string, string> = {
  'content-type': 'application/json; charset=utf-8',
  'cache-control': 'no-store',
  'x-forecast-source': 'fake',
};

function jsonResult(status: number, value: unknown): FakeHttpResult {
  return { status, body: JSON.stringify(value), headers: { ...JSON_HEADERS } };
}

function abortError(): Error {
  return new DOMException('The operation was aborted.', 'AbortError');
}

function delay(ms: number, signal?: AbortSignal): Promise<void> {
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(abortError());
    const onAbort = () => {
      clearTimeout(timer);
      reject(abortError());
    };
    const timer = setTimeout(() => {
      signal?.removeEventListener('abort', onAbort);
      resolve();
    }, ms);
    signal?.addEventListener('abort', onAbort, { once: true });
  });
}

/** Break the answer the way a faulty upstream might: valid JSON, wrong shape (a series cut short). */
function malformed(r: OpenMeteoForecastResponse): unknown {
  const hourly: Record<string, unknown> = { ...r.hourly };
  if (Array.isArray(hourly.temperature_2m)) hourly.temperature_2m = hourly.temperature_2m.slice(0, -3);
  return { ...r, hourly };
}

/**
 * Answer one request to the fake service: `url` is the full request URL (path ending in
 * /v1/forecast). Query parameters are Open-Meteo's, plus `fault=` and `scenario=` for tests and demos.
 * Bad requests get 400 with Open-Meteo's error body {"error": true, "reason": "..."}.
 */
export async function fakeForecastHttp(url: URL, opts: FakeHttpOptions): Promise<FakeHttpResult> {
  if (!/\/v1\/forecast\/?$/.test(url.pathname)) {
    return jsonResult(404, { error: true, reason: `Not found: ${url.pathname.slice(0, 100)}` });
  }
  const faultParam = url.searchParams.get('fault');
  const fault = faultParam ?? opts.fault ?? 'none';
  if (!isFault(fault)) {
    return jsonResult(400, { error: true, reason: `Parameter 'fault' must be one of ${FAULTS.join(', ')}` });
  }
  if (fault === 'error500') {
    return jsonResult(500, { error: true, reason: 'Injected fault: internal server error' });
  }
  if (fault === 'slow') await delay(opts.slowMs ?? DEFAULT_SLOW_MS, opts.signal);

  let response: OpenMeteoForecastResponse;
  try {
    const scenarioName = url.searchParams.get('scenario') ?? opts.scenarioName;
    const scenario = scenarioName ? loadScenario(scenarioName) : undefined;
    response = fakeForecastResponse(url.searchParams, { now: opts.now, scenario });
  } catch (e) {
    if (e instanceof FakeRequestError || e instanceof ScenarioError) {
      return jsonResult(400, { error: true, reason: e.message });
    }
    throw e;
  }
  return jsonResult(200, fault === 'malformed' ? malformed(response) : response);
}

/**
 * A `fetch` that answers from the fake in-process (no network): for tests and offline tools.
 * Honours the request's AbortSignal like the real fetch does.
 */
export function createFakeFetch(opts: Omit<FakeHttpOptions, 'signal'>): typeof fetch {
  return async (input, init) => {
    const href = input instanceof Request ? input.url : String(input);
    const signal = init?.signal ?? (input instanceof Request ? input.signal : undefined) ?? undefined;
    if (signal?.aborted) throw abortError();
    const r = await fakeForecastHttp(new URL(href), { ...opts, signal });
    if (signal?.aborted) throw abortError();
    return new Response(r.body, { status: r.status, headers: r.headers });
  };
}
