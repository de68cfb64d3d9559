'use client';
// The airfield page's weather part: forecast state and refresh, tonight's low, sun times, the 48 h
// chart of outside and shelter air (soak model), and the shelters table. Kept fresh with SWR.
import Link from 'next/link';
import { useMemo, useState } from 'react';
import useSWR from 'swr';
import { Button, ButtonLink, Card, EmptyState, Notice } from '@/components/ui/primitives';
import { TemperatureChart, type ChartBand, type ChartSeries } from '@/components/charts/TemperatureChart';
import { fetcher, sendJson } from '@/lib/client/fetcher';
import { formatAge, formatDay, formatDayTime, formatTime, zoneLabel } from '@/lib/time';
import { SHELTER_KIND_LABEL } from '@/lib/validation/airfields';
import type { AirfieldRow, ShelterRow } from '@/lib/views/airfields';
import type { ForecastView, SunDayView } from '@/lib/views/forecasts';
import { formatNumber, formatTemp, type TempUnit } from './format';
import { RemoveButton } from './RemoveButton';
import { ShelterKindIcon } from './ShelterKindIcon';
import { SortHeader, TableCard, TableScroll, theadClass, useSorted } from '@/components/ui/sortable';

const SHELTER_COLOURS = ['#2b769b', '#7c3aed', '#0d9488', '#c026d3', '#65a30d', '#0369a1'];
const HEAT_COLOUR = '#e34608';

interface Props {
  airfield: AirfieldRow;
  initial: ForecastView;
  unit: TempUnit;
  canEdit: boolean;
}

export function AirfieldOutlook({ airfield, initial, unit, canEdit }: Props) {
  const key = `/api/airfields/${airfield.id}/forecast`;
  const { data, mutate, isValidating } = useSWR<{ forecast: ForecastView }>(key, fetcher, {
    fallbackData: { forecast: initial },
    refreshInterval: 10 * 60_000,
  });
  const view = data?.forecast ?? initial;
  const [refreshing, setRefreshing] = useState(false);
  const [status, setStatus] = useState('');

  async function refresh() {
    setRefreshing(true);
    setStatus('Fetching a new forecast…');
    const r = await sendJson<{ forecast: ForecastView }>(key, 'POST');
    setRefreshing(false);
    if (!r.ok) {
      setStatus(r.message);
      return;
    }
    await mutate(r.data, { revalidate: false });
    setStatus(r.data.forecast.status === 'fresh' ? 'Forecast updated.' : 'The forecast service did not deliver; the last forecast stays in use.');
  }

  const colours = useMemo(() => {
    const m = new Map<number, string>();
    let i = 0;
    for (const s of airfield.shelters) {
      if (s.kind === 'tie-down') continue;
      m.set(s.id, s.kind === 'heated-hangar' ? HEAT_COLOUR : SHELTER_COLOURS[i++ % SHELTER_COLOURS.length]);
    }
    return m;
  }, [airfield.shelters]);

  const lowByShelter = new Map(view.chart?.shelters.map((c) => [c.shelterId, c.tonightLowC]) ?? []);

  return (
    <div className="space-y-5">
      <ForecastBar view={view} refreshing={refreshing || isValidating} onRefresh={refresh} status={status} />

      <div className="grid gap-5 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <Card aria-labelledby="chart-h" className="min-w-0">
          <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
            <h2 id="chart-h" className="text-base font-semibold text-slate-900 dark:text-white">Next 48 hours</h2>
            <p className="text-xs text-slate-500 dark:text-slate-400">Local time, {zoneLabel(view.timeZone, Date.parse(view.now))}</p>
          </div>
          {view.chart ? (
            <>
              <TemperatureChart
                atMs={view.chart.atMs}
                series={chartSeries(view, colours)}
                bands={nightBands(view.sun)}
                nowMs={Date.parse(view.now)}
                timeZone={view.timeZone}
                unit={unit}
                label={`Outside air and shelter air at ${airfield.name}`}
              />
              <p className="mt-3 text-xs text-slate-500 dark:text-slate-400">
                Shelter air from Thawline&rsquo;s soak model: the shelter&rsquo;s thermal lag, sun on the roof through the forecast cloud, a heated hangar&rsquo;s set-point.
                {airfield.shelters.some((s) => s.kind === 'tie-down') ? ' Open tie-downs sit in the outside air.' : ''} Estimates, not measurements.
              </p>
            </>
          ) : (
            <EmptyState title="No forecast to draw yet">The chart appears as soon as a forecast has been fetched for this airfield.</EmptyState>
          )}
        </Card>

        <div className="space-y-5">
          <TonightCard view={view} unit={unit} shelters={airfield.shelters} lowByShelter={lowByShelter} />
          <SunCard view={view} />
        </div>
      </div>

      <TableCard aria-labelledby="shelters-h">
        <div className="flex flex-wrap items-center justify-between gap-2 px-4 pb-2 pt-4 sm:px-5">
          <h2 id="shelters-h" className="text-base font-semibold text-slate-900 dark:text-white">Shelters</h2>
          {canEdit ? <ButtonLink href={`/airfields/${airfield.id}/shelters/new`} variant="secondary">Add shelter</ButtonLink> : null}
        </div>
        {airfield.shelters.length ? (
          <ShelterTable airfield={airfield} unit={unit} canEdit={canEdit} colours={colours} lowByShelter={lowByShelter} />
        ) : (
          <div className="p-4 sm:p-5">
            <EmptyState
              title="No shelters yet"
              action={canEdit ? <ButtonLink href={`/airfields/${airfield.id}/shelters/new`}>Add the first shelter</ButtonLink> : null}
            >
              Heated or unheated hangars, T-hangars and open tie-down lines: each cools its aircraft in its own way.
            </EmptyState>
          </div>
        )}
      </TableCard>
    </div>
  );
}

