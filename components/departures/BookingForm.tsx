'use client';
import { useMemo, useState } from 'react';
import { useSWRConfig } from 'swr';
import { Button, Card } from '@/components/ui/primitives';
import { ResultNotice, retryable, type FormResult } from '@/components/aircraft/ResultNotice';
import { FieldShell, SelectField, TextField, inputClass } from '@/components/ui/Field';
import { fmtTemp } from '@/components/aircraft/format';
import { sendJson } from '@/lib/client/fetcher';
import { addDays, formatDayTime, localDateKey, localDateOf, zoneLabel } from '@/lib/time';
import { tempLabel, toDisplayTemp, type TempUnit } from '@/lib/units';
import type { DepartureRecord } from '@/lib/views/departures';
import { DEPARTURES_KEY } from './DepartureList';
import { typedTempC } from './temps';

export interface BookableAircraft {
  id: number;
  registration: string;
  typeLabel: string;
  airfield: { id: number; name: string; timeZone: string };
  shelterName: string;
  classReadyC: number;
  heaterW: number;
}

/** Empty → undefined here: the booking then takes the class's ready temperature. */
const toC = (s: string, unit: TempUnit) => typedTempC(s, unit) ?? undefined;

const LABEL: Record<string, string> = {
  aircraftId: 'Aircraft',
  pilotId: 'Pilot',
  departAt: 'Date and time',
  readyC: 'Ready temperature',
  floorC: 'Overnight floor',
  holdMinutes: 'Start window',
  notes: 'Notes',
};

