'use client';
import useSWR from 'swr';
import { SoakChart } from '@/components/charts/SoakChart';
import { formatTemp } from '@/components/airfields/format';
import { Notice } from '@/components/ui/primitives';
import { fetcher } from '@/lib/client/fetcher';
import { formatDayTime, formatTime } from '@/lib/time';
import type { PlanView } from '@/lib/views/plans';
import { ConfirmButton, money, pct } from './parts';
import { HeatCautions } from './Cautions';
import { FrostNote } from './FrostNote';
import { sameLocalDay } from '@/lib/plans/state';

const hoursText = (ms: number) => {
  const m = Math.round(ms / 60_000);
  return m < 60 ? `${m} min` : `${Math.floor(m / 60)} h${m % 60 ? ` ${m % 60} min` : ''}`;
};

interface Detail {
  plan: PlanView;
  series: { at: string; outsideC: number; shelterC: number; oilC: number; engineC: number | null }[];
}

const RULE = (b: PlanView['baselines'][number]) => (b.rule === 'all-night' ? 'On all night' : `On ${b.hours} h before`);

/** A departure's Soak forecast with its heater bands, the plan's figures and the usual rules beside it. */
export function PlanDetail({ departureId, units, canConfirm, onConfirmed }: { departureId: number; units: 'C' | 'F'; canConfirm: boolean; onConfirmed?: () => void }) {
  const { data, error, mutate } = useSWR<Detail>(`/api/departures/${departureId}/plan`, fetcher);
  if (error) return <Notice tone="caution">Could not load this plan: {error.message}</Notice>;
  if (!data) return <div className="h-56 animate-pulse rounded-xl bg-slate-200/60 dark:bg-slate-800" aria-busy="true" aria-label="Loading the Soak forecast" />;
  const p = data.plan;
  const zone = p.airfield?.timeZone ?? 'UTC';
  return (
    <div className="space-y-4">
      {p.readyLowered ? (
        <Notice tone="caution" title="Ready temperature lowered">
          Lowered to the aircraft’s figure ({formatTemp(p.readyC, units, 0)}) by {p.readyLowered.by} on {formatDayTime(Date.parse(p.readyLowered.at), zone)}. Follow the engine manufacturer’s cold-weather instructions; they override
          Thawline’s estimates.
        </Notice>
      ) : null}
      {(p.warnings ?? []).map((w) => (
        <Notice key={w.code} tone="caution" title="Heater warning">
          {w.text} Suggestion: {w.suggestion}
        </Notice>
      ))}
      {data.series.length ? (
        <SoakChart series={data.series} readyC={p.readyC} floorC={p.floorC ?? undefined} heaterBands={p.heaterOn} departAt={p.departAt} holdUntil={p.hold?.until} timeZone={zone} units={units} />
      ) : null}
      <div className="grid gap-3 text-sm sm:grid-cols-3">
        <div>
          <p className="font-semibold">Heat plan</p>
          {p.heaterOn.length ? (
            <ul className="mt-1 space-y-0.5 tabular-nums">
              {p.heaterOn.map((b) => (
                <li key={b.from}>
                  {/* Each end with its day, so a block over midnight reads as the hours it is. */}
                  {formatDayTime(Date.parse(b.from), zone)} – {sameLocalDay(Date.parse(b.from), Date.parse(b.to), zone) ? formatTime(Date.parse(b.to), zone) : formatDayTime(Date.parse(b.to), zone)}
                  <span className="text-slate-500"> ({hoursText(Date.parse(b.to) - Date.parse(b.from))})</span>
                </li>
              ))}
            </ul>
          ) : (
            <p className="mt-1 text-slate-600 dark:text-slate-400">{p.heater ? 'No heat needed.' : 'No heater fitted.'}</p>
          )}
          {p.hold?.heaterOn ? (
            <p className="mt-1 text-xs font-semibold text-ember-800 dark:text-ember-200">
              Start window to {formatTime(Date.parse(p.hold.until), zone)} ({p.holdMinutes} min): leave on until just before start; unplug before start.
            </p>
          ) : null}
          {p.mode ? <p className="mt-1 text-xs text-slate-500">{p.mode === 'single-start' ? 'One block to departure (timer or by hand).' : 'Least-cost slots (switched relay).'}</p> : null}
        </div>
        <div>
          <p className="font-semibold">Prediction</p>
          <p className="mt-1">Oil at departure {formatTemp(p.oilAtDepartureC, units)} · ready {formatTemp(p.readyC, units, 0)}</p>
          <p>
            Chance of being ready {pct(p.probabilityReady)}
            {p.chance ? <span className="text-slate-600 dark:text-slate-400"> (aim {pct(p.chance.target)})</span> : null}
          </p>
          {p.chance ? (
            <p className="text-xs text-slate-600 dark:text-slate-400">
              Oil at departure uncertain by forecast ±{p.chance.forecastK.toFixed(1)} °C, aircraft model ±{p.chance.aircraftK.toFixed(1)} °C, heater ±{p.chance.heaterK.toFixed(1)} °C
              {p.chance.outcomesK > 0 ? `, recorded mornings ±${p.chance.outcomesK.toFixed(1)} °C (bias ${p.chance.biasK >= 0 ? '+' : '−'}${Math.abs(p.chance.biasK).toFixed(1)} °C)` : ''}
              {p.chance.coverOffProbability > 0 ? `; if the cover is left off (${Math.round(p.chance.coverOffProbability * 100)} % assumed) the oil is ${p.chance.coverDropK.toFixed(0)} °C colder` : ''}.
            </p>
          ) : null}
          {p.hold ? (
            <p>
              Lowest in the start window: oil {formatTemp(p.hold.minOilC, units)}
              {p.hold.minEngineC !== null ? <>, engine {formatTemp(p.hold.minEngineC, units)}</> : null}
            </p>
          ) : null}
          {p.floor ? <p>Lowest oil after switch-on {formatTemp(p.floor.minOilC, units)} {p.floor.met ? '' : '(below the floor)'}</p> : null}
          <p className="text-xs text-slate-500">{p.energyKWh.toFixed(2)} kWh · {money(p.cost, p.currency)}</p>
        </div>
        <div>
          <p className="font-semibold">The usual rules</p>
          <ul className="mt-1 space-y-0.5">
            {p.baselines.map((b) => (
              <li key={RULE(b)} className="flex justify-between gap-2 tabular-nums">
                <span>{RULE(b)}{b.meetsReady ? '' : ' (short)'}</span>
                <span className="text-slate-600 dark:text-slate-400">
                  {b.energyKWh.toFixed(1)} kWh
                  {/* A saving only where the rule also makes the engine ready; a short rule is no alternative. */}
                  {b.meetsReady ? (b.savedKWh >= 0.05 ? ` · the plan uses ${b.savedKWh.toFixed(1)} kWh less` : ' · about the same as the plan') : ` · oil ${formatTemp(b.oilAtDepartureC, units, 0)}, not ready`}
                </span>
              </li>
            ))}
          </ul>
        </div>
      </div>
      {p.status === 'short' && p.fix ? (
        <Notice tone="danger" title="This departure will not be ready">
          {p.fix.readyAt ? <>With the heater on from now, the oil reaches {formatTemp(p.readyC, units, 0)} at {formatDayTime(Date.parse(p.fix.readyAt), zone)}. </> : null}
          {/* Only when more power would help: a shortfall of time is not cured by a heater already big enough. */}
          {p.fix.powerNeededW && (!p.heater || p.fix.powerNeededW > p.heater.powerW) ? <>To be ready on time it would need about {Math.ceil(p.fix.powerNeededW / 50) * 50} W of heat{p.heater ? ` (${Math.round(p.heater.powerW)} W fitted)` : ''}. </> : null}
          Move the departure, move the aircraft into a warmer shelter, or fit a stronger heater.
        </Notice>
      ) : null}
      {p.status === 'unplanned' ? (
        <Notice tone="danger" title="Needs heat, no plan">
          The unheated oil will be at {formatTemp(p.freeOilAtDepartureC, units, 0)} at departure, below the ready temperature. Fit a heater or move the aircraft to a heated hangar.
        </Notice>
      ) : null}
      <div className="flex flex-wrap items-center gap-3">
        {canConfirm && p.heaterOn.length ? (
          p.confirmed ? (
            <span className="text-sm text-teal-700 dark:text-teal-300">Confirmed by {p.confirmed.by}</span>
          ) : (
            <ConfirmButton departureId={departureId} onDone={() => { mutate(); onConfirmed?.(); }} />
          )
        ) : null}
        <span className="text-xs text-slate-500">Computed {formatDayTime(Date.parse(p.computedAt), zone)}{p.forecast?.stale ? ' · forecast out of date' : ''}</span>
      </div>
      <FrostNote plan={p} />
      <HeatCautions always />
    </div>
  );
}