function chartSeries(view: ForecastView, colours: Map<number, string>): ChartSeries[] {
  const chart = view.chart!;
  const out: ChartSeries[] = [{ id: 'outside', label: 'Outside air', values: chart.outsideC, color: 'currentColor', width: 2.5 }];
  for (const c of chart.shelters) {
    if (c.kind === 'tie-down') continue;
    out.push({ id: `s${c.shelterId}`, label: c.name, values: c.airC, color: colours.get(c.shelterId) ?? SHELTER_COLOURS[0], width: 2, dash: c.kind === 't-hangar' ? '6 3' : undefined });
  }
  return out;
}

/** Night (civil dusk to civil dawn) and civil twilight bands from the sun days. */
function nightBands(days: SunDayView[]): ChartBand[] {
  const ms = (s: string | null) => (s ? Date.parse(s) : null);
  const bands: ChartBand[] = [];
  for (let i = 0; i < days.length; i++) {
    const d = days[i];
    const dawn = ms(d.civilDawn);
    const rise = ms(d.sunrise);
    const set = ms(d.sunset);
    const dusk = ms(d.civilDusk);
    if (i === 0 && dawn !== null) bands.push({ fromMs: -Infinity, toMs: dawn, kind: 'night' });
    if (dawn !== null && rise !== null) bands.push({ fromMs: dawn, toMs: rise, kind: 'twilight' });
    if (set !== null && dusk !== null) bands.push({ fromMs: set, toMs: dusk, kind: 'twilight' });
    const nextDawn = ms(days[i + 1]?.civilDawn ?? null);
    if (dusk !== null) bands.push({ fromMs: dusk, toMs: nextDawn ?? Infinity, kind: 'night' });
    if (d.polar === 'night' && rise === null) {
      const start = Date.parse(`${d.date}T00:00:00Z`) - 12 * 3_600_000;
      bands.push({ fromMs: start, toMs: start + 48 * 3_600_000, kind: 'night' });
    }
  }
  return bands;
}

