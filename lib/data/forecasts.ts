import 'server-only';
import { Op } from 'sequelize';
import { db } from '@/models';
import type { Airfield, Forecast } from '@/models';
import { env } from '@/lib/env';
import { ForecastError, fetchForecast } from '@/lib/weather/openMeteo';
import { createFakeFetch } from '@/lib/weather/fake';
import { ageMinutes, isStale, nightLow, toSoakInputs } from '@/lib/weather/derive';
import type { ForecastHour, HourlyForecast } from '@/lib/weather/types';
import { outsideAt, simulate, type SoakModel } from '@/lib/thermal';
import { shelterModelOf } from '@/lib/shelter-model';
import { addDays, localDateKey, localDateOf, sunDay, tonightWindow } from '@/lib/time';
import { findAirfield, type ShelterRow } from './airfields';
import type { ForecastStateView, ForecastStatus, ForecastView, ShelterCurve, SunDayView, TonightSummary } from '@/lib/views/forecasts';

export type { ForecastStateView, ForecastStatus, ForecastView, ShelterCurve, SunDayView, TonightSummary };

// The forecast cache: one stored forecast per airfield, refreshed on demand and when older than an
// hour. When the service fails the last forecast stays in use, marked stale with its age; a failure
// is recorded on the row and retried automatically only after a pause (a forced refresh always tries).
// With no FORECAST_BASE_URL the app's own fake answers, called in-process through the same client
// code path (no HTTP request to ourselves).

export const FORECAST_MAX_AGE_MINUTES = 60;
/** After a failed fetch, automatic refreshes wait this long before trying again. */
export const RETRY_AFTER_FAILURE_MINUTES = 5;
/** Hours ahead each fetch covers (the chart shows 48 of them; the planner needs the morning after next). */
export const FORECAST_HOURS_AHEAD = 72;
const CHART_HOURS = 48;
const CHART_STEP_MINUTES = 30;

const HOUR_MS = 3_600_000;
const FAKE_BASE_URL = 'http://fake-weather.internal/api/fake-weather';

/** What people are told about a failure; the service's own words stay in the server log. */
const FAILURE_MESSAGE: Record<string, string> = {
  timeout: 'The forecast service did not answer in time.',
  http: 'The forecast service answered with an error.',
  malformed: 'The forecast service sent data Thawline could not read.',
  network: 'The forecast service could not be reached.',
  internal: 'The forecast could not be updated.',
};

// ---------------------------------------------------------------------------------------------
// State of a stored row

function usableHours(row: Forecast | null, airfield: Airfield): ForecastHour[] {
  if (!row || !row.fetchedAt || !Array.isArray(row.hours) || row.hours.length === 0) return [];
  // A forecast asked for another place (the airfield was moved since) is not this airfield's.
  if (Math.abs(row.latitude - airfield.latitude) > 1e-6 || Math.abs(row.longitude - airfield.longitude) > 1e-6) return [];
  return row.hours;
}

export function forecastState(row: Forecast | null, airfield: Airfield, now: Date): ForecastStateView {
  const hours = usableHours(row, airfield);
  const error =
    row?.lastErrorKind && row.lastAttemptAt
      ? { kind: row.lastErrorKind, message: row.lastErrorMessage ?? FAILURE_MESSAGE.internal, at: row.lastAttemptAt.toISOString() }
      : null;
  if (!row || hours.length === 0 || !row.fetchedAt) {
    return { status: 'missing', fetchedAt: null, ageMinutes: null, source: null, error };
  }
  const stale = error !== null || isStale(row.fetchedAt, now, FORECAST_MAX_AGE_MINUTES);
  return {
    status: stale ? 'stale' : 'fresh',
    fetchedAt: row.fetchedAt.toISOString(),
    ageMinutes: ageMinutes(row.fetchedAt, now),
    source: row.source,
    error,
  };
}

