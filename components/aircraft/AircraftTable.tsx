'use client';
import Link from 'next/link';
import { useMemo, useState } from 'react';
import useSWR from 'swr';
import { ButtonLink, Card, EmptyState } from '@/components/ui/primitives';
import { SortHeader, theadClass, useSorted } from '@/components/airfields/sortable';
import { ShelterKindIcon } from '@/components/airfields/ShelterKindIcon';
import { fetcher, sendJson } from '@/lib/client/fetcher';
import type { TempUnit, VolumeUnit } from '@/lib/units';
import type { AircraftRecord } from '@/lib/views/aircraft';
import { SHELTER_KIND_LABEL } from '@/lib/validation/airfields';
import { fmtAt, fmtPower, fmtTemp, fmtVolume, totalPowerW } from './format';

type Col = 'registration' | 'type' | 'engine' | 'oil' | 'home' | 'heat' | 'pilots' | 'shutdown';

const KEYS: Record<Col, (a: AircraftRecord) => string | number | null> = {
  registration: (a) => a.registration,
  type: (a) => a.typeLabel,
  engine: (a) => a.engineClassLabel,
  oil: (a) => a.oilQuantityL,
  home: (a) => (a.shelter ? `${a.airfield?.name ?? ''} ${a.shelter.name}` : null),
  heat: (a) => totalPowerW(a.heaters),
  pilots: (a) => a.pilots.length,
  shutdown: (a) => (a.lastShutdownAt ? Date.parse(a.lastShutdownAt) : null),
};

const linkClass = 'font-semibold tracking-wide text-slate-900 hover:text-ice-700 hover:underline dark:text-white dark:hover:text-ice-300';

