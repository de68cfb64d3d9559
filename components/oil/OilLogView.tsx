'use client';
// The Oil log of one aircraft: the latest corrected level, oil used per engine hour against the engine
// class's usual figure, the next oil change, the record forms, the charts and the entries.
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import useSWR from 'swr';
import { Button, buttonClass, Card, EmptyState, Notice } from '@/components/ui/primitives';
import { SelectField } from '@/components/ui/Field';
import { OilLevelChart } from '@/components/charts/OilLevelChart';
import { BladesScatter } from '@/components/charts/BladesScatter';
import { fmtTemp } from '@/components/aircraft/format';
import { fetcher, sendJson } from '@/lib/client/fetcher';
import { formatDateTime, formatDay, formatTime } from '@/lib/time';
import { USUAL_MAX_BLADE_TURNS } from '@/lib/oil';
import type { TempUnit, VolumeUnit } from '@/lib/units';
import type { OilAircraftChoice, OilLog } from '@/lib/views/oil';
import { HandTurningCautions } from './HandTurningCautions';
import { OilCheckForm } from './OilCheckForm';
import { IntervalForm, OilChangeForm } from './OilChangeForm';
import { fmtHours, fmtLevel, fmtRate } from './format';

/** The newest checks shown at first; the rest behind a button (no hidden scroll box). */
const CHECKS_SHOWN = 8;

interface Props {
  choices: OilAircraftChoice[];
  selectedId: number | null;
  initial: OilLog | null;
  me: { id: number; canEditAircraft: boolean; tempUnit: TempUnit; volumeUnit: VolumeUnit };
}

