import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs } from './helpers';
import { nightLow } from '@/lib/weather/derive';
import { fakeForecastHttp } from '@/lib/weather/fake';

let models: Awaited<ReturnType<typeof freshDatabase>>;
let forecasts: typeof import('@/lib/data/forecasts');
let route: typeof import('@/app/api/airfields/[id]/forecast/route');
let list: typeof import('@/app/api/airfields/route');
let item: typeof import('@/app/api/airfields/[id]/route');
let fakeRoute: typeof import('@/app/api/fake-weather/v1/forecast/route');
let resetEnvCache: () => void;
let kettle: InstanceType<Awaited<ReturnType<typeof freshDatabase>>['Airfield']>;
let server: http.Server;
let serverUrl: string;

const MIN = 60_000;

function setEnv(vars: Record<string, string | undefined>) {
  for (const [k, v] of Object.entries(vars)) {
    if (v === undefined) delete process.env[k];
    else process.env[k] = v;
  }
  resetEnvCache();
}

beforeAll(async () => {
  models = await freshDatabase();
  ({ resetEnvCache } = await import('@/lib/env'));
  // A short timeout so the 'slow' fault (10 s) times out quickly.
  setEnv({ FORECAST_TIMEOUT_MS: '300', FAKE_FORECAST_FAULT: 'none', FORECAST_BASE_URL: undefined, FAKE_FORECAST_SCENARIO: 'cold-snap' });
  forecasts = await import('@/lib/data/forecasts');
  route = await import('@/app/api/airfields/[id]/forecast/route');
  list = await import('@/app/api/airfields/route');
  item = await import('@/app/api/airfields/[id]/route');
  fakeRoute = await import('@/app/api/fake-weather/v1/forecast/route');
  kettle = (await models.Airfield.findOne({ where: { ident: 'XKTL' } }))!;
  // The fake served over loopback HTTP, standing in for a hosted service.
  server = http.createServer(async (req, res) => {
    const r = await fakeForecastHttp(new URL(req.url ?? '/', 'http://127.0.0.1'), { now: new Date(), scenarioName: 'cold-snap' });
    res.writeHead(r.status, r.headers);
    res.end(r.body);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  serverUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/fake-weather`;
});

afterAll(async () => {
  setEnv({ FORECAST_BASE_URL: undefined, FAKE_FORECAST_FAULT: 'none' });
  await new Promise((r) => server?.close(r));
});

async function row(airfieldId = kettle.id) {
  return models.Forecast.findOne({ where: { airfieldId } });
}

describe('the forecast cache against the local fake (in-process)', () => {
  it('a first read fetches, stores and answers a fresh forecast with tonight’s low and 48 h of shelter curves', async () => {
    await signInAs(DEMO.pilot);
    expect(await row()).toBeNull();
    const r = await call(route.GET, { params: { id: String(kettle.id) } });
    expect(r.status).toBe(200);
    const f = r.body.forecast;
    expect(f).toMatchObject({ status: 'fresh', source: 'fake', error: null, timeZone: 'Europe/Helsinki' });
    expect(f.ageMinutes).toBe(0);

    const stored = (await row())!;
    expect(stored.hours.length).toBeGreaterThanOrEqual(72);
    expect(stored.fetchedAt).not.toBeNull();
    // Tonight's low is the stored forecast's low over tonight's window.
    expect(f.tonight.low).toEqual(nightLow(stored.hours, f.tonight.from, f.tonight.to));
    expect(f.tonight.low.tempC).toBeLessThan(15);

    // 48 h every 30 min (plus a night already under way), one curve per shelter.
    const n = f.chart.atMs.length;
    expect(n).toBeGreaterThanOrEqual(97);
    expect(f.chart.atMs[n - 1] - f.chart.atMs[0]).toBeGreaterThanOrEqual(47 * 60 * MIN);
    expect(f.chart.shelters).toHaveLength(3);
    for (const c of f.chart.shelters) {
      expect(c.airC).toHaveLength(n);
      expect(c.airC.every(Number.isFinite)).toBe(true);
    }
    // An open tie-down has no air of its own: its curve is the outside air.
    expect(f.chart.shelters.find((c: { kind: string }) => c.kind === 'tie-down').airC).toEqual(f.chart.outsideC);
    expect(f.sun.length).toBeGreaterThanOrEqual(2);
    expect(Date.parse(f.sun[0].sunrise)).toBeLessThan(Date.parse(f.sun[0].sunset));
  });

  it('is not fetched again within the hour, and is when older than an hour', async () => {
    const first = (await row())!.fetchedAt!.getTime();
    const t30 = new Date(first + 30 * MIN);
    await forecasts.forecastFor({ airfield: kettle, now: t30, refresh: 'if-old' });
    expect((await row())!.fetchedAt!.getTime()).toBe(first);
    const t61 = new Date(first + 61 * MIN);
    expect(forecasts.forecastState(await row(), kettle, t61).status).toBe('stale');
    await forecasts.forecastFor({ airfield: kettle, now: t61, refresh: 'if-old' });
    expect((await row())!.fetchedAt!.getTime()).toBe(t61.getTime());
    expect(forecasts.forecastState(await row(), kettle, t61).status).toBe('fresh');
  });

  it('POST forces a refresh for any role that reads the airfield', async () => {
    await signInAs(DEMO.operator);
    const before = (await row())!.fetchedAt!.getTime();
    const r = await call(route.POST, { method: 'POST', params: { id: String(kettle.id) } });
    expect(r.status).toBe(200);
    expect(r.body.forecast.status).toBe('fresh');
    expect((await row())!.fetchedAt!.getTime()).not.toBe(before);
  });

  it('the map list carries each airfield’s tonight low and forecast state', async () => {
    await signInAs(DEMO.manager);
    const r = await call(list.GET, { url: '/api/airfields?forecast=tonight' });
    expect(r.status).toBe(200);
    for (const a of r.body.airfields) {
      expect(a.forecast.status).toBe('fresh');
      expect(typeof a.tonight.low.tempC).toBe('number');
    }
  });
});

describe('when the service fails, the last forecast is kept and marked stale', () => {
  const faults: [string, string][] = [
    ['error500', 'http'],
    ['malformed', 'malformed'],
    ['slow', 'timeout'],
  ];

  it.each(faults)('fault %s: kept, stale, with its age and the failure', async (fault, kind) => {
    setEnv({ FAKE_FORECAST_FAULT: fault });
    await signInAs(DEMO.pilot);
    const before = (await row())!;
    const r = await call(route.POST, { method: 'POST', params: { id: String(kettle.id) } });
    expect(r.status).toBe(200);
    const f = r.body.forecast;
    expect(f.status).toBe('stale');
    expect(f.error.kind).toBe(kind);
    expect(f.error.message).not.toMatch(/Injected|http:\/\/|at .*\.ts/);
    expect(f.fetchedAt).toBe(before.fetchedAt!.toISOString());
    expect(typeof f.ageMinutes).toBe('number');
    expect(f.chart.shelters).toHaveLength(3);
    const after = (await row())!;
    expect(after.hours).toEqual(before.hours);
    expect(after.lastErrorKind).toBe(kind);
    setEnv({ FAKE_FORECAST_FAULT: 'none' });
  });

  it('after a failure, automatic refreshes pause for a few minutes; a success clears the failure', async () => {
    setEnv({ FAKE_FORECAST_FAULT: 'error500' });
    const base = (await row())!.fetchedAt!.getTime();
    const failedAt = new Date(base + 90 * MIN);
    await forecasts.forecastFor({ airfield: kettle, now: failedAt, refresh: 'if-old' });
    expect((await row())!.lastAttemptAt!.getTime()).toBe(failedAt.getTime());
    setEnv({ FAKE_FORECAST_FAULT: 'none' });
    // Two minutes later: still within the pause, no new attempt.
    await forecasts.forecastFor({ airfield: kettle, now: new Date(failedAt.getTime() + 2 * MIN), refresh: 'if-old' });
    expect((await row())!.lastAttemptAt!.getTime()).toBe(failedAt.getTime());
    // Six minutes later it tries again and succeeds.
    const later = new Date(failedAt.getTime() + 6 * MIN);
    await forecasts.forecastFor({ airfield: kettle, now: later, refresh: 'if-old' });
    const r = (await row())!;
    expect(r.fetchedAt!.getTime()).toBe(later.getTime());
    expect(r.lastErrorKind).toBeNull();
    expect(forecasts.forecastState(r, kettle, later)).toMatchObject({ status: 'fresh', error: null });
  });

  it('an airfield whose first fetch fails answers "missing" with the failure, and nothing crashes', async () => {
    setEnv({ FAKE_FORECAST_FAULT: 'malformed' });
    await signInAs(DEMO.manager);
    const created = await call(list.POST, {
      method: 'POST',
      body: { name: 'Fen Corner', ident: 'XFEN', latitude: 60.4, longitude: 22.3, elevationM: 40, timeZone: 'Europe/Helsinki' },
    });
    const id = created.body.airfield.id;
    const r = await call(route.GET, { params: { id: String(id) } });
    expect(r.status).toBe(200);
    expect(r.body.forecast).toMatchObject({ status: 'missing', chart: null, fetchedAt: null });
    expect(r.body.forecast.error.kind).toBe('malformed');
    expect(r.body.forecast.tonight.low).toBeNull();
    setEnv({ FAKE_FORECAST_FAULT: 'none' });
    const ok = await call(route.POST, { method: 'POST', params: { id: String(id) } });
    expect(ok.body.forecast.status).toBe('fresh');
  });

  it('a moved airfield does not use the old place’s forecast', async () => {
    await signInAs(DEMO.manager);
    const af = (await models.Airfield.findOne({ where: { ident: 'XFEN' } }))!;
    setEnv({ FAKE_FORECAST_FAULT: 'error500' });
    await call(item.PATCH, { method: 'PATCH', params: { id: String(af.id) }, body: { latitude: 60.9 } });
    const r = await call(route.POST, { method: 'POST', params: { id: String(af.id) } });
    expect(r.body.forecast.status).toBe('missing');
    setEnv({ FAKE_FORECAST_FAULT: 'none' });
    const ok = await call(route.POST, { method: 'POST', params: { id: String(af.id) } });
    expect(ok.body.forecast.status).toBe('fresh');
    expect((await row(af.id))!.latitude).toBe(60.9);
  });
});

describe('a configured forecast service over HTTP', () => {
  it('fetches from FORECAST_BASE_URL (here the fake on a loopback port)', async () => {
    setEnv({ FORECAST_BASE_URL: serverUrl });
    await signInAs(DEMO.pilot);
    const r = await call(route.POST, { method: 'POST', params: { id: String(kettle.id) } });
    expect(r.body.forecast).toMatchObject({ status: 'fresh', source: 'fake' });
    setEnv({ FORECAST_BASE_URL: undefined });
  });

  it('an unreachable service keeps the last forecast, stale, with a network failure', async () => {
    const closed = http.createServer();
    await new Promise<void>((resolve) => closed.listen(0, '127.0.0.1', resolve));
    const port = (closed.address() as AddressInfo).port;
    await new Promise((r) => closed.close(r));
    setEnv({ FORECAST_BASE_URL: `http://127.0.0.1:${port}/` });
    await signInAs(DEMO.pilot);
    const r = await call(route.POST, { method: 'POST', params: { id: String(kettle.id) } });
    expect(r.status).toBe(200);
    expect(r.body.forecast).toMatchObject({ status: 'stale' });
    expect(r.body.forecast.error.kind).toBe('network');
    expect(r.body.forecast.chart).not.toBeNull();
    setEnv({ FORECAST_BASE_URL: undefined });
  });
});

