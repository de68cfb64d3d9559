'use client';
// The Site map page's live part: the map and the airfield list below it, refreshed through SWR
// (the server's first paint is the fallback; the API refreshes forecasts older than an hour).
import Link from 'next/link';
import useSWR from 'swr';
import { fetcher } from '@/lib/client/fetcher';
import { formatAge, formatDay, formatDayTime } from '@/lib/time';
import { formatTemp, type TempUnit } from '@/components/airfields/format';
import type { AirfieldRow } from '@/lib/views/airfields';
import type { ForecastStateView, TonightSummary } from '@/lib/views/forecasts';
import { MapLegend } from './MapLegend';
import type { Readiness } from './marker';
import { ReadinessBadge } from '@/components/board/ReadinessBadge';
import type { MapAirfield } from './SiteMap';
import { SiteMapLazy } from './SiteMapLazy';

export type AirfieldWithTonight = AirfieldRow & {
  tonight?: TonightSummary;
  forecast?: ForecastStateView;
  /** The next morning's departures here: the worst readiness and counts (null: none booked). */
  morning?: { readiness: Readiness; departures: number; counts: Record<Readiness, number> } | null;
};

export function toMapAirfield(a: AirfieldWithTonight): MapAirfield {
  return {
    id: a.id,
    name: a.name,
    ident: a.ident,
    latitude: a.latitude,
    longitude: a.longitude,
    timeZone: a.timeZone,
    lowC: a.tonight?.low?.tempC ?? null,
    lowAt: a.tonight?.low?.at ?? null,
    forecastStatus: a.forecast?.status ?? 'missing',
    ageMinutes: a.forecast?.ageMinutes ?? null,
    readiness: a.morning?.readiness,
    shelters: a.shelters.map((s) => ({ id: s.id, name: s.name, kind: s.kind, aircraftCount: s.aircraftCount })),
  };
}

interface Props {
  initial: AirfieldWithTonight[];
  unit: TempUnit;
  tileUrl: string;
  tileAttribution: string;
}

export function SiteMapView({ initial, unit, tileUrl, tileAttribution }: Props) {
  const { data, error, isValidating } = useSWR<{ airfields: AirfieldWithTonight[] }>('/api/airfields?forecast=tonight', fetcher, {
    fallbackData: { airfields: initial },
    refreshInterval: 15 * 60_000,
  });
  const airfields = data?.airfields ?? initial;
  const sources = new Set(airfields.map((a) => a.forecast?.source).filter(Boolean));

  return (
    <div className="space-y-6">
      <div className="overflow-hidden rounded-2xl border border-slate-200 shadow-sm dark:border-slate-800">
        <SiteMapLazy airfields={airfields.map(toMapAirfield)} unit={unit} tileUrl={tileUrl} tileAttribution={tileAttribution} legend={<MapLegend showReadiness={airfields.some((a) => a.morning)} />} />
      </div>
      <p role="status" aria-live="polite" className="-mt-3 text-xs text-slate-500 dark:text-slate-400">
        {error ? 'Could not update the forecasts just now; showing what was last known.' : isValidating ? 'Updating tonight’s forecasts…' : ''}
        {sources.has('fake') ? <span className="ml-1 rounded bg-slate-200 px-1.5 py-0.5 font-medium text-slate-700 dark:bg-slate-800 dark:text-slate-300">Demo forecast from the built-in fake service</span> : null}
      </p>

      <section aria-labelledby="map-list-h">
        <h2 id="map-list-h" className="mb-3 text-lg font-semibold text-slate-900 dark:text-white">
          Airfields <span className="text-sm font-normal text-slate-500">({airfields.length})</span>
        </h2>
        <ul className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
          {airfields.map((a) => (
            <li key={a.id}>
              <AirfieldCard a={a} unit={unit} />
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}

const ago = (m: number) => (formatAge(m) === 'just now' ? 'just now' : `${formatAge(m)} ago`);

function AirfieldCard({ a, unit }: { a: AirfieldWithTonight; unit: TempUnit }) {
  const low = a.tonight?.low ?? null;
  const f = a.forecast;
  return (
    <Link
      href={`/airfields/${a.id}`}
      className="group flex min-h-28 items-stretch gap-4 rounded-2xl border border-slate-200 bg-white p-4 shadow-sm transition hover:border-ice-400 hover:shadow dark:border-slate-800 dark:bg-slate-900 dark:hover:border-ice-600"
    >
      <div className="min-w-0 flex-1">
        <p className="flex items-center gap-2">
          <span className="truncate font-semibold text-slate-900 group-hover:text-ice-800 dark:text-white dark:group-hover:text-ice-200">{a.name}</span>
          <span className="rounded-md bg-slate-100 px-1.5 py-0.5 text-[11px] font-semibold tracking-wider text-slate-600 dark:bg-slate-800 dark:text-slate-300">{a.ident}</span>
        </p>
        <p className="mt-1 text-sm text-slate-600 dark:text-slate-400">
          {a.shelters.length} {a.shelters.length === 1 ? 'shelter' : 'shelters'} · {a.aircraftCount} aircraft
        </p>
        {a.morning ? (
          <p className="mt-2 flex flex-wrap items-center gap-2 text-xs text-slate-600 dark:text-slate-400">
            <ReadinessBadge status={a.morning.readiness} />
            {a.morning.departures} {a.morning.departures === 1 ? 'departure' : 'departures'} in the morning
          </p>
        ) : null}
        <p className="mt-2 text-xs text-slate-500 dark:text-slate-400">
          {f?.status === 'missing' || !f ? (
            'No forecast yet'
          ) : f.status === 'stale' ? (
            <span className="font-medium text-amber-800 dark:text-amber-300">Forecast {formatAge(f.ageMinutes ?? 0)} old</span>
          ) : (
            `Forecast fetched ${ago(f.ageMinutes ?? 0)}`
          )}
        </p>
      </div>
      <div className="flex flex-col items-end justify-center text-right">
        <span className="text-[11px] font-medium uppercase tracking-wider text-slate-500">
          {a.tonight ? `Low, night of ${formatDay(Date.parse(a.tonight.from), a.timeZone)}` : 'Low tonight'}
        </span>
        <span className="text-2xl font-semibold tabular-nums text-slate-900 dark:text-white">{low ? formatTemp(low.tempC, unit, 0) : '—'}</span>
        {low ? <span className="text-xs text-slate-500">{formatDayTime(Date.parse(low.at), a.timeZone)}</span> : null}
      </div>
    </Link>
  );
}