/** "Sat 18 Sept 2027" in the zone. */
function dayWithYear(ms: number, zone: string): string {
  return new Date(ms).toLocaleDateString('en-GB', { timeZone: zone, weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' }).replace(',', '');
}

const DUE_TONE = { ok: 'border-slate-200 dark:border-slate-800', soon: 'border-amber-300 bg-amber-50 dark:border-amber-700 dark:bg-amber-950', overdue: 'border-red-300 bg-red-50 dark:border-red-800 dark:bg-red-950', unknown: 'border-slate-200 dark:border-slate-800' } as const;

export function OilLogView({ choices, selectedId, initial, me }: Props) {
  const router = useRouter();
  const [id, setId] = useState(selectedId);
  const { data, mutate } = useSWR<OilLog>(id ? `/api/aircraft/${id}/oil` : null, fetcher, { fallbackData: id === selectedId && initial ? initial : undefined });
  const [status, setStatus] = useState('');
  const [allChecks, setAllChecks] = useState(false);

  if (!choices.length || !id) return <EmptyState title="No aircraft yet">The Oil log opens once the organization has an aircraft profile.</EmptyState>;

  function choose(next: number) {
    setId(next);
    setStatus('');
    router.replace(`/oil-log?aircraft=${next}`, { scroll: false });
  }

  async function remove(kind: 'checks' | 'changes', entryId: number) {
    const r = await sendJson(`/api/aircraft/${id}/oil/${kind}/${entryId}`, 'DELETE');
    setStatus(r.ok ? 'Entry removed.' : r.message);
    await mutate();
  }

  const { tempUnit: tu, volumeUnit: vu } = me;
  const log = data;
  const zone = log?.aircraft.timeZone ?? 'UTC';
  const latest = log?.checks[0];
  const c = log?.consumption;
  const due = log?.due;
  const blades = (log?.checks ?? []).filter((k) => k.bladesTurned !== null).map((k) => ({ outsideTempC: k.outsideTempC, bladesTurned: k.bladesTurned!, oilAgeHours: k.oilAgeHours }));
  const lastBlades = log?.checks.find((k) => k.bladesTurned !== null);

  return (
    <div className="space-y-4">
      <div className="grid gap-4 lg:grid-cols-[minmax(0,22rem)_1fr] lg:items-start">
        <div className="space-y-3">
          <SelectField id="oil-aircraft" label="Aircraft" value={id} onChange={(e) => choose(Number(e.target.value))}>
            {choices.map((a) => (
              <option key={a.id} value={a.id}>
                {a.registration} — {a.typeLabel}
                {a.airfield ? ` · ${a.airfield}` : ''}
              </option>
            ))}
          </SelectField>
          {log ? <p className="text-sm text-slate-600 dark:text-slate-400">{log.aircraft.engineClassLabel} · oil capacity {fmtLevel(log.aircraft.oilQuantityL, vu, 1)}</p> : null}
          <a href="#rec-check-h" className={`${buttonClass('primary', 'w-full')} lg:hidden`}>
            Record a cold oil check
          </a>
        </div>
        <HandTurningCautions />
      </div>

      {!log ? (
        <p className="text-sm text-slate-600 dark:text-slate-400">Loading…</p>
      ) : (
        <>
          <div className="grid gap-3 sm:grid-cols-3">
            <section aria-labelledby="sum-level" className="rounded-2xl border border-slate-200 bg-white p-4 dark:border-slate-800 dark:bg-slate-900">
              <h2 id="sum-level" className="text-xs font-semibold uppercase tracking-wide text-slate-500 dark:text-slate-400">Latest level at 15 °C</h2>
              {latest ? (
                <>
                  <p className="mt-1 text-2xl font-semibold tabular-nums text-slate-900 dark:text-white">{fmtLevel(latest.correctedL, vu)}</p>
                  <p className="text-sm text-slate-600 dark:text-slate-400">
                    Read {fmtLevel(latest.levelL, vu)} at {fmtTemp(latest.oilTempC, tu)} · {formatDay(Date.parse(latest.checkedAt), zone)}
                  </p>
                </>
              ) : (
                <p className="mt-1 text-sm text-slate-600 dark:text-slate-400">No checks yet.</p>
              )}
            </section>
            <section aria-labelledby="sum-use" className={`rounded-2xl border bg-white p-4 dark:bg-slate-900 ${c?.high ? 'border-amber-300 bg-amber-50 dark:border-amber-700 dark:bg-amber-950' : 'border-slate-200 dark:border-slate-800'}`}>
              <h2 id="sum-use" className="text-xs font-semibold uppercase tracking-wide text-slate-500 dark:text-slate-400">Oil used per engine hour</h2>
              {c?.recentLPerH !== null && c?.recentLPerH !== undefined ? (
                <>
                  <p className="mt-1 text-2xl font-semibold tabular-nums text-slate-900 dark:text-white">{fmtRate(c.recentLPerH, vu)}</p>
                  <p className={`text-sm ${c.high ? 'font-semibold text-amber-900 dark:text-amber-100' : 'text-slate-600 dark:text-slate-400'}`}>
                    {c.high ? 'Above' : 'Within'} the usual {c.usualLPerH !== null ? fmtRate(c.usualLPerH, vu) : '—'} for this engine class · {c.checks} checks over {c.hours.toFixed(0)} h
                  </p>
                </>
              ) : (
                <p className="mt-1 text-sm text-slate-600 dark:text-slate-400">Needs three checks with engine hours over 3 h or more.</p>
              )}
            </section>
            <section aria-labelledby="sum-due" className={`rounded-2xl border bg-white p-4 dark:bg-slate-900 ${due ? DUE_TONE[due.status] : ''}`}>
              <h2 id="sum-due" className="text-xs font-semibold uppercase tracking-wide text-slate-500 dark:text-slate-400">Next oil change</h2>
              {due && due.status !== 'unknown' ? (
                <>
                  <p className="mt-1 text-2xl font-semibold text-slate-900 dark:text-white">{due.status === 'overdue' ? 'Overdue' : due.status === 'soon' ? 'Due soon' : 'On schedule'}</p>
                  <p className="text-sm text-slate-700 dark:text-slate-300">
                    {due.dueAtHours !== null ? `At ${fmtHours(due.dueAtHours)}${due.hoursLeft !== null ? ` (${due.hoursLeft >= 0 ? `${due.hoursLeft.toFixed(1)} h left` : `${(-due.hoursLeft).toFixed(1)} h over`})` : ''}` : ''}
                    {due.dueAtHours !== null && due.dueAtMs !== null ? ' or ' : ''}
                    {due.dueAtMs !== null ? `by ${dayWithYear(due.dueAtMs, zone)}${due.daysLeft !== null ? ` (${due.daysLeft >= 0 ? `${Math.floor(due.daysLeft)} days left` : `${Math.ceil(-due.daysLeft)} days over`})` : ''}` : ''}
                    {due.by ? `; ${due.by === 'hours' ? 'the hours' : 'the months'} come first.` : ''}
                  </p>
                </>
              ) : (
                <p className="mt-1 text-sm text-slate-600 dark:text-slate-400">{due?.missing === 'interval' ? 'No interval set for this aircraft.' : 'No oil change logged yet.'}</p>
              )}
              {me.canEditAircraft ? (
                <details className="mt-2">
                  <summary className="min-h-11 cursor-pointer py-2 text-sm font-medium text-ice-800 dark:text-ice-200">Set the interval</summary>
                  <IntervalForm key={id} aircraftId={id} hours={log.aircraft.oilChangeIntervalHours} months={log.aircraft.oilChangeIntervalMonths} onSaved={() => void mutate()} />
                </details>
              ) : null}
            </section>
          </div>

          {lastBlades && lastBlades.bladesTurned! > USUAL_MAX_BLADE_TURNS ? (
            <Notice tone="caution" title="The oil took long to return">
              {lastBlades.bladesTurned} blade turns at the last check. A healthy installation usually needs about 2–{USUAL_MAX_BLADE_TURNS} (common practice); cold, old oil makes it take longer. Consider preheating before the check, or the oil&apos;s age.
            </Notice>
          ) : null}

          <div className="grid gap-4 xl:grid-cols-2">
            <Card aria-labelledby="rec-check-h">
              <h2 id="rec-check-h" className="scroll-mt-20 text-lg font-semibold">Record a cold oil check</h2>
              <p className="mb-4 mt-1 text-sm text-slate-600 dark:text-slate-400">In your units ({tu === 'F' ? '°F' : '°C'}, {vu === 'qt' ? 'US quarts' : 'litres'}); times at {zone}.</p>
              <OilCheckForm key={id} aircraftId={id} zone={zone} drySump={log.aircraft.drySump} tempUnit={tu} volumeUnit={vu} onSaved={(l) => void mutate(l, { revalidate: false })} />
            </Card>
            <div className="space-y-4">
              <Card aria-labelledby="chart-level-h">
                <h2 id="chart-level-h" className="text-lg font-semibold">Level over engine hours</h2>
                <p className="mb-3 mt-1 text-sm text-slate-600 dark:text-slate-400">Each reading corrected to 15 °C, so warm and cold checks compare.</p>
                <OilLevelChart checks={log.checks} changes={log.changes} fullL={log.aircraft.oilQuantityL} unit={vu} />
              </Card>
              {blades.length ? (
                <Card aria-labelledby="chart-blades-h">
                  <h2 id="chart-blades-h" className="text-lg font-semibold">Blade turns until the oil returned</h2>
                  <p className="mb-3 mt-1 text-sm text-slate-600 dark:text-slate-400">Against the outside temperature, shaded by the oil&apos;s age.</p>
                  <BladesScatter points={blades} unit={tu} />
                </Card>
              ) : null}
            </div>
          </div>

          <section aria-labelledby="checks-h" className="overflow-hidden rounded-2xl border border-slate-200 bg-white shadow-sm dark:border-slate-800 dark:bg-slate-900">
            <div className="flex flex-wrap items-center justify-between gap-2 px-4 pt-4 sm:px-5">
              <h2 id="checks-h" className="text-lg font-semibold">Oil checks</h2>
              <p role="status" aria-live="polite" className="text-sm text-slate-600 dark:text-slate-400">
                {status}
              </p>
            </div>
            <div className="relative mt-3 overflow-x-auto">
              <table className="w-full text-left text-sm">
                <caption className="sr-only">Oil checks of {log.aircraft.registration}, newest first</caption>
                <thead className="sticky top-0 bg-slate-50 text-xs uppercase tracking-wide text-slate-600 dark:bg-slate-800 dark:text-slate-400">
                  <tr>
                    <th scope="col" className="py-2 pl-4 pr-2">When</th>
                    <th scope="col" className="px-2 py-2 text-right">At 15 °C</th>
                    <th scope="col" className="hidden px-3 py-2 text-right sm:table-cell">As read</th>
                    <th scope="col" className="px-2 py-2 text-right">Oil / outside</th>
                    <th scope="col" className="hidden px-3 py-2 text-right md:table-cell">Turns</th>
                    <th scope="col" className="hidden px-3 py-2 text-right md:table-cell">Engine h</th>
                    <th scope="col" className="hidden px-3 py-2 lg:table-cell">By · notes</th>
                    <th scope="col" className="py-2 pl-1 pr-3 text-right"><span className="sr-only">Actions</span></th>
                  </tr>
                </thead>
                <tbody className="divide-y divide-slate-200 dark:divide-slate-800">
                  {(allChecks ? log.checks : log.checks.slice(0, CHECKS_SHOWN)).map((k) => (
                    <tr key={k.id} className="align-top">
                      <td className="py-2 pl-4 pr-2">
                        <span className="whitespace-nowrap">{formatDay(Date.parse(k.checkedAt), zone)}</span>
                        <span className="block text-xs text-slate-500">{formatTime(Date.parse(k.checkedAt), zone)}</span>
                      </td>
                      <td className="whitespace-nowrap px-2 py-2 text-right font-semibold tabular-nums">
                        {fmtLevel(k.correctedL, vu)}
                        {k.addedL > 0 ? <span className="block text-xs font-normal text-ice-700 dark:text-ice-300">+{fmtLevel(k.addedL, vu, 1)} added</span> : null}
                      </td>
                      <td className="hidden whitespace-nowrap px-3 py-2 text-right tabular-nums sm:table-cell">{fmtLevel(k.levelL, vu)}</td>
                      <td className="whitespace-nowrap px-2 py-2 text-right tabular-nums">
                        {fmtTemp(k.oilTempC, tu)}
                        <span className="block text-xs text-slate-500">{fmtTemp(k.outsideTempC, tu)}</span>
                      </td>
                      <td className="hidden px-3 py-2 text-right tabular-nums md:table-cell">{k.bladesTurned ?? '—'}</td>
                      <td className="hidden px-3 py-2 text-right tabular-nums md:table-cell">{k.engineHours !== null ? k.engineHours.toFixed(1) : '—'}</td>
                      <td className="hidden max-w-[16rem] px-3 py-2 text-slate-600 dark:text-slate-400 lg:table-cell">
                        {k.author?.name ?? '—'}
                        {k.notes ? <span className="block text-xs">{k.notes}</span> : null}
                      </td>
                      <td className="py-2 pl-1 pr-3 text-right">
                        {k.author?.id === me.id || me.canEditAircraft ? (
                          <Button variant="ghost" className="min-h-10 min-w-10 px-2 text-xs" onClick={() => remove('checks', k.id)}>
                            <span className="hidden sm:inline">Remove</span>
                            <span aria-hidden="true" className="text-base sm:hidden">✕</span>
                            <span className="sr-only"> Remove the check of {formatDateTime(Date.parse(k.checkedAt), zone)}</span>
                          </Button>
                        ) : null}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
              {!log.checks.length ? <p className="px-4 pb-4 text-sm text-slate-600 dark:text-slate-400">No oil checks recorded yet.</p> : null}
              {log.checks.length > CHECKS_SHOWN ? (
                <div className="border-t border-slate-200 px-4 py-3 dark:border-slate-800">
                  <Button variant="secondary" onClick={() => setAllChecks((v) => !v)} aria-expanded={allChecks}>
                    {allChecks ? `Show the newest ${CHECKS_SHOWN}` : `Show all ${log.checks.length} checks`}
                  </Button>
                </div>
              ) : null}
            </div>
          </section>

          <div className="grid gap-4 xl:grid-cols-2">
            <Card aria-labelledby="rec-change-h">
              <h2 id="rec-change-h" className="text-lg font-semibold">Record an oil change</h2>
              <div className="mt-4">
                <OilChangeForm key={id} aircraftId={id} zone={zone} currentHours={log.currentHours} volumeUnit={vu} onSaved={(l) => void mutate(l, { revalidate: false })} />
              </div>
            </Card>
            <Card aria-labelledby="changes-h">
              <h2 id="changes-h" className="text-lg font-semibold">Oil changes</h2>
              {log.changes.length ? (
                <ul className="mt-2 divide-y divide-slate-200 dark:divide-slate-800">
                  {log.changes.map((ch) => (
                    <li key={ch.id} className="flex items-start justify-between gap-3 py-3 text-sm">
                      <div>
                        <p className="font-medium text-slate-900 dark:text-white">
                          {formatDay(Date.parse(ch.changedAt), zone)} · {fmtHours(ch.engineHours)}
                        </p>
                        <p className="text-slate-600 dark:text-slate-400">
                          {ch.oilGrade}
                          {ch.quantityL !== null ? ` · ${fmtLevel(ch.quantityL, vu, 1)}` : ''}
                          {ch.author ? ` · ${ch.author.name}` : ''}
                        </p>
                        {ch.notes ? <p className="text-xs text-slate-500">{ch.notes}</p> : null}
                      </div>
                      {ch.author?.id === me.id || me.canEditAircraft ? (
                        <Button variant="ghost" className="min-h-10 px-2 text-xs" onClick={() => remove('changes', ch.id)}>
                          Remove<span className="sr-only"> the oil change of {formatDay(Date.parse(ch.changedAt), zone)}</span>
                        </Button>
                      ) : null}
                    </li>
                  ))}
                </ul>
              ) : (
                <p className="mt-2 text-sm text-slate-600 dark:text-slate-400">No oil changes recorded yet.</p>
              )}
            </Card>
          </div>
        </>
      )}
    </div>
  );
}