function needsRefresh(row: Forecast | null, airfield: Airfield, now: Date): boolean {
  const state = forecastState(row, airfield, now);
  const byAge = state.status === 'missing' || state.fetchedAt === null || isStale(state.fetchedAt, now, FORECAST_MAX_AGE_MINUTES);
  if (!byAge && !state.error) return false;
  // After a failure, wait before trying again on our own.
  if (state.error && row?.lastAttemptAt && !isStale(row.lastAttemptAt, now, RETRY_AFTER_FAILURE_MINUTES)) return false;
  return byAge || state.error !== null;
}

// ---------------------------------------------------------------------------------------------
// Fetching

/** The forecast service in use: the configured base URL, or the app's own fake in-process. */
function serviceFor(now: Date): { baseUrl: string; fetchImpl?: typeof fetch } {
  const e = env();
  if (e.FORECAST_BASE_URL) return { baseUrl: e.FORECAST_BASE_URL };
  return {
    baseUrl: FAKE_BASE_URL,
    fetchImpl: createFakeFetch({ now, scenarioName: e.FAKE_FORECAST_SCENARIO, fault: e.FAKE_FORECAST_FAULT }),
  };
}

const g = globalThis as unknown as { __thawlineForecastInflight?: Map<number, Promise<void>> };
const inflight = (g.__thawlineForecastInflight ??= new Map());

async function fetchAndStore(airfield: Airfield, now: Date): Promise<void> {
  const { Forecast } = db();
  let result: HourlyForecast | null = null;
  let failure: { kind: string; message: string } | null = null;
  try {
    const service = serviceFor(now);
    result = await fetchForecast({
      ...service,
      latitude: airfield.latitude,
      longitude: airfield.longitude,
      timezone: airfield.timeZone,
      hours: FORECAST_HOURS_AHEAD,
      pastDays: 1,
      timeoutMs: env().FORECAST_TIMEOUT_MS,
      now: () => now,
    });
  } catch (err) {
    const kind = err instanceof ForecastError ? err.kind : 'internal';
    failure = { kind, message: FAILURE_MESSAGE[kind] ?? FAILURE_MESSAGE.internal };
    console.warn(`[thawline] forecast for airfield ${airfield.id} failed (${kind}): ${err instanceof Error ? err.message : String(err)}`);
  }

  const row = await Forecast.findOne({ where: { airfieldId: airfield.id } });
  if (result) {
    const values: RowValues = {
      source: result.source,
      fetchedAt: new Date(result.fetchedAt),
      latitude: airfield.latitude,
      longitude: airfield.longitude,
      elevationM: result.elevationM,
      hours: result.hours,
      lastAttemptAt: now,
      lastErrorKind: null,
      lastErrorMessage: null,
    };
    if (row) await row.update(values);
    else await createOrUpdate(airfield, values);
  } else if (failure) {
    const values = { lastAttemptAt: now, lastErrorKind: failure.kind, lastErrorMessage: failure.message };
    if (row) await row.update(values);
    else
      await createOrUpdate(airfield, {
        source: 'remote',
        fetchedAt: null,
        latitude: airfield.latitude,
        longitude: airfield.longitude,
        elevationM: airfield.elevationM,
        hours: [],
        ...values,
      });
  }
}

/** Create the airfield's row, or update it when another process created it meanwhile. */
interface RowValues {
  source: 'fake' | 'remote';
  fetchedAt: Date | null;
  latitude: number;
  longitude: number;
  elevationM: number;
  hours: ForecastHour[];
  lastAttemptAt: Date | null;
  lastErrorKind: string | null;
  lastErrorMessage: string | null;
}

async function createOrUpdate(airfield: Airfield, values: RowValues) {
  const { Forecast } = db();
  try {
    await Forecast.create({ organizationId: airfield.organizationId, airfieldId: airfield.id, ...values });
  } catch (err) {
    if ((err as { name?: string }).name !== 'SequelizeUniqueConstraintError') throw err;
    await Forecast.update(values, { where: { airfieldId: airfield.id } });
  }
}