function ForecastBar({ view, refreshing, onRefresh, status }: { view: ForecastView; refreshing: boolean; onRefresh: () => void; status: string }) {
  const source = view.source === 'fake' ? 'demo forecast from the built-in fake service' : view.source === 'remote' ? 'forecast service' : null;
  const button = (
    <Button variant="secondary" onClick={onRefresh} disabled={refreshing} className="shrink-0">
      <svg viewBox="0 0 24 24" className={`h-4 w-4 ${refreshing ? 'animate-spin' : ''}`} fill="none" stroke="currentColor" strokeWidth={2} strokeLinecap="round" aria-hidden="true">
        <path d="M20 11a8 8 0 1 0-2.3 5.7M20 4v7h-7" />
      </svg>
      {refreshing ? 'Refreshing…' : 'Refresh forecast'}
    </Button>
  );
  const live = (
    <p role="status" aria-live="polite" className="text-sm text-slate-600 dark:text-slate-400">
      {status}
    </p>
  );
  if (view.status === 'fresh') {
    return (
      <div className="flex flex-col gap-2 rounded-2xl border border-slate-200 bg-white px-4 py-3 dark:border-slate-800 dark:bg-slate-900 sm:flex-row sm:items-center sm:justify-between">
        <div>
          <p className="text-sm text-slate-700 dark:text-slate-300">
            <span className="mr-2 inline-block h-2 w-2 rounded-full bg-teal-600" aria-hidden="true" />
            Forecast fetched <strong className="font-semibold">{formatAge(view.ageMinutes ?? 0) === 'just now' ? 'just now' : `${formatAge(view.ageMinutes ?? 0)} ago`}</strong>
            {source ? <span className="text-slate-500"> · {source}</span> : null}
          </p>
          {live}
        </div>
        {button}
      </div>
    );
  }
  return (
    <div className="space-y-2">
      <Notice tone="caution" title={view.status === 'stale' ? `Forecast ${formatAge(view.ageMinutes ?? 0)} old` : 'No forecast yet'}>
        <p>
          {view.status === 'stale'
            ? `Showing the last forecast, fetched ${view.fetchedAt ? formatDayTime(Date.parse(view.fetchedAt), view.timeZone) : ''}. `
            : 'Thawline has no forecast for this airfield yet. '}
          {view.error ? `${view.error.message} ` : ''}
          {view.error ? 'Thawline tries again by itself in a few minutes; you can also refresh now.' : 'Refresh to fetch a new one.'}
        </p>
        <div className="mt-3 flex flex-wrap items-center gap-3">
          {button}
          {live}
        </div>
      </Notice>
    </div>
  );
}

function TonightCard({ view, unit, shelters, lowByShelter }: { view: ForecastView; unit: TempUnit; shelters: ShelterRow[]; lowByShelter: Map<number, number | null> }) {
  const low = view.tonight.low;
  const from = Date.parse(view.tonight.from);
  const to = Date.parse(view.tonight.to);
  const coldest = shelters
    .filter((s) => s.kind !== 'tie-down' && lowByShelter.get(s.id) !== null && lowByShelter.get(s.id) !== undefined)
    .sort((a, b) => lowByShelter.get(a.id)! - lowByShelter.get(b.id)!)[0];
  return (
    <Card aria-labelledby="tonight-h">
      <h2 id="tonight-h" className="text-base font-semibold text-slate-900 dark:text-white">Tonight</h2>
      <p className="text-xs text-slate-500 dark:text-slate-400">
        {formatDay(from, view.timeZone)} {formatTime(from, view.timeZone)} – {formatDayTime(to, view.timeZone)}
      </p>
      <div className="mt-3 flex items-end gap-3">
        <p className="text-4xl font-semibold tabular-nums tracking-tight text-slate-900 dark:text-white">{low ? formatTemp(low.tempC, unit) : '—'}</p>
        <p className="pb-1 text-sm text-slate-600 dark:text-slate-400">{low ? <>outside low<br />at {formatDayTime(Date.parse(low.at), view.timeZone)}</> : 'no forecast'}</p>
      </div>
      {coldest ? (
        <p className="mt-3 border-t border-slate-200 pt-3 text-sm text-slate-700 dark:border-slate-800 dark:text-slate-300">
          Coldest shelter air: <strong className="font-semibold">{formatTemp(lowByShelter.get(coldest.id)!, unit)}</strong> in {coldest.name}
        </p>
      ) : null}
    </Card>
  );
}