/** Books the first flight of a day: the aircraft, local date and time at its airfield, the ready temperature. */
export function BookingForm({
  aircraft,
  pilots,
  selfId,
  tempUnit,
  nowMs,
  preselect,
}: {
  aircraft: BookableAircraft[];
  /** For roles that book for anyone: who may be named as pilot (the user first). */
  pilots?: { id: number; name: string; aircraftIds?: number[] }[];
  selfId: number;
  tempUnit: TempUnit;
  nowMs: number;
  preselect?: number;
}) {
  const { mutate } = useSWRConfig();
  // Preselected, else the first in the list as shown (airfields by name, then registrations).
  const shown = [...aircraft].sort((x, y) => x.airfield.name.localeCompare(y.airfield.name) || x.registration.localeCompare(y.registration));
  const first = aircraft.find((a) => a.id === preselect) ?? shown[0];
  const tomorrowOf = (zone: string) => localDateKey(addDays(localDateOf(zone, nowMs), 1));
  const [form, setForm] = useState({
    aircraftId: first ? String(first.id) : '',
    pilotId: String(selfId),
    date: first ? tomorrowOf(first.airfield.timeZone) : '',
    time: '08:00',
    readyC: '',
    floorC: '',
    holdMinutes: '',
    notes: '',
  });
  const [fields, setFields] = useState<Record<string, string>>({});
  const [result, setResult] = useState<FormResult | null>(null);
  const [pending, setPending] = useState(false);
  const set = (k: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) => setForm((f) => ({ ...f, [k]: e.target.value }));

  const chosen = aircraft.find((a) => String(a.id) === form.aircraftId);
  const zone = chosen?.airfield.timeZone ?? 'UTC';
  // A pilot with a list of aircraft who is not on this one's list: a warning, not a refusal (the operator decides).
  const chosenPilot = pilots?.find((p) => String(p.id) === form.pilotId);
  const notListed = chosen && chosenPilot?.aircraftIds && !chosenPilot.aircraftIds.includes(chosen.id) ? { pilot: chosenPilot.name, registration: chosen.registration } : null;
  const groups = useMemo(() => {
    const m = new Map<number, { name: string; items: BookableAircraft[] }>();
    for (const a of aircraft) {
      const g = m.get(a.airfield.id) ?? { name: a.airfield.name, items: [] };
      g.items.push(a);
      m.set(a.airfield.id, g);
    }
    return [...m.values()].sort((x, y) => x.name.localeCompare(y.name));
  }, [aircraft]);

  async function onSubmit(e?: React.FormEvent) {
    e?.preventDefault();
    setPending(true);
    setResult(null);
    const body = {
      aircraftId: form.aircraftId === '' ? undefined : Number(form.aircraftId),
      ...(pilots ? { pilotId: Number(form.pilotId) } : {}),
      departAt: form.date && form.time ? `${form.date}T${form.time}` : '',
      readyC: toC(form.readyC, tempUnit),
      floorC: toC(form.floorC, tempUnit) ?? null,
      ...(form.holdMinutes.trim() === '' ? {} : { holdMinutes: form.holdMinutes.trim() }),
      notes: form.notes,
    };
    const r = await sendJson<{ departure: DepartureRecord }>('/api/departures', 'POST', body);
    setPending(false);
    if (r.ok) {
      const d = r.data.departure;
      setFields({});
      setResult({ tone: 'info', text: `Booked ${d.aircraft.registration} for ${formatDayTime(d.departAtMs, d.timeZone)} ${zoneLabel(d.timeZone, d.departAtMs)} at ${d.aircraft.airfield?.name ?? 'its airfield'}, oil at least ${fmtTemp(d.readyC, tempUnit)}.` });
      setForm((f) => ({ ...f, readyC: '', floorC: '', notes: '' }));
      await mutate((key) => typeof key === 'string' && key.startsWith(DEPARTURES_KEY));
    } else {
      setFields(r.fields);
      setResult({ tone: 'caution', text: r.message, retry: retryable(r.status) });
    }
  }

  const fieldErrors = Object.entries(fields);
  const readyHint = chosen
    ? `At least ${fmtTemp(chosen.classReadyC, tempUnit)} for its engine class; empty uses that. Raise it for warmer oil.`
    : 'The oil temperature needed at departure.';

  return (
    <Card aria-labelledby="book-h">
      <h2 id="book-h" tabIndex={-1} className="scroll-mt-20 text-lg font-semibold outline-none">Book a departure</h2>
      <p className="text-sm text-slate-600 dark:text-slate-400">The first flight of the day for one aircraft.</p>
      <form onSubmit={onSubmit} noValidate aria-busy={pending} className="mt-4 space-y-4">
        <SelectField id="dep-aircraftId" name="aircraftId" label="Aircraft" value={form.aircraftId} onChange={set('aircraftId')} error={fields.aircraftId} hint={chosen ? `${chosen.typeLabel} · ${chosen.shelterName}${chosen.heaterW ? '' : ' · no heater fitted'}` : undefined}>
          {aircraft.length === 0 ? <option value="">No aircraft you may book</option> : null}
          {groups.map((g) => (
            <optgroup key={g.name} label={g.name}>
              {g.items.map((a) => (
                <option key={a.id} value={a.id}>
                  {a.registration} — {a.typeLabel}
                </option>
              ))}
            </optgroup>
          ))}
        </SelectField>

        {pilots ? (
          <div>
            <SelectField id="dep-pilotId" name="pilotId" label="Pilot" value={form.pilotId} onChange={set('pilotId')} error={fields.pilotId}>
              {pilots.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.id === selfId ? `${p.name} (you)` : p.name}
                </option>
              ))}
            </SelectField>
            {notListed ? (
              <p id="dep-pilot-warning" role="status" className="mt-1.5 rounded-lg bg-amber-50 px-3 py-2 text-sm text-amber-900 ring-1 ring-inset ring-amber-600/30 dark:bg-amber-950 dark:text-amber-100">
                {notListed.pilot} is not listed as a pilot of {notListed.registration}. Check that they may fly it before you book; the aircraft&apos;s page lists its pilots.
              </p>
            ) : null}
          </div>
        ) : null}

        <fieldset aria-describedby={`dep-when-hint${fields.departAt ? ' dep-departAt-error' : ''}`}>
          <legend className="text-sm font-medium text-slate-800 dark:text-slate-200">Departure (local time)</legend>
          <div className="mt-1 grid grid-cols-[1.4fr_1fr] gap-3">
            <FieldShell id="dep-departAt" label="Date">
              <input
                id="dep-departAt"
                name="date"
                type="date"
                className={inputClass}
                value={form.date}
                min={localDateKey(localDateOf(zone, nowMs))}
                onChange={set('date')}
                aria-invalid={fields.departAt ? true : undefined}
              />
            </FieldShell>
            <FieldShell id="dep-time" label="Time">
              <input id="dep-time" name="time" type="time" step={300} className={inputClass} value={form.time} onChange={set('time')} aria-invalid={fields.departAt ? true : undefined} />
            </FieldShell>
          </div>
          <p id="dep-when-hint" className="mt-1 text-xs text-slate-500 dark:text-slate-400">
            At {chosen?.airfield.name ?? 'the airfield'}: {zone}, {zoneLabel(zone, nowMs)}.
          </p>
          {fields.departAt ? (
            <p id="dep-departAt-error" className="mt-1 text-sm font-medium text-red-700 dark:text-red-300">
              {fields.departAt}
            </p>
          ) : null}
        </fieldset>

        <div className="grid gap-3 sm:grid-cols-2">
          <TextField
            id="dep-readyC"
            name="readyC"
            label={`Ready temperature (${tempLabel(tempUnit)})`}
            inputMode="decimal"
            placeholder={chosen ? String(Math.round(toDisplayTemp(chosen.classReadyC, tempUnit))) : ''}
            value={form.readyC}
            onChange={set('readyC')}
            error={fields.readyC}
            hint={readyHint}
          />
          <TextField
            id="dep-floorC"
            name="floorC"
            label={`Overnight floor (${tempLabel(tempUnit)}, optional)`}
            inputMode="decimal"
            value={form.floorC}
            onChange={set('floorC')}
            error={fields.floorC}
            hint="Keep the oil at or above this all night."
          />
          <TextField
            id="dep-holdMinutes"
            name="holdMinutes"
            label="Start window (minutes, 0–120)"
            inputMode="numeric"
            placeholder="30"
            value={form.holdMinutes}
            onChange={set('holdMinutes')}
            error={fields.holdMinutes}
            hint="Ready from the departure time through this window (walk-round, oil check). The heater stays on until just before start; unplug before start. Empty: the organization's 30."
          />
        </div>

        <FieldShell id="dep-notes" label="Notes (optional)" error={fields.notes}>
          <textarea
            id="dep-notes"
            name="notes"
            rows={2}
            maxLength={500}
            className={`${inputClass} py-2`}
            value={form.notes}
            onChange={set('notes')}
            aria-invalid={fields.notes ? true : undefined}
            aria-describedby={fields.notes ? 'dep-notes-error' : undefined}
          />
        </FieldShell>

        <Button type="submit" disabled={pending || aircraft.length === 0} className="w-full">
          {pending ? 'Booking…' : 'Book departure'}
        </Button>
        <ResultNotice onRetry={() => void onSubmit()} result={result} okTitle="Booked" failTitle="Not booked" errors={fieldErrors.map(([f, m]) => ({ key: f, label: LABEL[f] ?? f, message: m }))} />
      </form>
    </Card>
  );
}
