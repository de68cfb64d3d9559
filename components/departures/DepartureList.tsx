'use client';
import Link from 'next/link';
import { useMemo, useState, type ReactNode } from 'react';
import useSWR from 'swr';
import { Card, EmptyState } from '@/components/ui/primitives';
import { useConfirm } from '@/components/ui/ConfirmDialog';
import { SortHeader, theadClass, useSorted } from '@/components/airfields/sortable';
import { fmtPower, fmtTemp, totalPowerW } from '@/components/aircraft/format';
import { fetcher, sendJson } from '@/lib/client/fetcher';
import { addDays, formatDay, formatTime, localDateKey, localDateOf, zoneLabel } from '@/lib/time';
import type { TempUnit } from '@/lib/units';
import type { DepartureRecord } from '@/lib/views/departures';

export const DEPARTURES_KEY = '/api/departures';

type Col = 'when' | 'aircraft' | 'airfield' | 'pilot' | 'ready';
const KEYS: Record<Col, (d: DepartureRecord) => string | number | null> = {
  when: (d) => d.departAtMs,
  aircraft: (d) => d.aircraft.registration,
  airfield: (d) => d.aircraft.airfield?.name ?? null,
  pilot: (d) => d.pilot.name,
  ready: (d) => d.readyC,
};

/** "Today", "Tomorrow" or "Wed 14 Jan", for the departure's local date at its airfield. */
export function dayLabel(d: Pick<DepartureRecord, 'departAtMs' | 'timeZone' | 'localDate'>, nowMs: number): string {
  const today = localDateOf(d.timeZone, nowMs);
  if (d.localDate === localDateKey(today)) return 'Today';
  if (d.localDate === localDateKey(addDays(today, 1))) return 'Tomorrow';
  return formatDay(d.departAtMs, d.timeZone);
}

export interface DepartureListProps {
  initial: DepartureRecord[];
  tempUnit: TempUnit;
  /** The signed-in user (their own departures may be cancelled). */
  selfId: number;
  /** Roles that book for anyone: show the pilot column and let them cancel any departure. */
  manageAll: boolean;
  /** Server time of the first paint ("today", "tomorrow"). */
  nowMs: number;
  /** Extra content per departure (e.g. predicted oil at departure and readiness), from a client component. */
  extra?: (d: DepartureRecord) => ReactNode;
  /** The same from a server component: content keyed by departure id. */
  extraById?: Record<number, ReactNode>;
  /** Heading of the extra column on a desktop. */
  extraLabel?: string;
  /** SWR key (the list refreshes from it); default /api/departures. */
  swrKey?: string;
}