function SunCard({ view }: { view: ForecastView }) {
  const nowMs = Date.parse(view.now);
  const days = view.sun.slice(0, 3);
  const t = (s: string | null) => (s ? formatTime(Date.parse(s), view.timeZone) : '—');
  return (
    <Card aria-labelledby="sun-h">
      <h2 id="sun-h" className="text-base font-semibold text-slate-900 dark:text-white">Sun</h2>
      <table className="mt-2 w-full text-sm tabular-nums">
        <caption className="sr-only">Civil dawn, sunrise, sunset and civil dusk, local time</caption>
        <thead>
          <tr className="text-left text-[11px] uppercase tracking-wide text-slate-500">
            <th scope="col" className="py-1 font-medium">Day</th>
            <th scope="col" className="py-1 font-medium" title="Civil dawn: sun 6° below the horizon">Dawn</th>
            <th scope="col" className="py-1 font-medium">Rise</th>
            <th scope="col" className="py-1 font-medium">Set</th>
            <th scope="col" className="py-1 font-medium" title="Civil dusk: sun 6° below the horizon">Dusk</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
          {days.map((d) => {
            const noon = Date.parse(`${d.date}T12:00:00Z`);
            return (
              <tr key={d.date}>
                <th scope="row" className="py-1.5 text-left font-medium text-slate-800 dark:text-slate-200">
                  {formatDay(noon, 'UTC').split(' ').slice(0, 2).join(' ')}
                </th>
                {d.polar ? (
                  <td colSpan={4} className="py-1.5 text-slate-600 dark:text-slate-400">{d.polar === 'night' ? 'Polar night: no sunrise' : 'Sun up all day'}</td>
                ) : (
                  <>
                    <td className="py-1.5 text-slate-500">{t(d.civilDawn)}</td>
                    <td className="py-1.5 font-medium">{t(d.sunrise)}</td>
                    <td className="py-1.5 font-medium">{t(d.sunset)}</td>
                    <td className="py-1.5 text-slate-500">{t(d.civilDusk)}</td>
                  </>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-slate-500 dark:text-slate-400">Dawn and dusk are civil twilight (sun 6° below the horizon). Times in {zoneLabel(view.timeZone, nowMs)}.</p>
    </Card>
  );
}

function ShelterActions({ airfieldId, s }: { airfieldId: number; s: ShelterRow }) {
  return (
    <>
      <Link href={`/airfields/${airfieldId}/shelters/${s.id}/edit`} className="inline-flex min-h-10 items-center rounded-lg px-3 text-sm font-semibold text-ice-700 hover:bg-ice-50 dark:text-ice-300 dark:hover:bg-slate-800">
        Edit<span className="sr-only"> {s.name}</span>
      </Link>
      <RemoveButton url={`/api/airfields/${airfieldId}/shelters/${s.id}`} name={s.name} aircraftCount={s.aircraftCount} compact />
    </>
  );
}

type Col = 'name' | 'kind' | 'tau' | 'aircraft' | 'low';

function ShelterTable({ airfield, unit, canEdit, colours, lowByShelter }: { airfield: AirfieldRow; unit: TempUnit; canEdit: boolean; colours: Map<number, string>; lowByShelter: Map<number, number | null> }) {
  const keys: Record<Col, (s: ShelterRow) => string | number | null> = {
    name: (s) => s.name,
    kind: (s) => SHELTER_KIND_LABEL[s.kind],
    tau: (s) => s.timeConstantH,
    aircraft: (s) => s.aircraftCount,
    low: (s) => lowByShelter.get(s.id) ?? null,
  };
  const { sorted, sort, toggle } = useSorted<ShelterRow, Col>(airfield.shelters, keys, { by: 'name' });
  return (
    <TableScroll>
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Shelters at {airfield.name}; select a column heading to sort</caption>
        <thead className={theadClass}>
          <tr>
            <SortHeader col="name" label="Shelter" sort={sort} onSort={toggle} className="pl-3" />
            <SortHeader col="kind" label="Kind" sort={sort} onSort={toggle} className="hidden sm:table-cell" />
            <SortHeader col="tau" label="Cools over" sort={sort} onSort={toggle} align="right" className="hidden sm:table-cell" />
            <SortHeader col="aircraft" label="Aircraft" sort={sort} onSort={toggle} align="right" />
            <SortHeader col="low" label="Air low tonight" sort={sort} onSort={toggle} align="right" />
            {canEdit ? <th scope="col" className="hidden px-3 py-3 sm:table-cell"><span className="sr-only">Actions</span></th> : null}
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-200 dark:divide-slate-800">
          {sorted.map((s) => (
            <tr key={s.id}>
              <td className="py-3 pl-5 pr-3">
                <div className="flex items-center gap-2.5">
                  <ShelterKindIcon kind={s.kind} />
                  <div>
                    <p className="font-medium text-slate-900 dark:text-white">{s.name}</p>
                    <p className="text-xs text-slate-500 sm:hidden">{SHELTER_KIND_LABEL[s.kind]}</p>
                    {s.kind === 'heated-hangar' && s.setpointC !== null ? (
                      <p className="text-xs text-ember-700 dark:text-ember-300">
                        Heated to {formatTemp(s.setpointC, unit, 0)} with {formatNumber((s.heatingPowerW ?? 0) / 1000)} kW
                        {(() => {
                          // Say so when tonight's curve sags below the setting: the heating cannot hold it.
                          const low = lowByShelter.get(s.id);
                          return low !== null && low !== undefined && low < s.setpointC - 0.5 ? `; too weak tonight, down to ${formatTemp(low, unit, 0)}` : '';
                        })()}
                      </p>
                    ) : null}
                    {canEdit ? <div className="-ml-3 mt-1 flex flex-wrap sm:hidden"><ShelterActions airfieldId={airfield.id} s={s} /></div> : null}
                  </div>
                </div>
              </td>
              <td className="hidden px-4 py-3 sm:table-cell">
                <span className="inline-flex items-center gap-2">
                  {colours.has(s.id) ? <span className="inline-block h-0.5 w-4 rounded" style={{ background: colours.get(s.id) }} aria-hidden="true" /> : null}
                  {SHELTER_KIND_LABEL[s.kind]}
                </span>
              </td>
              <td className="hidden px-4 py-3 text-right tabular-nums sm:table-cell" title="How quickly the shelter air follows the outside: about two-thirds of a change outside reaches the air in this time (its time constant)">{s.timeConstantH === null ? '—' : `${formatNumber(s.timeConstantH)} h`}</td>
              <td className="px-4 py-3 text-right tabular-nums">{s.aircraftCount}</td>
              <td className="px-4 py-3 text-right font-semibold tabular-nums text-slate-900 dark:text-white">{formatTemp(lowByShelter.get(s.id), unit)}</td>
              {canEdit ? (
                <td className="hidden whitespace-nowrap px-3 py-2 text-right sm:table-cell">
                  <ShelterActions airfieldId={airfield.id} s={s} />
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </TableScroll>
  );
}
