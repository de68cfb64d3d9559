// The forecast client against the local fake, in-process (no network), and against each fault.
// Request parameters, response fields and units follow Open-Meteo's /v1/forecast API docs (published: its API docs).
import { describe, expect, it } from 'vitest';
import { createFakeFetch, fakeForecastResponse } from '@/lib/weather/fake';
import {
  buildForecastUrl,
  fetchForecast,
  ForecastError,
  parseForecastResponse,
  type ForecastErrorKind,
} from '@/lib/weather/openMeteo';

const NOW = new Date('2025-12-10T15:30:00Z');
const BASE = 'http://fake.invalid/api/fake-weather';
const SITE = { latitude: 55.75, longitude: 37.6 };
const META = { fetchedAt: NOW.toISOString(), source: 'fake' as const };

async function expectKind(p: Promise<unknown>, kind: ForecastErrorKind): Promise<ForecastError> {
  const e = await p.then(
    () => {
      throw new Error('expected a ForecastError');
    },
    (err: unknown) => err,
  );
  expect(e).toBeInstanceOf(ForecastError);
  expect((e as ForecastError).kind).toBe(kind);
  return e as ForecastError;
}

function bodyFetch(status: number, body: string): typeof fetch {
  return async () => new Response(body, { status, headers: { 'content-type': 'application/json' } });
}

describe('buildForecastUrl', () => {
  it('asks for the four hourly variables in unixtime, m/s and whole days covering the hours', () => {
    const url = buildForecastUrl({ baseUrl: `${BASE}/`, ...SITE, hours: 48 });
    expect(url.pathname).toBe('/api/fake-weather/v1/forecast');
    const q = url.searchParams;
    expect(q.get('hourly')).toBe('temperature_2m,dew_point_2m,wind_speed_10m,cloud_cover');
    expect(q.get('timeformat')).toBe('unixtime');
    expect(q.get('wind_speed_unit')).toBe('ms');
    expect(q.get('timezone')).toBe('GMT');
    expect(q.get('forecast_days')).toBe('3');
    expect(q.get('past_days')).toBe('1');
  });

  it('keeps a query string already in the base URL and does not double the path', () => {
    const url = buildForecastUrl({ baseUrl: `${BASE}/v1/forecast?fault=slow`, ...SITE });
    expect(url.pathname).toBe('/api/fake-weather/v1/forecast');
    expect(url.searchParams.get('fault')).toBe('slow');
  });

  it('refuses impossible coordinates', () => {
    expect(() => buildForecastUrl({ baseUrl: BASE, latitude: 91, longitude: 0 })).toThrow(RangeError);
    expect(() => buildForecastUrl({ baseUrl: BASE, latitude: 0, longitude: -181 })).toThrow(RangeError);
  });
});

describe('fetchForecast against the fake', () => {
  it('returns UTC hours covering the requested span, labelled fake, with sane values', async () => {
    const f = await fetchForecast({
      baseUrl: BASE,
      ...SITE,
      hours: 72,
      fetchImpl: createFakeFetch({ now: NOW }),
      now: () => NOW,
    });
    expect(f.source).toBe('fake');
    expect(f.fetchedAt).toBe(NOW.toISOString());
    expect(f.latitude).toBeCloseTo(55.75, 4);
    expect(f.longitude).toBeCloseTo(37.6, 4);
    expect(Number.isFinite(f.elevationM)).toBe(true);
    // past_days=1 and forecast_days=4 from today's GMT midnight: 5 × 24 hours.
    expect(f.hours).toHaveLength(120);
    expect(f.hours[0].at).toBe('2025-12-09T00:00:00.000Z');
    expect(Date.parse(f.hours.at(-1)!.at) - NOW.getTime()).toBeGreaterThanOrEqual(72 * 3_600_000);
    for (let i = 1; i < f.hours.length; i++) {
      expect(Date.parse(f.hours[i].at) - Date.parse(f.hours[i - 1].at)).toBe(3_600_000);
    }
    for (const h of f.hours) {
      expect(h.at.endsWith('Z')).toBe(true);
      expect(h.dewPointC).toBeLessThan(h.tempC);
      expect(h.cloudFraction).toBeGreaterThanOrEqual(0);
      expect(h.cloudFraction).toBeLessThanOrEqual(1);
      expect(h.windMps).toBeGreaterThanOrEqual(0);
    }
  });

  it('labels a server without the fake header as remote, and honours an explicit source', async () => {
    const body = JSON.stringify(fakeForecastResponse({ ...SITE, timeformat: 'unixtime', wind_speed_unit: 'ms' }, { now: NOW }));
    const f = await fetchForecast({ baseUrl: BASE, ...SITE, fetchImpl: bodyFetch(200, body) });
    expect(f.source).toBe('remote');
    const g = await fetchForecast({ baseUrl: BASE, ...SITE, fetchImpl: bodyFetch(200, body), source: 'fake' });
    expect(g.source).toBe('fake');
  });

  it('error500 fault → ForecastError http with status 500', async () => {
    const e = await expectKind(
      fetchForecast({ baseUrl: BASE, ...SITE, fetchImpl: createFakeFetch({ now: NOW, fault: 'error500' }) }),
      'http',
    );
    expect(e.status).toBe(500);
  });

  it('malformed fault → ForecastError malformed (zod rejects the uneven arrays)', async () => {
    const e = await expectKind(
      fetchForecast({ baseUrl: BASE, ...SITE, fetchImpl: createFakeFetch({ now: NOW, fault: 'malformed' }) }),
      'malformed',
    );
    expect(e.message).toMatch(/temperature_2m/);
  });

  it('slow fault with a short timeout → ForecastError timeout, promptly', async () => {
    const started = Date.now();
    await expectKind(
      fetchForecast({
        baseUrl: BASE,
        ...SITE,
        timeoutMs: 100,
        fetchImpl: createFakeFetch({ now: NOW, fault: 'slow', slowMs: 5000 }),
      }),
      'timeout',
    );
    expect(Date.now() - started).toBeLessThan(2000);
  });

  it('slow fault shorter than the timeout still answers', async () => {
    const f = await fetchForecast({
      baseUrl: BASE,
      ...SITE,
      timeoutMs: 3000,
      fetchImpl: createFakeFetch({ now: NOW, fault: 'slow', slowMs: 30 }),
    });
    expect(f.hours.length).toBeGreaterThan(0);
  });

  it('a fault in the base URL query reaches the fake', async () => {
    await expectKind(
      fetchForecast({ baseUrl: `${BASE}?fault=error500`, ...SITE, fetchImpl: createFakeFetch({ now: NOW }) }),
      'http',
    );
  });

  it('a refused request (HTTP 400) carries the service reason', async () => {
    const e = await expectKind(
      fetchForecast({
        baseUrl: `${BASE}?scenario=no-such-scenario`,
        ...SITE,
        fetchImpl: createFakeFetch({ now: NOW }),
      }),
      'http',
    );
    expect(e.status).toBe(400);
    expect(e.message).toMatch(/no-such-scenario/);
  });

  it('a fetch that throws → ForecastError network', async () => {
    const failing: typeof fetch = async () => {
      throw new TypeError('fetch failed');
    };
    await expectKind(fetchForecast({ baseUrl: BASE, ...SITE, fetchImpl: failing }), 'network');
  });

  it('a body that is not JSON → ForecastError malformed', async () => {
    await expectKind(fetchForecast({ baseUrl: BASE, ...SITE, fetchImpl: bodyFetch(200, '{"latitude": 55.7') }), 'malformed');
  });
});

