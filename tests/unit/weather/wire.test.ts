// The wire format: the fake served by a real HTTP server on loopback, fetched by the client with real fetch.
// Request parameters, response fields and units follow Open-Meteo's /v1/forecast API docs (published: its API docs).
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fakeForecastHttp, type Fault } from '@/lib/weather/fake';
import { fetchForecast, ForecastError } from '@/lib/weather/openMeteo';

const NOW = new Date('2025-12-10T15:30:00Z');
let server: http.Server;
let base: string;
let serverFault: Fault = 'none';

beforeAll(async () => {
  server = http.createServer((req, res) => {
    const ac = new AbortController();
    res.on('close', () => {
      if (!res.writableFinished) ac.abort();
    });
    fakeForecastHttp(new URL(req.url ?? '/', 'http://127.0.0.1'), {
      now: NOW,
      fault: serverFault,
      slowMs: 5000,
      signal: ac.signal,
    }).then(
      (r) => {
        res.writeHead(r.status, r.headers);
        res.end(r.body);
      },
      () => res.destroy(),
    );
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/fake-weather`;
});

afterAll(async () => {
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
});

describe('fake over real HTTP', () => {
  it('serves Open-Meteo JSON that a plain GET can read', async () => {
    serverFault = 'none';
    const res = await fetch(`${base}/v1/forecast?latitude=55.75&longitude=37.6&hourly=temperature_2m,cloud_cover&timeformat=unixtime`);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^application\/json/);
    const j = await res.json();
    expect(j).toMatchObject({ latitude: 55.75, longitude: 37.6, utc_offset_seconds: 0, timezone: 'GMT' });
    expect(j.hourly_units).toEqual({ time: 'unixtime', temperature_2m: '°C', cloud_cover: '%' });
    expect(j.hourly.time).toHaveLength(168);
  });

  it('the client fetches and converts it with the global fetch', async () => {
    serverFault = 'none';
    const f = await fetchForecast({ baseUrl: base, latitude: 55.75, longitude: 37.6, hours: 48, now: () => NOW });
    expect(f.source).toBe('fake');
    expect(f.hours).toHaveLength(4 * 24);
    expect(f.hours[0].at).toBe('2025-12-09T00:00:00.000Z');
  });

  it('maps a 500 and a timeout from a real socket', async () => {
    serverFault = 'error500';
    await expect(fetchForecast({ baseUrl: base, latitude: 55.75, longitude: 37.6 })).rejects.toMatchObject({
      kind: 'http',
      status: 500,
    });
    serverFault = 'slow';
    const e = await fetchForecast({ baseUrl: base, latitude: 55.75, longitude: 37.6, timeoutMs: 150 }).catch((x) => x);
    expect(e).toBeInstanceOf(ForecastError);
    expect(e.kind).toBe('timeout');
    serverFault = 'none';
  });

  it('an unreachable port is a network error', async () => {
    const closed = http.createServer();
    await new Promise<void>((resolve) => closed.listen(0, '127.0.0.1', resolve));
    const port = (closed.address() as AddressInfo).port;
    await new Promise((resolve) => closed.close(resolve));
    await expect(
      fetchForecast({ baseUrl: `http://127.0.0.1:${port}`, latitude: 55.75, longitude: 37.6, timeoutMs: 2000 }),
    ).rejects.toMatchObject({ kind: 'network' });
  });
});
