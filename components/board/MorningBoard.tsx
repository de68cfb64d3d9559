'use client';
import useSWR from 'swr';
import { useState } from 'react';
import { formatTemp } from '@/components/airfields/format';
import { Card, EmptyState, Notice } from '@/components/ui/primitives';
import { fetcher } from '@/lib/client/fetcher';
import { formatDay, formatTime } from '@/lib/time';
import type { PlanView } from '@/lib/views/plans';
import type { Readiness } from '@/lib/plans/state';
import { HeaterStateBadge, ReadinessBadge } from './ReadinessBadge';
import { heaterStateAt, whenLabel } from '@/lib/plans/state';
import { PlanDetail } from './PlanDetail';
import { money, pct } from './parts';
export { ConfirmButton, money, pct } from './parts';
import { FrostNote } from './FrostNote';

export interface BoardData {
  generatedAt: string;
  plans: PlanView[];
  totals: { energyKWh: number; cost: number };
  counts: Record<Readiness, number>;
}

const CONTROL: Record<string, string> = { timer: 'timer', relay: 'relay', manual: 'by hand' };


/** The operator's page: the next morning's departures in switch-on order, per airfield. */
export function MorningBoard({ initial, units, canConfirm }: { initial: BoardData; units: 'C' | 'F'; canConfirm: boolean }) {
  const { data, mutate, isValidating, error } = useSWR<BoardData>('/api/board', fetcher, { fallbackData: initial, refreshInterval: 60_000 });
  const board = data ?? initial;
  const [open, setOpen] = useState<number | null>(null);
  const groups = new Map<string, PlanView[]>();
  for (const p of board.plans) {
    const k = p.airfield ? `${p.airfield.name} · ${p.airfield.ident}` : 'No home shelter';
    groups.set(k, [...(groups.get(k) ?? []), p]);
  }
  const currency = board.plans[0]?.currency ?? 'EUR';
  // The board's "now" is the instant its data was made, so every state word agrees with the plans shown.
  const nowMs = Date.parse(board.generatedAt);
  if (!board.plans.length) {
    return (
      <EmptyState title="No departures for the next morning">
        When pilots book the first flight of a day, each departure shows here with its switch-on time and the predicted oil temperature.
      </EmptyState>
    );
  }
  return (
    <div className="space-y-5">
      <div className="grid grid-cols-2 gap-2 sm:grid-cols-4 lg:grid-cols-6">
        {(['short', 'unplanned', 'warming', 'ready'] as Readiness[]).map((s) => (
          <div key={s} className="rounded-2xl border border-slate-200 bg-white p-3 dark:border-slate-800 dark:bg-slate-900">
            <div className="text-2xl font-semibold tabular-nums">{board.counts[s]}</div>
            <ReadinessBadge status={s} />
          </div>
        ))}
        <div className="rounded-2xl border border-slate-200 bg-white p-3 dark:border-slate-800 dark:bg-slate-900">
          <div className="text-2xl font-semibold tabular-nums">{board.totals.energyKWh.toFixed(1)}</div>
          <div className="text-xs text-slate-600 dark:text-slate-400">kWh planned</div>
        </div>
        <div className="rounded-2xl border border-slate-200 bg-white p-3 dark:border-slate-800 dark:bg-slate-900">
          <div className="text-2xl font-semibold tabular-nums">{money(board.totals.cost, currency)}</div>
          <div className="text-xs text-slate-600 dark:text-slate-400">energy cost</div>
        </div>
      </div>
      {error ? <Notice tone="caution">Could not refresh the board just now; showing the last plans.</Notice> : null}
      {[...groups.entries()].map(([name, plans]) => (
        <Card key={name} className="overflow-hidden p-0 sm:p-0" aria-label={name}>
          <h2 className="border-b border-slate-200 bg-slate-50 px-4 py-2.5 text-sm font-semibold text-slate-800 dark:border-slate-800 dark:bg-slate-800/50 dark:text-slate-100">
            {name} <span className="font-normal text-slate-500">· times in {plans[0].airfield?.timeZone ?? 'UTC'}</span>
          </h2>
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Departures at {name} in switch-on order</caption>
            <thead className="hidden text-xs uppercase tracking-wide text-slate-500 md:table-header-group dark:text-slate-400">
              <tr>
                <th scope="col" className="px-4 py-2">Switch on</th>
                <th scope="col" className="px-4 py-2">Aircraft</th>
                <th scope="col" className="px-4 py-2">Departure</th>
                <th scope="col" className="px-4 py-2">Oil at departure</th>
                <th scope="col" className="px-4 py-2">Chance ready</th>
                <th scope="col" className="px-4 py-2">Status</th>
                <th scope="col" className="px-4 py-2 text-right">Energy · cost</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-slate-200 dark:divide-slate-800">
              {plans.map((p) => {
                const zone = p.airfield?.timeZone ?? 'UTC';
                const expanded = open === p.departureId;
                return (
                  <BoardRow key={p.departureId} p={p} zone={zone} units={units} nowMs={nowMs} expanded={expanded} onToggle={() => setOpen(expanded ? null : p.departureId)} canConfirm={canConfirm} onConfirmed={() => mutate()} />
                );
              })}
            </tbody>
          </table>
        </Card>
      ))}
      <p className="no-print text-xs text-slate-500 dark:text-slate-400" aria-live="polite">
        {isValidating ? 'Refreshing…' : `Updated ${formatTime(Date.parse(board.generatedAt), board.plans[0]?.airfield?.timeZone ?? 'UTC')}`} · refreshes every minute
      </p>
    </div>
  );
}