/** Upcoming departures: a sortable dense table on a desktop, cards by day on a phone. */
export function DepartureList({ initial, tempUnit, selfId, manageAll, nowMs, extra, extraById, extraLabel = 'Readiness', swrKey = DEPARTURES_KEY }: DepartureListProps) {
  const { data, mutate } = useSWR<{ departures: DepartureRecord[] }>(swrKey, fetcher, { fallbackData: { departures: initial } });
  const rows = data?.departures ?? initial;
  const { sorted, sort, toggle } = useSorted<DepartureRecord, Col>(rows, KEYS, { by: 'when' });
  const [status, setStatus] = useState('');
  const [busy, setBusy] = useState<number | null>(null);
  const extraOf = (d: DepartureRecord) => (extra ? extra(d) : (extraById?.[d.id] ?? null));
  const hasExtra = Boolean(extra || extraById);

  const byDay = useMemo(() => {
    const groups: { key: string; label: string; items: DepartureRecord[] }[] = [];
    for (const d of [...rows].sort((x, y) => x.departAtMs - y.departAtMs)) {
      const key = d.localDate;
      let g = groups.find((x) => x.key === key);
      if (!g) groups.push((g = { key, label: dayLabel(d, nowMs), items: [] }));
      g.items.push(d);
    }
    return groups;
  }, [rows, nowMs]);

  const mayCancel = (d: DepartureRecord) => manageAll || d.pilot.id === selfId || d.bookedBy.id === selfId;

  const { confirm, dialog } = useConfirm();
  async function cancel(d: DepartureRecord) {
    const when = `${dayLabel(d, nowMs).toLowerCase()} at ${formatTime(d.departAtMs, d.timeZone)}`;
    const ok = await confirm({
      title: `Cancel ${d.aircraft.registration} ${when}?`,
      body: 'The departure and its heat plan are removed; the pilot and operators see it as cancelled.',
      confirmLabel: 'Cancel departure',
      cancelLabel: 'Keep departure',
    });
    if (!ok) return;
    setBusy(d.id);
    const r = await sendJson(`/api/departures/${d.id}`, 'DELETE');
    setBusy(null);
    setStatus(r.ok ? `Cancelled ${d.aircraft.registration} ${when}.` : r.message);
    await mutate();
  }

  if (rows.length === 0) {
    return (
      <>
        <EmptyState title="No departures booked">Book the first flight of a day and Thawline will forecast whether the oil will be warm enough.</EmptyState>
        <p role="status" aria-live="polite" className="sr-only">{status}</p>
      </>
    );
  }

  return (
    <div className="space-y-3">
      {dialog}
      {/* Phone: cards grouped by local day */}
      <div className="space-y-5 md:hidden">
        {byDay.map((g) => (
          <section key={g.key} aria-labelledby={`dep-day-${g.key}`}>
            <h3 id={`dep-day-${g.key}`} className="mb-2 text-sm font-semibold uppercase tracking-wide text-slate-600 dark:text-slate-400">
              {g.label}
              {g.label === 'Today' || g.label === 'Tomorrow' ? <span className="font-normal normal-case"> · {formatDay(g.items[0].departAtMs, g.items[0].timeZone)}</span> : null}
            </h3>
            <ul className="space-y-3">
              {g.items.map((d) => (
                <li key={d.id}>
                  <Card className="p-4">
                    <div className="flex items-start justify-between gap-3">
                      <div>
                        <p className="text-2xl font-semibold tabular-nums text-slate-900 dark:text-white">
                          {formatTime(d.departAtMs, d.timeZone)}
                          <span className="ml-1.5 text-xs font-medium text-slate-500">{zoneLabel(d.timeZone, d.departAtMs)}</span>
                        </p>
                        <Link href={`/aircraft/${d.aircraft.id}`} className="font-semibold tracking-wide text-ice-800 hover:underline dark:text-ice-300">
                          {d.aircraft.registration}
                        </Link>
                        <span className="text-sm text-slate-600 dark:text-slate-400"> · {d.aircraft.airfield?.name ?? 'no airfield'}</span>
                      </div>
                      <ReadyBadge d={d} unit={tempUnit} />
                    </div>
                    <p className="mt-1 text-sm text-slate-600 dark:text-slate-400">
                      {d.aircraft.shelter?.name ?? 'No home shelter'} · <Heat d={d} />
                      {manageAll ? <> · {d.pilot.name}</> : null}
                    </p>
                    {d.notes ? <p className="mt-1 text-sm text-slate-700 dark:text-slate-300">{d.notes}</p> : null}
                    {hasExtra ? <div className="mt-3">{extraOf(d)}</div> : null}
                    {mayCancel(d) ? (
                      <Link href={`/departures/${d.id}/edit`} className="mt-2 inline-flex min-h-11 items-center rounded-lg px-3 text-sm font-semibold text-ice-700 hover:bg-ice-50 dark:text-ice-300 dark:hover:bg-slate-800">
                        Change<span className="sr-only"> {d.aircraft.registration}</span>
                      </Link>
                    ) : null}
                    {mayCancel(d) ? (
                      <button
                        type="button"
                        onClick={() => cancel(d)}
                        disabled={busy === d.id}
                        className="mt-2 min-h-11 rounded-lg px-3 text-sm font-semibold text-red-700 hover:bg-red-50 disabled:opacity-60 dark:text-red-300 dark:hover:bg-red-950"
                      >
                        {busy === d.id ? 'Cancelling…' : 'Cancel departure'}
                        <span className="sr-only"> {d.aircraft.registration}</span>
                      </button>
                    ) : null}
                  </Card>
                </li>
              ))}
            </ul>
          </section>
        ))}
      </div>

      {/* Desktop: a dense sortable table */}
      <div className="hidden rounded-2xl border border-slate-200 bg-white shadow-sm dark:border-slate-800 dark:bg-slate-900 overflow-hidden md:block">
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Upcoming departures; select a column heading to sort</caption>
            <thead className={theadClass}>
              <tr>
                <SortHeader col="when" label="Departure" sort={sort} onSort={toggle} className="pl-3" />
                <SortHeader col="aircraft" label="Aircraft" sort={sort} onSort={toggle} />
                {/* With an extra column the airfield moves under the aircraft until the screen is wide. */}
                <SortHeader col="airfield" label="Airfield" sort={sort} onSort={toggle} className={hasExtra ? 'hidden 2xl:table-cell' : ''} />
                {manageAll ? <SortHeader col="pilot" label="Pilot" sort={sort} onSort={toggle} /> : null}
                <SortHeader col="ready" label="Oil needed" sort={sort} onSort={toggle} align="right" className="text-right" />
                {hasExtra ? <th scope="col" className="px-4 py-1.5 text-xs font-semibold">{extraLabel}</th> : null}
                <th scope="col" className="px-3 py-1.5">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-slate-200 dark:divide-slate-800">
              {sorted.map((d) => (
                <tr key={d.id} className="hover:bg-ice-50/50 dark:hover:bg-slate-800/40">
                  <td className="py-2.5 pl-5 pr-3">
                    <span className="font-semibold tabular-nums text-slate-900 dark:text-white">{formatTime(d.departAtMs, d.timeZone)}</span>
                    <span className="ml-1 text-xs text-slate-500">{zoneLabel(d.timeZone, d.departAtMs)}</span>
                    <div className="text-xs text-slate-600 dark:text-slate-400">{dayLabel(d, nowMs)}</div>
                  </td>
                  <td className="px-4 py-2.5">
                    <Link href={`/aircraft/${d.aircraft.id}`} className="font-semibold tracking-wide text-slate-900 hover:text-ice-700 hover:underline dark:text-white dark:hover:text-ice-300">
                      {d.aircraft.registration}
                    </Link>
                    {hasExtra ? <div className="whitespace-nowrap text-xs text-slate-700 dark:text-slate-300 2xl:hidden">{d.aircraft.airfield?.name ?? '—'}</div> : null}
                    <div className="max-w-[15rem] truncate text-xs text-slate-500">
                      <Heat d={d} />
                      {d.notes ? ` · ${d.notes}` : ''}
                    </div>
                  </td>
                  <td className={`px-4 py-2.5 ${hasExtra ? 'hidden 2xl:table-cell' : ''}`}>
                    <span className="whitespace-nowrap">{d.aircraft.airfield?.name ?? '—'}</span>
                    <div className="max-w-[11rem] truncate text-xs text-slate-500">{d.aircraft.shelter?.name}</div>
                  </td>
                  {manageAll ? <td className="px-4 py-2.5">{d.pilot.name}</td> : null}
                  <td className="px-4 py-2.5 text-right">
                    <ReadyBadge d={d} unit={tempUnit} />
                  </td>
                  {hasExtra ? <td className="min-w-[11rem] px-4 py-2.5">{extraOf(d)}</td> : null}
                  <td className="px-3 py-2.5 text-right">
                    <div className="flex flex-col items-end">
                    {mayCancel(d) ? (
                      <Link href={`/departures/${d.id}/edit`} className="inline-flex min-h-10 items-center rounded-lg px-3 text-sm font-semibold text-ice-700 hover:bg-ice-50 dark:text-ice-300 dark:hover:bg-slate-800">
                        Change<span className="sr-only"> {d.aircraft.registration} {dayLabel(d, nowMs)}</span>
                      </Link>
                    ) : null}
                    {mayCancel(d) ? (
                      <button
                        type="button"
                        onClick={() => cancel(d)}
                        disabled={busy === d.id}
                        className="min-h-10 rounded-lg px-3 text-sm font-semibold text-red-700 hover:bg-red-50 disabled:opacity-60 dark:text-red-300 dark:hover:bg-red-950"
                      >
                        {busy === d.id ? 'Cancelling…' : 'Cancel'}
                        <span className="sr-only"> {d.aircraft.registration} {dayLabel(d, nowMs)}</span>
                      </button>
                    ) : null}
                    </div>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </div>
      <p role="status" aria-live="polite" className="text-sm text-slate-600 dark:text-slate-400">
        {status}
      </p>
    </div>
  );
}

function ReadyBadge({ d, unit }: { d: DepartureRecord; unit: TempUnit }) {
  const raised = d.readyC > d.classReadyC;
  return (
    <span className="inline-flex flex-col items-end">
      <span className="whitespace-nowrap rounded-full bg-ice-50 px-2.5 py-1 text-xs font-semibold tabular-nums text-ice-900 dark:bg-ice-950 dark:text-ice-100" title="Ready temperature: the oil temperature needed at departure">
        oil ≥ {fmtTemp(d.readyC, unit)}
      </span>
      {raised || d.floorC !== null ? (
        <span className="mt-0.5 text-xs text-slate-500">
          {raised ? 'raised' : ''}
          {raised && d.floorC !== null ? ' · ' : ''}
          {d.floorC !== null ? `floor ${fmtTemp(d.floorC, unit)}` : ''}
        </span>
      ) : null}
    </span>
  );
}

function Heat({ d }: { d: DepartureRecord }) {
  const w = totalPowerW(d.aircraft.heaters);
  return w > 0 ? <span className="whitespace-nowrap">{fmtPower(w)} heater</span> : <span className="font-medium text-amber-800 dark:text-amber-300">no heater</span>;
}
