'use client';
// "Oil at start": a departure's Morning outcome in two taps on a phone. The value comes prefilled with
// the plan's prediction; "Record" keeps it (or what was typed), "Not flown" says the flight did not
// happen. Once recorded the card shows what was recorded, with "Change" and "Remove".
import { useId, useState } from 'react';
import { inputClass } from '@/components/ui/Field';
import { Button } from '@/components/ui/primitives';
import { ResultNotice, retryable, type FormResult } from '@/components/aircraft/ResultNotice';
import { fmtTemp } from '@/components/aircraft/format';
import { sendJson } from '@/lib/client/fetcher';
import { formatDayTime, zoneLabel } from '@/lib/time';
import { tempLabel, toDisplayTemp, type TempUnit } from '@/lib/units';
import type { OutcomeEntry, OutcomeView } from '@/lib/outcomes/types';

function prefill(e: OutcomeEntry, unit: TempUnit): string {
  const c = e.outcome?.oilAtStartC ?? e.predictedOilC;
  return c === null || c === undefined ? '' : String(Math.round(toDisplayTemp(c, unit)));
}

export function OutcomeCard({ entry, tempUnit, showPilot = false }: { entry: OutcomeEntry; tempUnit: TempUnit; showPilot?: boolean }) {
  const id = useId();
  const [outcome, setOutcome] = useState<OutcomeView | null>(entry.outcome);
  const [editing, setEditing] = useState(!entry.outcome);
  const [value, setValue] = useState(() => prefill(entry, tempUnit));
  const [error, setError] = useState<string | undefined>();
  const [busy, setBusy] = useState<null | 'record' | 'not-flown' | 'remove'>(null);
  const [result, setResult] = useState<FormResult | null>(null);
  const [last, setLast] = useState<(() => void) | null>(null);
  const ms = Date.parse(entry.departAt);
  const when = `${formatDayTime(ms, entry.timeZone)} ${zoneLabel(entry.timeZone, ms)}`;
  const reg = entry.aircraft.registration;
  const inputId = `${id}-oil`;
  const errorId = `${inputId}-error`;

  async function send(flown: boolean) {
    setBusy(flown ? 'record' : 'not-flown');
    setError(undefined);
    setResult(null);
    const r = await sendJson<{ outcome: OutcomeView }>(`/api/departures/${entry.departureId}/outcome`, 'PUT', flown ? { flown, oilAtStart: value.trim(), unit: tempUnit } : { flown });
    setBusy(null);
    if (r.ok) {
      setOutcome(r.data.outcome);
      setEditing(false);
      setResult({ tone: 'info', text: flown ? `Recorded ${fmtTemp(r.data.outcome.oilAtStartC, tempUnit)} at start for ${reg}.` : `Recorded ${reg} as not flown.` });
      return;
    }
    setError(r.fields.oilAtStart);
    setLast(() => () => void send(flown));
    setResult({ tone: 'caution', text: r.fields.oilAtStart ?? r.message, retry: retryable(r.status) });
  }

  async function remove() {
    setBusy('remove');
    setResult(null);
    const r = await sendJson(`/api/departures/${entry.departureId}/outcome`, 'DELETE');
    setBusy(null);
    if (r.ok) {
      setOutcome(null);
      setEditing(true);
      setValue(prefill({ ...entry, outcome: null }, tempUnit));
      setResult({ tone: 'info', text: `Removed the morning of ${reg}.` });
      return;
    }
    setLast(() => () => void remove());
    setResult({ tone: 'caution', text: r.message, retry: retryable(r.status) });
  }

  return (
    <article aria-labelledby={`${id}-h`} className="rounded-2xl border border-slate-200 bg-white p-4 shadow-sm dark:border-slate-800 dark:bg-slate-900">
      <h3 id={`${id}-h`} className="flex flex-wrap items-baseline gap-x-2 text-base font-semibold text-slate-900 dark:text-white">
        <span className="tracking-wide">{reg}</span>
        <span className="text-sm font-normal text-slate-600 dark:text-slate-400">
          {when}
          {showPilot ? ` · ${entry.pilot.name}` : ''}
        </span>
      </h3>
      <p className="mt-0.5 text-sm text-slate-600 dark:text-slate-400">
        {entry.predictedOilC !== null ? <>Predicted {fmtTemp(entry.predictedOilC, tempUnit)} · </> : <>No plan prediction · </>}
        ready at {fmtTemp(entry.readyC, tempUnit)}
        {entry.probabilityReady !== null ? <> · stated chance {Math.round(entry.probabilityReady * 100)}{'\u00a0'}%</> : null}
      </p>
      {editing ? (
        <form
          className="mt-3"
          noValidate
          onSubmit={(ev) => {
            ev.preventDefault();
            void send(true);
          }}
        >
          <label htmlFor={inputId} className="block text-sm font-medium text-slate-800 dark:text-slate-200">
            Oil at start ({tempLabel(tempUnit)})<span className="sr-only">, {reg}</span>
          </label>
          <div className="mt-1 flex flex-wrap items-stretch gap-2">
            <input
              id={inputId}
              name="oilAtStart"
              inputMode="decimal"
              autoComplete="off"
              value={value}
              onChange={(e) => setValue(e.target.value)}
              aria-invalid={error ? true : undefined}
              aria-describedby={error ? errorId : undefined}
              className={`${inputClass.replace('w-full', '')} w-24 flex-none text-center text-lg font-semibold tabular-nums`}
            />
            <Button type="submit" disabled={busy !== null} className="min-h-12 flex-1 sm:flex-none">
              {busy === 'record' ? 'Recording…' : 'Record'}
              <span className="sr-only"> oil at start for {reg}</span>
            </Button>
            <Button type="button" variant="secondary" disabled={busy !== null} onClick={() => void send(false)} className="min-h-12 flex-1 sm:flex-none">
              {busy === 'not-flown' ? 'Saving…' : 'Not flown'}
              <span className="sr-only"> {reg}</span>
            </Button>
          </div>
          {error ? (
            <p id={errorId} className="mt-1 text-sm font-medium text-red-700 dark:text-red-300">
              {error}
            </p>
          ) : null}
          {outcome ? (
            <button type="button" onClick={() => setEditing(false)} className="mt-2 inline-flex min-h-11 items-center rounded-lg px-2 text-sm font-semibold text-slate-600 hover:bg-slate-100 dark:text-slate-300 dark:hover:bg-slate-800">
              Keep what was recorded
            </button>
          ) : null}
        </form>
      ) : outcome ? (
        <div className="mt-2 flex flex-wrap items-center justify-between gap-x-2">
          <p className="text-sm text-slate-800 dark:text-slate-200">
            {outcome.flown ? (
              <>
                <span className="text-lg font-semibold tabular-nums">{fmtTemp(outcome.oilAtStartC, tempUnit)}</span> at start
                {outcome.oilAtStartC !== null ? (
                  outcome.oilAtStartC >= outcome.readyC ? (
                    <span className="ml-2 rounded-full bg-ice-50 px-2 py-0.5 text-xs font-semibold text-ice-900 dark:bg-ice-950 dark:text-ice-100">ready</span>
                  ) : (
                    <span className="ml-2 rounded-full bg-amber-100 px-2 py-0.5 text-xs font-semibold text-amber-900 dark:bg-amber-950 dark:text-amber-200">below ready</span>
                  )
                ) : null}
              </>
            ) : (
              <span className="font-semibold">Not flown</span>
            )}
            <span className="block text-xs text-slate-500">
              Recorded{outcome.recordedBy ? ` by ${outcome.recordedBy.name}` : ''}, {formatDayTime(Date.parse(outcome.recordedAt), entry.timeZone)}
            </span>
          </p>
          <div className="flex gap-1">
            <button type="button" onClick={() => setEditing(true)} className="inline-flex min-h-11 items-center rounded-lg px-3 text-sm font-semibold text-ice-700 hover:bg-ice-50 dark:text-ice-300 dark:hover:bg-slate-800">
              Change<span className="sr-only"> the morning of {reg}</span>
            </button>
            <button
              type="button"
              onClick={() => void remove()}
              disabled={busy !== null}
              className="inline-flex min-h-11 items-center rounded-lg px-3 text-sm font-semibold text-red-700 hover:bg-red-50 disabled:opacity-60 dark:text-red-300 dark:hover:bg-red-950"
            >
              {busy === 'remove' ? 'Removing…' : 'Remove'}
              <span className="sr-only"> the morning of {reg}</span>
            </button>
          </div>
        </div>
      ) : null}
      <div className={result ? 'mt-2' : ''}>
        <ResultNotice result={result} okTitle="Saved" failTitle="Not saved" onRetry={last ?? undefined} />
      </div>
    </article>
  );
}

/** The mornings to record, newest first, as a section of a page. */
export function OutcomeSection({ entries, tempUnit, showPilot, title = 'Oil at start' }: { entries: OutcomeEntry[]; tempUnit: TempUnit; showPilot?: boolean; title?: string }) {
  const id = useId();
  if (!entries.length) return null;
  return (
    <section aria-labelledby={`${id}-h`} className="mb-5">
      <h2 id={`${id}-h`} className="text-lg font-semibold text-slate-900 dark:text-white">{title}</h2>
      <p className="mb-3 text-sm text-slate-600 dark:text-slate-400">The oil temperature shown at start of recent departures: it makes the next plans better.</p>
      <ul className="grid gap-3 md:grid-cols-2 xl:grid-cols-3">
        {entries.map((e) => (
          <li key={e.departureId}>
            <OutcomeCard entry={e} tempUnit={tempUnit} showPilot={showPilot} />
          </li>
        ))}
      </ul>
    </section>
  );
}
