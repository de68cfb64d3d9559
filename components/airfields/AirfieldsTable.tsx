'use client';
import Link from 'next/link';
import { useState } from 'react';
import useSWR from 'swr';
import { ButtonLink, EmptyState } from '@/components/ui/primitives';
import { fetcher, sendJson } from '@/lib/client/fetcher';
import { formatAge, formatTime } from '@/lib/time';
import type { AirfieldWithTonight } from '@/components/map/SiteMapView';
import { SHELTER_KIND_LABEL, SHELTER_KINDS } from '@/lib/validation/airfields';
import { formatTemp, type TempUnit } from './format';
import { ShelterKindIcon } from './ShelterKindIcon';
import { SortHeader, TableCard, TableScroll, theadClass, useSorted } from '@/components/ui/sortable';

type Col = 'name' | 'ident' | 'shelters' | 'aircraft' | 'low' | 'zone';

const KEYS: Record<Col, (a: AirfieldWithTonight) => string | number | null> = {
  name: (a) => a.name,
  ident: (a) => a.ident,
  shelters: (a) => a.shelters.length,
  aircraft: (a) => a.aircraftCount,
  low: (a) => a.tonight?.low?.tempC ?? null,
  zone: (a) => a.timeZone,
};

export function AirfieldsTable({ initial, unit, canEdit, nowMs }: { initial: AirfieldWithTonight[]; unit: TempUnit; canEdit: boolean; nowMs: number }) {
  const [showArchived, setShowArchived] = useState(false);
  const key = `/api/airfields?forecast=tonight${showArchived ? '&archived=1' : ''}`;
  const { data, mutate } = useSWR<{ airfields: AirfieldWithTonight[] }>(key, fetcher, showArchived ? {} : { fallbackData: { airfields: initial } });
  const rows = data?.airfields ?? (showArchived ? [] : initial);
  const { sorted, sort, toggle } = useSorted<AirfieldWithTonight, Col>(rows, KEYS, { by: 'name' });
  const [status, setStatus] = useState('');

  async function restore(a: AirfieldWithTonight) {
    const r = await sendJson(`/api/airfields/${a.id}`, 'PATCH', { archived: false });
    setStatus(r.ok ? `${a.name} is restored.` : r.message);
    await mutate();
  }

  if (initial.length === 0 && !showArchived) {
    return (
      <EmptyState
        title="No airfields yet"
        action={canEdit ? <ButtonLink href="/airfields/new">Add the first airfield</ButtonLink> : null}
      >
        {canEdit
          ? 'An airfield has a position, an elevation and a time zone; its shelters are heated or unheated hangars, T-hangars or open tie-downs.'
          : 'A manager of your organization adds the airfields and their shelters.'}
      </EmptyState>
    );
  }

  return (
    <div className="space-y-3">
      <TableCard>
        <TableScroll>
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Airfields of your organization; select a column heading to sort</caption>
            <thead className={theadClass}>
              <tr>
                <SortHeader col="name" label="Airfield" sort={sort} onSort={toggle} className="pl-3" />
                <SortHeader col="shelters" label="Shelters" sort={sort} onSort={toggle} />
                <SortHeader col="aircraft" label="Aircraft" sort={sort} onSort={toggle} className="hidden sm:table-cell" align="right" />
                <SortHeader col="low" label="Low tonight" sort={sort} onSort={toggle} align="right" className="text-right" />
                <SortHeader col="zone" label="Local time" sort={sort} onSort={toggle} className="hidden md:table-cell" />
                {canEdit ? <th scope="col" className="hidden px-4 py-3 text-right sm:table-cell"><span className="sr-only">Actions</span></th> : null}
              </tr>
            </thead>
            <tbody className="divide-y divide-slate-200 dark:divide-slate-800">
              {sorted.map((a) => (
                <tr key={a.id} className={a.archived ? 'bg-slate-50/70 text-slate-500 dark:bg-slate-900/40' : 'hover:bg-ice-50/50 dark:hover:bg-slate-800/40'}>
                  <td className="py-3 pl-5 pr-3">
                    <Link href={`/airfields/${a.id}`} className="font-semibold text-slate-900 hover:text-ice-700 hover:underline dark:text-white dark:hover:text-ice-300">
                      {a.name}
                    </Link>
                    <div className="mt-0.5 flex items-center gap-2 text-xs text-slate-500">
                      <span className="font-semibold tracking-wider">{a.ident}</span>
                      {a.archived ? <span className="rounded bg-slate-200 px-1.5 py-0.5 font-semibold text-slate-700 dark:bg-slate-700 dark:text-slate-200">Archived</span> : null}
                    </div>
                    {canEdit ? <div className="-ml-3 mt-1 sm:hidden"><RowAction a={a} onRestore={restore} /></div> : null}
                  </td>
                  <td className="px-4 py-3">
                    <KindSummary a={a} />
                  </td>
                  <td className="hidden px-4 py-3 text-right tabular-nums sm:table-cell">{a.aircraftCount}</td>
                  <td className="px-4 py-3 text-right">
                    <span className="font-semibold tabular-nums text-slate-900 dark:text-white">{formatTemp(a.tonight?.low?.tempC, unit)}</span>
                    {a.forecast?.status === 'stale' ? (
                      <div className="text-xs font-medium text-amber-800 dark:text-amber-300">{formatAge(a.forecast.ageMinutes ?? 0)} old</div>
                    ) : null}
                  </td>
                  <td className="hidden px-4 py-3 md:table-cell">
                    <span className="tabular-nums">{formatTime(nowMs, a.timeZone)}</span>
                    <div className="text-xs text-slate-500">{a.timeZone}</div>
                  </td>
                  {canEdit ? (
                    <td className="hidden px-4 py-3 text-right sm:table-cell">
                      <RowAction a={a} onRestore={restore} />
                    </td>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </table>
        </TableScroll>
        {sorted.length === 0 ? <p className="px-5 py-6 text-sm text-slate-600 dark:text-slate-400">No archived airfields.</p> : null}
      </TableCard>
      <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
        <label className="inline-flex min-h-11 items-center gap-2 text-slate-700 dark:text-slate-300">
          <input type="checkbox" className="h-4 w-4 accent-ice-700" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} />
          Show archived airfields
        </label>
        <p role="status" aria-live="polite" className="text-slate-600 dark:text-slate-400">{status}</p>
      </div>
    </div>
  );
}

const actionClass = 'inline-flex min-h-10 items-center rounded-lg px-3 text-sm font-semibold text-ice-700 hover:bg-ice-50 dark:text-ice-300 dark:hover:bg-slate-800';

function RowAction({ a, onRestore }: { a: AirfieldWithTonight; onRestore: (a: AirfieldWithTonight) => void }) {
  return a.archived ? (
    <button type="button" onClick={() => onRestore(a)} className={actionClass}>
      Restore<span className="sr-only"> {a.name}</span>
    </button>
  ) : (
    <Link href={`/airfields/${a.id}/edit`} className={actionClass}>
      Edit<span className="sr-only"> {a.name}</span>
    </Link>
  );
}

function KindSummary({ a }: { a: AirfieldWithTonight }) {
  if (a.shelters.length === 0) return <span className="text-slate-500">None yet</span>;
  const counts = SHELTER_KINDS.map((k) => [k, a.shelters.filter((s) => s.kind === k).length] as const).filter(([, n]) => n > 0);
  return (
    <ul className="flex flex-wrap gap-x-3 gap-y-1" aria-label={`${a.shelters.length} shelters`}>
      {counts.map(([k, n]) => (
        <li key={k} className="inline-flex items-center gap-1 whitespace-nowrap text-slate-700 dark:text-slate-300" title={SHELTER_KIND_LABEL[k]}>
          <ShelterKindIcon kind={k} className="h-4 w-4" />
          <span className="tabular-nums">{n}</span>
          <span className="sr-only">{SHELTER_KIND_LABEL[k]}</span>
        </li>
      ))}
    </ul>
  );
}