/** The fleet: a dense sortable table on a desktop, cards on a phone. */
export function AircraftTable({ initial, tempUnit, volumeUnit, canEdit }: { initial: AircraftRecord[]; tempUnit: TempUnit; volumeUnit: VolumeUnit; canEdit: boolean }) {
  const [showArchived, setShowArchived] = useState(false);
  const [airfield, setAirfield] = useState('');
  const key = `/api/aircraft${showArchived ? '?archived=1' : ''}`;
  const { data, mutate } = useSWR<{ aircraft: AircraftRecord[] }>(key, fetcher, showArchived ? {} : { fallbackData: { aircraft: initial } });
  const all = data?.aircraft ?? (showArchived ? [] : initial);
  const fields = useMemo(() => {
    const m = new Map<number, string>();
    for (const a of all) if (a.airfield) m.set(a.airfield.id, a.airfield.name);
    return [...m.entries()].sort((x, y) => x[1].localeCompare(y[1]));
  }, [all]);
  const rows = useMemo(() => (airfield ? all.filter((a) => String(a.airfield?.id ?? '') === airfield) : all), [all, airfield]);
  const { sorted, sort, toggle } = useSorted<AircraftRecord, Col>(rows, KEYS, { by: 'registration' });
  const [status, setStatus] = useState('');

  async function restore(a: AircraftRecord) {
    const r = await sendJson(`/api/aircraft/${a.id}`, 'PATCH', { archived: false });
    setStatus(r.ok ? `${a.registration} is back in the fleet.` : r.message);
    await mutate();
  }

  if (initial.length === 0 && !showArchived) {
    return (
      <EmptyState title="No aircraft yet" action={canEdit ? <ButtonLink href="/aircraft/new">Add the first aircraft</ButtonLink> : null}>
        {canEdit
          ? 'An aircraft profile has its engine class, oil quantity, home shelter, cover and heaters; Thawline plans its preheat from them.'
          : 'An operator of your organization adds the aircraft and their heaters.'}
      </EmptyState>
    );
  }

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div className="w-full sm:w-64">
          <label htmlFor="ac-airfield" className="block text-sm font-medium text-slate-800 dark:text-slate-200">
            Airfield
          </label>
          <select
            id="ac-airfield"
            value={airfield}
            onChange={(e) => setAirfield(e.target.value)}
            className="mt-1 block min-h-11 w-full rounded-xl border border-slate-300 bg-white px-3 text-base text-slate-900 dark:border-slate-700 dark:bg-slate-950 dark:text-slate-100 sm:text-sm"
          >
            <option value="">All airfields</option>
            {fields.map(([id, name]) => (
              <option key={id} value={id}>{name}</option>
            ))}
          </select>
        </div>
        <p className="text-sm text-slate-600 dark:text-slate-400" aria-live="polite">
          {sorted.length} {sorted.length === 1 ? 'aircraft' : 'aircraft'}
        </p>
      </div>

      {/* Phone: cards */}
      <ul className="space-y-3 md:hidden" aria-label="Aircraft">
        {sorted.map((a) => (
          <li key={a.id}>
            <Card className={`p-4 ${a.archived ? 'opacity-70' : ''}`}>
              <div className="flex items-start justify-between gap-3">
                <div className="min-w-0">
                  <Link href={`/aircraft/${a.id}`} className={`text-lg ${linkClass}`}>
                    {a.registration}
                  </Link>
                  <p className="truncate text-sm text-slate-600 dark:text-slate-400">{a.typeLabel}</p>
                </div>
                <HeatBadge a={a} />
              </div>
              <dl className="mt-3 grid grid-cols-2 gap-x-3 gap-y-2 text-sm">
                <div className="col-span-2">
                  <dt className="text-xs text-slate-500">Home</dt>
                  <dd className="flex items-center gap-1.5 text-slate-800 dark:text-slate-200">
                    <Home a={a} />
                  </dd>
                </div>
                <div>
                  <dt className="text-xs text-slate-500">Oil</dt>
                  <dd className="tabular-nums">{fmtVolume(a.oilQuantityL, volumeUnit)}</dd>
                </div>
                <div>
                  <dt className="text-xs text-slate-500">Last shutdown</dt>
                  <dd className="tabular-nums">{fmtAt(a.lastShutdownAt, a.airfield?.timeZone)}</dd>
                </div>
              </dl>
              {a.archived && canEdit ? (
                <button type="button" onClick={() => restore(a)} className="mt-3 min-h-11 rounded-lg px-3 text-sm font-semibold text-ice-700 hover:bg-ice-50 dark:text-ice-300">
                  Restore<span className="sr-only"> {a.registration}</span>
                </button>
              ) : null}
            </Card>
          </li>
        ))}
      </ul>

      {/* Desktop: a dense table */}
      <div className="hidden rounded-2xl border border-slate-200 bg-white shadow-sm dark:border-slate-800 dark:bg-slate-900 overflow-hidden md:block">
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Aircraft of your organization; select a column heading to sort</caption>
            <thead className={theadClass}>
              <tr>
                <SortHeader col="registration" label="Aircraft" sort={sort} onSort={toggle} className="pl-3" />
                <SortHeader col="engine" label="Engine class" sort={sort} onSort={toggle} className="hidden xl:table-cell" />
                <SortHeader col="oil" label="Oil" sort={sort} onSort={toggle} align="right" className="text-right" />
                <SortHeader col="home" label="Home" sort={sort} onSort={toggle} />
                <SortHeader col="heat" label="Heaters" sort={sort} onSort={toggle} />
                <SortHeader col="pilots" label="Pilots" sort={sort} onSort={toggle} align="right" className="hidden text-right lg:table-cell" />
                <SortHeader col="shutdown" label="Last shutdown" sort={sort} onSort={toggle} />
                {canEdit ? (
                  <th scope="col" className="px-3 py-1.5">
                    <span className="sr-only">Actions</span>
                  </th>
                ) : null}
              </tr>
            </thead>
            <tbody className="divide-y divide-slate-200 dark:divide-slate-800">
              {sorted.map((a) => (
                <tr key={a.id} className={a.archived ? 'bg-slate-50/70 text-slate-500 dark:bg-slate-900/40' : 'hover:bg-ice-50/50 dark:hover:bg-slate-800/40'}>
                  <td className="py-2.5 pl-5 pr-3">
                    <Link href={`/aircraft/${a.id}`} className={linkClass}>
                      {a.registration}
                    </Link>
                    <div className="text-xs text-slate-500">
                      {a.typeLabel}
                      {a.archived ? <span className="ml-2 rounded bg-slate-200 px-1.5 py-0.5 font-semibold text-slate-700 dark:bg-slate-700 dark:text-slate-200">Archived</span> : null}
                    </div>
                  </td>
                  <td className="hidden max-w-[16rem] px-4 py-2.5 text-slate-700 dark:text-slate-300 xl:table-cell">{a.engineClassLabel}</td>
                  <td className="px-4 py-2.5 text-right tabular-nums">{fmtVolume(a.oilQuantityL, volumeUnit)}</td>
                  <td className="px-4 py-2.5">
                    <span className="flex items-center gap-1.5">
                      <Home a={a} />
                    </span>
                  </td>
                  <td className="px-4 py-2.5">
                    <HeatBadge a={a} />
                  </td>
                  <td className="hidden px-4 py-2.5 text-right tabular-nums lg:table-cell">{a.pilots.length}</td>
                  <td className="px-4 py-2.5 tabular-nums">
                    {fmtAt(a.lastShutdownAt, a.airfield?.timeZone)}
                    <div className="text-xs text-slate-500">
                      {a.lastShutdownOilC !== null ? `oil ${fmtTemp(a.lastShutdownOilC, tempUnit)}` : `oil ${fmtTemp(a.classDefaults.shutdownOilC, tempUnit)} (typical)`}
                    </div>
                  </td>
                  {canEdit ? (
                    <td className="px-3 py-2.5 text-right">
                      {a.archived ? (
                        <button type="button" onClick={() => restore(a)} className="min-h-10 rounded-lg px-3 text-sm font-semibold text-ice-700 hover:bg-ice-50 dark:text-ice-300 dark:hover:bg-slate-800">
                          Restore<span className="sr-only"> {a.registration}</span>
                        </button>
                      ) : (
                        <Link href={`/aircraft/${a.id}`} className="inline-flex min-h-10 items-center rounded-lg px-3 text-sm font-semibold text-ice-700 hover:bg-ice-50 dark:text-ice-300 dark:hover:bg-slate-800">
                          Edit<span className="sr-only"> {a.registration}</span>
                        </Link>
                      )}
                    </td>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        {sorted.length === 0 ? <p className="px-5 py-6 text-sm text-slate-600 dark:text-slate-400">No aircraft match.</p> : null}
      </div>

      <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
        <label className="inline-flex min-h-11 items-center gap-2 text-slate-700 dark:text-slate-300">
          <input type="checkbox" className="h-4 w-4 accent-ice-700" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} />
          Show archived aircraft
        </label>
        <p role="status" aria-live="polite" className="text-slate-600 dark:text-slate-400">
          {status}
        </p>
      </div>
    </div>
  );
}

function Home({ a }: { a: AircraftRecord }) {
  if (!a.shelter) return <span className="text-amber-800 dark:text-amber-300">No home shelter</span>;
  return (
    <>
      <span title={SHELTER_KIND_LABEL[a.shelter.kind]} className="text-ice-700 dark:text-ice-300">
        <ShelterKindIcon kind={a.shelter.kind} className="h-4 w-4" />
      </span>
      <span className="sr-only">{SHELTER_KIND_LABEL[a.shelter.kind]}: </span>
      <span className="min-w-0">
        <span className="text-slate-800 dark:text-slate-200">{a.shelter.name}</span>
        {a.airfield ? <span className="block text-xs text-slate-500">{a.airfield.name}</span> : null}
      </span>
    </>
  );
}

/** Total heater power in the warm accent, or a plain "No heater". */
function HeatBadge({ a }: { a: AircraftRecord }) {
  if (!a.heaters.length) {
    return <span className="inline-flex whitespace-nowrap rounded-full bg-slate-100 px-2.5 py-1 text-xs font-semibold text-slate-700 dark:bg-slate-800 dark:text-slate-300">No heater</span>;
  }
  return (
    <span className="inline-flex flex-col">
      <span className="inline-flex w-fit whitespace-nowrap rounded-full bg-ember-50 px-2.5 py-1 text-xs font-semibold text-ember-800 dark:bg-ember-900/40 dark:text-ember-200">
        {fmtPower(totalPowerW(a.heaters))}
      </span>
      <span className="mt-0.5 text-xs text-slate-500">
        {a.heaters.length === 1 ? a.heaters[0].kindLabel : `${a.heaters.length} heaters`}
      </span>
    </span>
  );
}