/** One fetch per airfield at a time in this process; callers arriving meanwhile share it. */
function refreshOnce(airfield: Airfield, now: Date): Promise<void> {
  let p = inflight.get(airfield.id);
  if (!p) {
    p = fetchAndStore(airfield, now).finally(() => inflight.delete(airfield.id));
    inflight.set(airfield.id, p);
  }
  return p;
}

export type RefreshMode = 'never' | 'if-old' | 'force';

/**
 * How server pages refresh for their first paint: with the in-process fake a refresh costs
 * milliseconds, so pages refresh old forecasts themselves; with a remote service they only read the
 * cache (a slow service must never hold up a page) and the client refreshes through the API.
 */
export function pageRefreshMode(): RefreshMode {
  return env().FORECAST_BASE_URL ? 'never' : 'if-old';
}

/**
 * The airfield's stored forecast after refreshing it as asked: 'if-old' fetches when it is missing
 * or older than an hour (but not within a few minutes of a failure), 'force' always fetches,
 * 'never' only reads (server pages use it so a slow service never holds up a page).
 */
export async function forecastFor({ airfield, now, refresh }: { airfield: Airfield; now: Date; refresh: RefreshMode }): Promise<Forecast | null> {
  const { Forecast } = db();
  let row = await Forecast.findOne({ where: { airfieldId: airfield.id } });
  if (refresh === 'force' || (refresh === 'if-old' && needsRefresh(row, airfield, now))) {
    await refreshOnce(airfield, now);
    row = await Forecast.findOne({ where: { airfieldId: airfield.id } });
  }
  return row;
}

// ---------------------------------------------------------------------------------------------
// Views

function tonightSummary(airfield: Airfield, hours: readonly ForecastHour[], now: Date): TonightSummary {
  const w = tonightWindow(airfield.timeZone, now);
  const from = new Date(w.fromMs).toISOString();
  const to = new Date(w.toMs).toISOString();
  return { from, to, low: hours.length ? nightLow(hours, from, to) : null };
}

/** Tonight's low and the forecast's state for each airfield of a list (refreshing as asked). */
export async function tonightForAirfields({
  orgId,
  airfieldIds,
  now,
  refresh,
}: {
  orgId: number;
  airfieldIds: number[];
  now: Date;
  refresh: RefreshMode;
}): Promise<Map<number, { tonight: TonightSummary; forecast: ForecastStateView }>> {
  const { Airfield, Forecast } = db();
  const airfields = await Airfield.findAll({ where: { organizationId: orgId, id: { [Op.in]: airfieldIds } } });
  const rows = new Map<number, Forecast | null>();
  if (refresh === 'never') {
    const stored = await Forecast.findAll({ where: { organizationId: orgId, airfieldId: { [Op.in]: airfieldIds } } });
    for (const r of stored) rows.set(r.airfieldId, r);
  } else {
    await Promise.all(airfields.map(async (a) => rows.set(a.id, await forecastFor({ airfield: a, now, refresh }))));
  }
  const out = new Map<number, { tonight: TonightSummary; forecast: ForecastStateView }>();
  for (const a of airfields) {
    const row = rows.get(a.id) ?? null;
    out.set(a.id, { tonight: tonightSummary(a, usableHours(row, a), now), forecast: forecastState(row, a, now) });
  }
  return out;
}

const round2 = (v: number) => Math.round(v * 100) / 100;

/** The shelter's air over the chart times from the soak model, started at the forecast's first hour. */
function shelterAir(s: ShelterRow, hours: readonly ForecastHour[], site: { lat: number; lon: number }, times: number[]): number[] {
  const inputs = toSoakInputs(hours);
  const shelter = shelterModelOf(s);
  // An open tie-down has no air of its own: the engine sits in the outside air.
  if (shelter.kind === 'tie-down') return times.map((t) => round2(outsideAt(inputs.outside, t)));
  const model: SoakModel = {
    startMs: inputs.outside[0].atMs,
    endMs: times[times.length - 1],
    outside: inputs.outside,
    cloud: inputs.cloud,
    wind: inputs.wind,
    site,
    shelter,
    // The shelter air does not feel the engines: any oil node gives the same shelter curve.
    oil: { heatCapacityJPerK: 1e5, lossWPerK: 10, initialTempC: inputs.outside[0].tempC },
  };
  const series = simulate(model, { atMs: times });
  return Array.from(series.shelterC, round2);
}

