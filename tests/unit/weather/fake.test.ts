// The local fake forecast service: deterministic, seasonal, scenario-driven, Open-Meteo's format.
// Request parameters, response fields and units follow Open-Meteo's /v1/forecast API docs (published: its API docs).
import { describe, expect, it } from 'vitest';
import { fakeForecastHttp, fakeForecastResponse, FakeRequestError, type FakeForecastQuery } from '@/lib/weather/fake';
import { loadScenario, type Scenario } from '@/lib/weather/scenario';

const HOUR_MS = 3_600_000;

function series(q: FakeForecastQuery, now: Date, scenario?: Scenario) {
  const r = fakeForecastResponse({ timeformat: 'unixtime', wind_speed_unit: 'ms', ...q }, { now, scenario });
  const h = r.hourly!;
  return (h.time as number[]).map((t, i) => ({
    ms: t * 1000,
    temp: h.temperature_2m![i]!,
    dew: h.dew_point_2m![i]!,
    wind: h.wind_speed_10m![i]!,
    cloud: h.cloud_cover![i]!,
  }));
}

/** Mean of the nightly minima (18:00–09:00 local solar time) over a 14-day forecast. */
function meanNightLow(latitude: number, longitude: number, now: Date, scenario?: Scenario): number {
  const s = series({ latitude, longitude, forecast_days: 14 }, now, scenario);
  const lows: number[] = [];
  for (let d = 0; d < 13; d++) {
    const solarMidnight = s[0].ms + d * 24 * HOUR_MS + 24 * HOUR_MS - (longitude / 15) * HOUR_MS;
    const night = s.filter((p) => p.ms >= solarMidnight - 6 * HOUR_MS && p.ms <= solarMidnight + 9 * HOUR_MS);
    lows.push(Math.min(...night.map((p) => p.temp)));
  }
  return lows.reduce((a, b) => a + b, 0) / lows.length;
}

describe('fakeForecastResponse: format', () => {
  const now = new Date('2025-12-10T15:30:00Z');

  it('has the Open-Meteo top-level fields, units and parallel hourly arrays', () => {
    const r = fakeForecastResponse(
      new URLSearchParams(
        'latitude=55.75&longitude=37.6&hourly=temperature_2m,dew_point_2m,wind_speed_10m,cloud_cover&timezone=GMT&timeformat=unixtime&wind_speed_unit=ms&forecast_days=2&past_days=1',
      ),
      { now },
    );
    expect(Object.keys(r)).toEqual([
      'latitude',
      'longitude',
      'generationtime_ms',
      'utc_offset_seconds',
      'timezone',
      'timezone_abbreviation',
      'elevation',
      'hourly_units',
      'hourly',
    ]);
    expect(r.utc_offset_seconds).toBe(0);
    expect(r.hourly_units).toEqual({
      time: 'unixtime',
      temperature_2m: '°C',
      dew_point_2m: '°C',
      wind_speed_10m: 'm/s',
      cloud_cover: '%',
    });
    const h = r.hourly!;
    expect(h.time).toHaveLength(72);
    for (const k of ['temperature_2m', 'dew_point_2m', 'wind_speed_10m', 'cloud_cover'] as const) {
      expect(h[k]).toHaveLength(72);
    }
    expect(h.time[0]).toBe(Date.UTC(2025, 11, 9) / 1000);
  });

  it('returns only the variables asked for, in iso8601 local time by default', () => {
    const r = fakeForecastResponse(
      new URLSearchParams('latitude=50&longitude=10&hourly=temperature_2m&hourly=cloud_cover&timezone=Europe/Berlin&forecast_days=1'),
      { now },
    );
    expect(Object.keys(r.hourly!)).toEqual(['time', 'temperature_2m', 'cloud_cover']);
    expect(r.hourly_units!.time).toBe('iso8601');
    expect(r.hourly!.time[0]).toBe('2025-12-10T00:00');
    expect(r.utc_offset_seconds).toBe(3600);
  });

  it('follows a daylight-saving day: 23 local hours on the spring-forward date', () => {
    const s = series(
      { latitude: 50, longitude: 10, timezone: 'Europe/Berlin', start_date: '2026-03-29', end_date: '2026-03-29' },
      new Date('2026-03-20T12:00:00Z'),
    );
    expect(s).toHaveLength(23);
    expect(new Date(s[0].ms).toISOString()).toBe('2026-03-28T23:00:00.000Z');
  });

  it('serves forecast_hours from the current hour', () => {
    const s = series({ latitude: 50, longitude: 10, forecast_hours: 12, past_hours: 2 }, now);
    expect(s).toHaveLength(14);
    expect(new Date(s[0].ms).toISOString()).toBe('2025-12-10T13:00:00.000Z');
  });

  it('refuses what the real service refuses', () => {
    const bad = [
      'longitude=10',
      'latitude=91&longitude=10',
      'latitude=abc&longitude=10',
      'latitude=50&longitude=10&timezone=Mars/Olympus',
      'latitude=50&longitude=10&hourly=snow_depth',
      'latitude=50&longitude=10&forecast_days=17',
      'latitude=50&longitude=10&start_date=2025-12-10',
      'latitude=50&longitude=10&start_date=2025-02-30&end_date=2025-03-01',
      'latitude=50&longitude=10&timeformat=rfc',
    ];
    for (const q of bad) {
      expect(() => fakeForecastResponse(new URLSearchParams(q), { now }), q).toThrow(FakeRequestError);
    }
  });
});