describe('parseForecastResponse (zod validation)', () => {
  const good = () =>
    fakeForecastResponse({ ...SITE, timeformat: 'unixtime', wind_speed_unit: 'ms', forecast_days: 1 }, { now: NOW });

  it('accepts the fake answer', () => {
    expect(parseForecastResponse(good(), META).hours).toHaveLength(24);
  });

  it('rejects arrays of unequal length', () => {
    const r = good();
    r.hourly!.dew_point_2m = r.hourly!.dew_point_2m!.slice(1);
    expect(() => parseForecastResponse(r, META)).toThrow(/dew_point_2m has 23 values but time has 24/);
  });

  it('rejects non-numbers, missing fields and unknown units', () => {
    const withString = JSON.parse(JSON.stringify(good()));
    withString.hourly.temperature_2m[3] = '−5';
    const noHourly = { ...good(), hourly: undefined };
    const fahrenheitless = good();
    fahrenheitless.hourly_units!.temperature_2m = 'K';
    for (const bad of [withString, noHourly, fahrenheitless, null, [], 'x']) {
      let err: unknown;
      try {
        parseForecastResponse(bad, META);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(ForecastError);
      expect((err as ForecastError).kind).toBe('malformed');
    }
  });

  it('rejects a time axis that goes backwards', () => {
    const r = good();
    const t = r.hourly!.time as number[];
    [t[4], t[5]] = [t[5], t[4]];
    expect(() => parseForecastResponse(r, META)).toThrow(/strictly increasing/);
  });

  it('drops hours with null values instead of inventing them', () => {
    const r = good();
    r.hourly!.temperature_2m![5] = null;
    r.hourly!.cloud_cover![9] = null;
    const f = parseForecastResponse(r, META);
    expect(f.hours).toHaveLength(22);
  });

  it('reads iso8601 local times, km/h and °F the same as unixtime, m/s and °C', () => {
    const query = { ...SITE, forecast_days: 2, timezone: 'Europe/Moscow' };
    const si = parseForecastResponse(
      fakeForecastResponse({ ...query, timeformat: 'unixtime', wind_speed_unit: 'ms' }, { now: NOW }),
      META,
    );
    const other = parseForecastResponse(
      fakeForecastResponse(
        { ...query, timeformat: 'iso8601', wind_speed_unit: 'kmh', temperature_unit: 'fahrenheit' },
        { now: NOW },
      ),
      META,
    );
    expect(other.hours.map((h) => h.at)).toEqual(si.hours.map((h) => h.at));
    // Series start at local midnight: 00:00 in UTC+3 is 21:00 UTC the day before.
    expect(si.hours[0].at).toBe('2025-12-09T21:00:00.000Z');
    other.hours.forEach((h, i) => {
      // 0.1 °F and 0.1 km/h rounding in the answer.
      expect(h.tempC).toBeCloseTo(si.hours[i].tempC, 1);
      expect(Math.abs(h.windMps - si.hours[i].windMps)).toBeLessThan(0.1);
    });
  });
});