function BoardRow({ p, zone, units, nowMs, expanded, onToggle, canConfirm, onConfirmed }: { p: PlanView; zone: string; units: 'C' | 'F'; nowMs: number; expanded: boolean; onToggle: () => void; canConfirm: boolean; onConfirmed: () => void }) {
  const dep = Date.parse(p.departAt);
  const on = p.switchOnAt ? Date.parse(p.switchOnAt) : null;
  const short = p.status === 'short' || p.status === 'unplanned';
  const state = heaterStateAt(p, nowMs);
  const urgent = state === 'switch-on-now' || state === 'heating';
  return (
    <>
      <tr className={`align-top ${short ? 'bg-red-50/60 dark:bg-red-950/30' : ''}`}>
        <td className="px-4 py-3 md:w-32">
          <button type="button" onClick={onToggle} aria-expanded={expanded} aria-controls={`plan-${p.departureId}`} className="text-left">
            <span className={`block whitespace-nowrap text-xl font-semibold tabular-nums ${urgent ? 'text-ember-700 dark:text-ember-300' : 'text-slate-900 dark:text-white'}`}>
              {state === 'switch-on-now' ? 'Now' : on !== null ? whenLabel(on, zone, nowMs) : '—'}
            </span>
            <span className="block text-xs text-slate-500">{on !== null ? (p.heater ? `${p.heater.kindLabel}, ${CONTROL[p.heater.control] ?? p.heater.control}` : '') : p.heater ? 'no heat needed' : 'no heater'}</span>
          </button>
          {/* Phone: the rest of the row under the time. */}
          <div className="mt-2 space-y-1 md:hidden">
            <div className="font-semibold text-slate-900 dark:text-white">{p.aircraft.registration} <span className="font-normal text-slate-500">{p.shelter?.name}</span></div>
            <div className="text-sm">Departs {whenLabel(dep, zone, nowMs)} · oil {formatTemp(p.oilAtDepartureC, units, 0)} (ready {formatTemp(p.readyC, units, 0)})</div>
            <div className="flex flex-wrap items-center gap-2"><HeaterStateBadge state={state} /> <span className="text-xs text-slate-600">{pct(p.probabilityReady)} chance</span> <FrostNote plan={p} compact /></div>
          </div>
        </td>
        <td className="hidden px-4 py-3 md:table-cell">
          <div className="font-semibold text-slate-900 dark:text-white">{p.aircraft.registration}</div>
          <div className="text-xs text-slate-500">{p.aircraft.typeLabel} · {p.shelter?.name ?? 'no shelter'}</div>
          <div className="text-xs text-slate-500">{p.pilot.name}</div>
        </td>
        <td className="hidden px-4 py-3 tabular-nums md:table-cell">
          <div className="font-medium">{formatTime(dep, zone)}</div>
          <div className="text-xs text-slate-500">{formatDay(dep, zone)}</div>
        </td>
        <td className="hidden px-4 py-3 tabular-nums md:table-cell">
          <div className={`font-semibold ${p.status !== 'no-heat' && p.oilAtDepartureC !== null && p.oilAtDepartureC < p.readyC ? 'text-red-700 dark:text-red-300' : ''}`}>{formatTemp(p.oilAtDepartureC, units, 0)}</div>
          <div className="text-xs text-slate-500">
            {p.status === 'no-heat' ? 'no preheat needed by the maker’s rule' : <>ready {formatTemp(p.readyC, units, 0)} · unheated {formatTemp(p.freeOilAtDepartureC, units, 0)}</>}
          </div>
        </td>
        <td className="hidden px-4 py-3 tabular-nums md:table-cell">{pct(p.probabilityReady)}</td>
        <td className="hidden px-4 py-3 md:table-cell">
          <div className="flex flex-wrap gap-1.5">
            <HeaterStateBadge state={state} />
            <FrostNote plan={p} compact />
          </div>
          <div className="mt-1 text-xs text-slate-500">{p.summary}</div>
          {p.confirmed ? <div className="mt-1 text-xs text-teal-700 dark:text-teal-300">Confirmed by {p.confirmed.by}</div> : null}
        </td>
        <td className="hidden px-4 py-3 text-right tabular-nums md:table-cell">
          <div>{p.energyKWh.toFixed(2)} kWh</div>
          <div className="text-xs text-slate-500">{money(p.cost, p.currency)}</div>
        </td>
      </tr>
      {expanded ? (
        <tr id={`plan-${p.departureId}`}>
          <td colSpan={7} className="bg-slate-50 px-4 py-4 dark:bg-slate-900/60">
            <PlanDetail departureId={p.departureId} units={units} canConfirm={canConfirm} onConfirmed={onConfirmed} />
          </td>
        </tr>
      ) : null}
    </>
  );
}