describe('fakeForecastResponse: determinism', () => {
  const now = new Date('2025-12-10T15:30:00Z');
  const q = { latitude: 55.75, longitude: 37.6, forecast_days: 7 };

  it('same location, date and now → byte-identical answers', () => {
    expect(JSON.stringify(fakeForecastResponse(q, { now }))).toBe(JSON.stringify(fakeForecastResponse(q, { now: new Date(now) })));
  });

  it('an hour means the same weather whenever it is asked for', () => {
    const a = series({ ...q, forecast_days: 3 }, now);
    const b = series({ ...q, forecast_days: 3, past_days: 2 }, new Date(now.getTime() + 2 * 24 * HOUR_MS));
    expect(b.slice(0, 72)).toEqual(a);
  });

  it('a different location → a different forecast; a nearby one → similar weather', () => {
    const here = series(q, now).map((p) => p.temp);
    const far = series({ ...q, latitude: 52.1, longitude: 20.9 }, now).map((p) => p.temp);
    const near = series({ ...q, latitude: 55.8, longitude: 37.7 }, now).map((p) => p.temp);
    expect(far).not.toEqual(here);
    expect(near).not.toEqual(here);
    const meanAbs = (a: number[], b: number[]) => a.reduce((s, v, i) => s + Math.abs(v - b[i]), 0) / a.length;
    expect(meanAbs(near, here)).toBeLessThan(meanAbs(far, here));
  });

  it('a higher site is colder by the standard lapse rate, 6.5 K per km (ICAO standard atmosphere)', () => {
    const low = series({ ...q, elevation: 100 }, now).map((p) => p.temp);
    const high = series({ ...q, elevation: 600 }, now).map((p) => p.temp);
    const meanDiff = low.reduce((s, v, i) => s + (v - high[i]), 0) / low.length;
    expect(meanDiff).toBeCloseTo(3.25, 1);
  });

  it('a travelling system reaches sites 300 km apart east to west at different hours', () => {
    const west = series({ ...q, forecast_days: 10 }, now).map((p) => p.temp);
    const east = series({ ...q, longitude: q.longitude + 5, forecast_days: 10 }, now).map((p) => p.temp);
    const coldestHour = (a: number[]) => a.indexOf(Math.min(...a));
    expect(coldestHour(west)).not.toBe(coldestHour(east));
  });

  it('stays physically consistent: dew point below temperature, cloud 0–100 %, wind ≥ 0', () => {
    for (const [lat, lon] of [
      [55.75, 37.6],
      [-33.9, 18.4],
      [0, 0],
      [78, 15],
      [-78, 166],
    ]) {
      for (const p of series({ latitude: lat, longitude: lon, forecast_days: 16 }, now)) {
        expect(p.dew).toBeLessThan(p.temp);
        expect(p.cloud).toBeGreaterThanOrEqual(0);
        expect(p.cloud).toBeLessThanOrEqual(100);
        expect(p.wind).toBeGreaterThanOrEqual(0);
      }
    }
  });
});

describe('fakeForecastResponse: seasons', () => {
  const december = new Date('2025-12-05T12:00:00Z');
  const july = new Date('2025-07-05T12:00:00Z');

  it('December nights at 55° N inland are colder than July nights, about −5 to −15 °C (from memory)', () => {
    const dec = meanNightLow(55.75, 37.6, december);
    const jul = meanNightLow(55.75, 37.6, july);
    expect(dec).toBeLessThan(jul - 10);
    // Inland cold climate at 50–60° N: December night lows around −5 to −15 °C (from memory).
    expect(dec).toBeGreaterThanOrEqual(-15);
    expect(dec).toBeLessThanOrEqual(-5);
  });

  it('the southern hemisphere is mirrored: July nights at 55° S are the cold ones', () => {
    const decSouth = meanNightLow(-55.75, 37.6, december);
    const julSouth = meanNightLow(-55.75, 37.6, july);
    expect(julSouth).toBeLessThan(decSouth - 10);
    // Mirrored by construction: the same season half a year apart lands within the weather's spread.
    expect(Math.abs(julSouth - meanNightLow(55.75, 37.6, december))).toBeLessThan(6);
  });

  it('the daily cycle has its low near sunrise and its high in the afternoon (from memory)', () => {
    // 16 July days at 50° N, 0° E (local solar time equals UTC); sunrise there is near 04:00.
    const s = series({ latitude: 50, longitude: 0, forecast_days: 16 }, july);
    const byHour = Array.from({ length: 24 }, (_, h) => {
      const v = s.filter((p) => new Date(p.ms).getUTCHours() === h).map((p) => p.temp);
      return v.reduce((a, b) => a + b, 0) / v.length;
    });
    const coldest = byHour.indexOf(Math.min(...byHour));
    const warmest = byHour.indexOf(Math.max(...byHour));
    expect(coldest).toBeGreaterThanOrEqual(2);
    expect(coldest).toBeLessThanOrEqual(6);
    expect(warmest).toBeGreaterThanOrEqual(13);
    expect(warmest).toBeLessThanOrEqual(16);
  });
});

