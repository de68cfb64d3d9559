'use client';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useSWRConfig } from 'swr';
import { DEPARTURES_KEY } from './DepartureList';
import { typedTempC } from './temps';
import { Button, ButtonLink } from '@/components/ui/primitives';
import { ResultNotice, retryable, type FormResult } from '@/components/aircraft/ResultNotice';
import { FieldShell, SelectField, TextField, inputClass } from '@/components/ui/Field';
import { sendJson } from '@/lib/client/fetcher';
import { formatDayTime, formatTime, localDateKey, localDateOf, zoneLabel } from '@/lib/time';
import { tempLabel, toDisplayTemp, type TempUnit } from '@/lib/units';
import type { DepartureRecord } from '@/lib/views/departures';

const toC = typedTempC;
const shown = (c: number | null, unit: TempUnit) => (c === null ? '' : String(Math.round(toDisplayTemp(c, unit) * 10) / 10));

const LABEL: Record<string, string> = { pilotId: 'Pilot', departAt: 'Date and time', readyC: 'Ready temperature', floorC: 'Overnight floor', holdMinutes: 'Start window', notes: 'Notes' };

/** Change a booked departure: its local date and time, ready temperature, floor, notes and (for operators) the pilot. */
export function EditDepartureForm({ d, tempUnit, nowMs, pilots }: { d: DepartureRecord; tempUnit: TempUnit; nowMs: number; pilots?: { id: number; name: string }[] }) {
  const router = useRouter();
  const { mutate } = useSWRConfig();
  const zone = d.timeZone;
  const [form, setForm] = useState({
    date: d.localDate,
    time: formatTime(d.departAtMs, zone),
    readyC: shown(d.readyC, tempUnit),
    floorC: shown(d.floorC, tempUnit),
    holdMinutes: String(d.holdMinutes),
    notes: d.notes,
    pilotId: String(d.pilot.id),
  });
  const [fields, setFields] = useState<Record<string, string>>({});
  const [result, setResult] = useState<FormResult | null>(null);
  const [pending, setPending] = useState(false);
  const set = (k: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) => setForm((f) => ({ ...f, [k]: e.target.value }));

  async function submit(e?: React.FormEvent) {
    e?.preventDefault();
    setPending(true);
    setResult(null);
    const ready = toC(form.readyC, tempUnit);
    const r = await sendJson<{ departure: DepartureRecord }>(`/api/departures/${d.id}`, 'PATCH', {
      departAt: `${form.date}T${form.time}`,
      // An empty ready temperature keeps the stored one (it cannot go below the class's anyway).
      ...(ready === null ? {} : { readyC: ready }),
      floorC: toC(form.floorC, tempUnit),
      ...(form.holdMinutes.trim() === '' ? {} : { holdMinutes: form.holdMinutes.trim() }),
      notes: form.notes,
      ...(pilots ? { pilotId: Number(form.pilotId) } : {}),
    });
    setPending(false);
    if (r.ok) {
      setFields({});
      const nd = r.data.departure;
      setResult({ tone: 'info', text: `Saved: ${nd.aircraft.registration} departs ${formatDayTime(nd.departAtMs, nd.timeZone)} ${zoneLabel(nd.timeZone, nd.departAtMs)}. The heat plan is recomputed.` });
      // Every list of departures (and the plans on them) reads the change.
      await mutate((key) => typeof key === 'string' && key.startsWith(DEPARTURES_KEY));
      router.refresh();
    } else {
      setFields(r.fields);
      setResult({ tone: 'caution', text: r.message, retry: retryable(r.status) });
    }
  }

  const errors = Object.entries(fields).map(([f, m]) => ({ key: f, label: LABEL[f] ?? f, message: m }));
  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-describedby="edit-dep-hint">
      <p id="edit-dep-hint" className="text-sm text-slate-600 dark:text-slate-400">
        Times are local at {d.aircraft.airfield?.name ?? 'the airfield'} ({zone}, {zoneLabel(zone, nowMs)}).
      </p>
      {pilots ? (
        <SelectField id="edit-pilotId" name="pilotId" label="Pilot" value={form.pilotId} onChange={set('pilotId')} error={fields.pilotId}>
          {pilots.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </SelectField>
      ) : null}
      <div className="grid grid-cols-[1.4fr_1fr] gap-3">
        <FieldShell id="edit-date" label="Date" error={fields.departAt}>
          <input id="edit-date" type="date" className={inputClass} value={form.date} min={localDateKey(localDateOf(zone, nowMs))} onChange={set('date')} aria-invalid={fields.departAt ? true : undefined} />
        </FieldShell>
        <FieldShell id="edit-time" label="Time">
          <input id="edit-time" type="time" step={300} className={inputClass} value={form.time} onChange={set('time')} />
        </FieldShell>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField id="edit-readyC" label={`Ready temperature (${tempLabel(tempUnit)})`} inputMode="decimal" value={form.readyC} onChange={set('readyC')} error={fields.readyC} hint={
            d.lowestReadyC !== null
              ? `At least the engine class's ${shown(d.classReadyC, tempUnit)} ${tempLabel(tempUnit)}; an operator may lower it to the aircraft's ${shown(d.lowestReadyC, tempUnit)} ${tempLabel(tempUnit)} (recorded; follow the engine manual).${d.readyLowered ? ` Lowered by ${d.readyLowered.by}.` : ''}`
              : `At least the engine class's ${shown(d.classReadyC, tempUnit)} ${tempLabel(tempUnit)}.`
          } />
        <TextField id="edit-floorC" label={`Overnight floor (${tempLabel(tempUnit)}, optional)`} inputMode="decimal" value={form.floorC} onChange={set('floorC')} error={fields.floorC} hint="Empty: no floor." />
        <TextField id="edit-holdMinutes" label="Start window (minutes, 0–120)" inputMode="numeric" value={form.holdMinutes} onChange={set('holdMinutes')} error={fields.holdMinutes} hint="Ready through this window after the departure time; the heater stays on until just before start. Unplug before start." />
      </div>
      <FieldShell id="edit-notes" label="Notes (optional)" error={fields.notes}>
        <textarea id="edit-notes" rows={2} maxLength={500} className={`${inputClass} py-2`} value={form.notes} onChange={set('notes')} aria-invalid={fields.notes ? true : undefined} />
      </FieldShell>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : 'Save changes'}
        </Button>
        <ButtonLink href="/departures" variant="secondary">
          Back to departures
        </ButtonLink>
      </div>
      {/* The result sits right under the button that caused it. */}
      <ResultNotice onRetry={() => void submit()} result={result} okTitle="Saved" failTitle="Not saved" errors={errors} />
    </form>
  );
}
