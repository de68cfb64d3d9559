import { env } from '@/lib/env';
import { fakeForecastHttp } from '@/lib/weather/fake';

// The local fake of the forecast service, speaking Open-Meteo's /v1/forecast format (public, like
// the service it stands in for). Switched off — 404 — when a real service is configured.
export const dynamic = 'force-dynamic';

export async function GET(req: Request): Promise<Response> {
  const e = env();
  if (e.FORECAST_BASE_URL) {
    return Response.json({ error: true, reason: 'The local fake forecast service is off: a forecast service is configured.' }, { status: 404 });
  }
  try {
    const r = await fakeForecastHttp(new URL(req.url), {
      now: new Date(),
      scenarioName: e.FAKE_FORECAST_SCENARIO,
      fault: e.FAKE_FORECAST_FAULT,
      signal: req.signal,
    });
    return new Response(r.body, { status: r.status, headers: r.headers });
  } catch (err) {
    if ((err as { name?: string }).name === 'AbortError') return new Response(null, { status: 499 });
    console.error('[thawline] fake forecast failed', err);
    return Response.json({ error: true, reason: 'Internal error in the fake forecast service.' }, { status: 500 });
  }
}