describe('fakeForecastResponse: cold-snap scenario', () => {
  const now = new Date('2025-12-10T09:00:00Z');
  const site = { latitude: 55.75, longitude: 37.6, forecast_days: 5 };

  it('lowers the coming nights by about 11 K, with clear skies and light wind', () => {
    const base = series(site, now);
    const snap = series(site, now, loadScenario('cold-snap'));
    // Tonight, 00:00–06:00 local solar time of the next day, is inside the snap at full strength.
    const solarShift = (site.longitude / 15) * HOUR_MS;
    const from = Date.UTC(2025, 11, 11) - solarShift;
    const inNight = (p: { ms: number }) => p.ms >= from && p.ms <= from + 6 * HOUR_MS;
    const baseNight = base.filter(inNight);
    const snapNight = snap.filter(inNight);
    expect(snapNight.length).toBeGreaterThanOrEqual(6);
    const low = (a: { temp: number }[]) => Math.min(...a.map((p) => p.temp));
    expect(low(baseNight) - low(snapNight)).toBeGreaterThan(10);
    expect(low(baseNight) - low(snapNight)).toBeLessThan(12);
    for (const p of snapNight) {
      expect(p.cloud).toBe(10);
      expect(p.wind).toBeCloseTo(1.5, 1);
    }
    // Before the snap (this morning) nothing changes.
    const morning = (p: { ms: number }) => p.ms < now.getTime();
    expect(snap.filter(morning)).toEqual(base.filter(morning));
  });

  it('seasonal.json is the model alone', () => {
    expect(series(site, now, loadScenario('seasonal'))).toEqual(series(site, now));
  });
});

describe('fakeForecastHttp', () => {
  const now = new Date('2025-12-10T15:30:00Z');
  const url = (q: string) => new URL(`http://127.0.0.1/api/fake-weather/v1/forecast?latitude=55.75&longitude=37.6&${q}`);

  it('answers JSON with no-store caching and names itself the fake', async () => {
    const r = await fakeForecastHttp(url('hourly=temperature_2m'), { now });
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/^application\/json/);
    expect(r.headers['cache-control']).toBe('no-store');
    expect(r.headers['x-forecast-source']).toBe('fake');
    expect(JSON.parse(r.body).hourly.temperature_2m).toHaveLength(7 * 24);
  });

  it('takes fault and scenario from the query over the defaults', async () => {
    expect((await fakeForecastHttp(url('fault=error500'), { now })).status).toBe(500);
    expect((await fakeForecastHttp(url('fault=none'), { now, fault: 'error500' })).status).toBe(200);
    expect((await fakeForecastHttp(url('fault=explode'), { now })).status).toBe(400);
    const withSnap = await fakeForecastHttp(url('hourly=temperature_2m'), { now, scenarioName: 'cold-snap' });
    const plain = await fakeForecastHttp(url('hourly=temperature_2m&scenario=seasonal'), { now, scenarioName: 'cold-snap' });
    expect(withSnap.body).not.toBe(plain.body);
  });

  it('gives Open-Meteo-style 400 and 404 bodies', async () => {
    const bad = await fakeForecastHttp(url('timezone=Nowhere/Land'), { now });
    expect(bad.status).toBe(400);
    expect(JSON.parse(bad.body)).toMatchObject({ error: true, reason: expect.stringMatching(/timezone/) });
    const badScenario = await fakeForecastHttp(url('scenario=../../etc/passwd'), { now });
    expect(badScenario.status).toBe(400);
    const elsewhere = await fakeForecastHttp(new URL('http://127.0.0.1/api/fake-weather/v1/archive'), { now });
    expect(elsewhere.status).toBe(404);
  });

  it('malformed fault is still JSON, but with a series cut short', async () => {
    const r = await fakeForecastHttp(url('hourly=temperature_2m,cloud_cover&fault=malformed'), { now });
    expect(r.status).toBe(200);
    const j = JSON.parse(r.body);
    expect(j.hourly.temperature_2m.length).toBeLessThan(j.hourly.time.length);
  });

  it('slow fault waits, and stops waiting when the request is cancelled', async () => {
    const t0 = Date.now();
    const r = await fakeForecastHttp(url('fault=slow'), { now, slowMs: 120 });
    expect(r.status).toBe(200);
    expect(Date.now() - t0).toBeGreaterThanOrEqual(100);
    const ac = new AbortController();
    const pending = fakeForecastHttp(url('fault=slow'), { now, slowMs: 10_000, signal: ac.signal });
    setTimeout(() => ac.abort(), 20);
    await expect(pending).rejects.toMatchObject({ name: 'AbortError' });
  });
});