describe('the fake served by the app', () => {
  const url = '/api/fake-weather/v1/forecast?latitude=61.52&longitude=23.96&hourly=temperature_2m,dew_point_2m,wind_speed_10m,cloud_cover&timezone=Europe%2FHelsinki&forecast_days=2';

  it('answers in the Open-Meteo /v1/forecast format: parallel hourly arrays with units (its API docs)', async () => {
    const r = await call(fakeRoute.GET, { url });
    expect(r.status).toBe(200);
    expect(r.body.hourly_units.temperature_2m).toBe('°C');
    expect(r.body.hourly.time).toHaveLength(48);
    expect(r.body.hourly.temperature_2m).toHaveLength(48);
    expect(typeof r.body.utc_offset_seconds).toBe('number');
  });

  it('answers a bad request with 400 and the service’s error body', async () => {
    const r = await call(fakeRoute.GET, { url: '/api/fake-weather/v1/forecast?latitude=91&longitude=0' });
    expect(r.status).toBe(400);
    expect(r.body.error).toBe(true);
  });

  it('is switched off (404) when a real service is configured', async () => {
    setEnv({ FORECAST_BASE_URL: 'https://forecast.example.test' });
    expect((await call(fakeRoute.GET, { url })).status).toBe(404);
    setEnv({ FORECAST_BASE_URL: undefined });
  });
});