function sunView(zone: string, lat: number, lon: number, fromMs: number, toMs: number): SunDayView[] {
  const iso = (v: number | null) => (v === null ? null : new Date(v).toISOString());
  const last = localDateKey(localDateOf(zone, toMs));
  const out: SunDayView[] = [];
  for (let d = localDateOf(zone, fromMs), i = 0; i < 7 && localDateKey(d) <= last; d = addDays(d, 1), i++) {
    const s = sunDay(zone, lat, lon, d);
    out.push({ date: s.date, civilDawn: iso(s.civilDawn), sunrise: iso(s.sunrise), sunset: iso(s.sunset), civilDusk: iso(s.civilDusk), polar: s.polar });
  }
  return out;
}

/**
 * Everything the airfield page shows about the weather: the forecast's state and age, tonight's
 * low, sun times, and the next 48 h of outside air with each shelter's air from the soak model.
 */
export async function forecastView({
  orgId,
  airfieldId,
  shelters,
  now,
  refresh,
}: {
  orgId: number;
  airfieldId: number;
  shelters: ShelterRow[];
  now: Date;
  refresh: RefreshMode;
}): Promise<ForecastView> {
  const airfield = await findAirfield({ orgId, airfieldId });
  const row = await forecastFor({ airfield, now, refresh });
  const hours = usableHours(row, airfield);
  const state = forecastState(row, airfield, now);
  const tonight = tonightSummary(airfield, hours, now);
  const site = { lat: airfield.latitude, lon: airfield.longitude };

  const nowMs = now.getTime();
  const hourFloor = Math.floor(nowMs / HOUR_MS) * HOUR_MS;
  let chart: ForecastView['chart'] = null;
  let sun: SunDayView[] = sunView(airfield.timeZone, site.lat, site.lon, hourFloor, hourFloor + CHART_HOURS * HOUR_MS);
  if (hours.length >= 2) {
    const firstMs = Date.parse(hours[0].at);
    const lastMs = Date.parse(hours[hours.length - 1].at);
    // From now (or from the start of a night already under way) to 48 h ahead, within the forecast.
    const startMs = Math.max(firstMs, Math.min(hourFloor, Date.parse(tonight.from)));
    const endMs = Math.min(lastMs, hourFloor + CHART_HOURS * HOUR_MS);
    if (endMs > startMs) {
      const step = CHART_STEP_MINUTES * 60_000;
      const atMs: number[] = [];
      for (let t = startMs; t < endMs; t += step) atMs.push(t);
      atMs.push(endMs);
      const outside = toSoakInputs(hours).outside;
      const outsideC = atMs.map((t) => round2(outsideAt(outside, t)));
      const from = Date.parse(tonight.from);
      const to = Date.parse(tonight.to);
      const curves: ShelterCurve[] = shelters
        .filter((s) => !s.archived)
        .map((s) => {
          const airC = shelterAir(s, hours, site, atMs);
          const inNight = airC.filter((_, i) => atMs[i] >= from && atMs[i] <= to);
          return { shelterId: s.id, name: s.name, kind: s.kind, airC, tonightLowC: inNight.length ? Math.min(...inNight) : null };
        });
      chart = { atMs, outsideC, shelters: curves };
      sun = sunView(airfield.timeZone, site.lat, site.lon, startMs, endMs);
    }
  }

  return { airfieldId: airfield.id, timeZone: airfield.timeZone, now: now.toISOString(), ...state, tonight, sun, chart };
}
