'use client';
// Recording an oil change, and (for operators and managers) the aircraft's oil-change interval.
import { useState } from 'react';
import { TextField } from '@/components/ui/Field';
import { localIsoMinutes } from '@/lib/weather/tz';
import { volumeLabel, type VolumeUnit } from '@/lib/units';
import type { OilLog } from '@/lib/views/oil';
import { useSubmit } from '@/components/ui/useSubmit';
import { SubmitRow } from '@/components/ui/SubmitRow';

export function OilChangeForm({ aircraftId, zone, currentHours, volumeUnit, onSaved }: { aircraftId: number; zone: string; currentHours: number | null; volumeUnit: VolumeUnit; onSaved: (log: OilLog) => void }) {
  const blank = () => ({ changedAt: localIsoMinutes(zone, Date.now()), engineHours: currentHours !== null ? String(currentHours) : '', oilGrade: '', quantity: '', notes: '' });
  const [form, setForm] = useState(blank);
  const { fields, status, pending, submit, canRetry, retry } = useSubmit();
  const set = (k: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement>) => setForm((f) => ({ ...f, [k]: e.target.value }));

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    await submit<{ id: number; oilLog: OilLog }>(`/api/aircraft/${aircraftId}/oil/changes`, 'POST', form, 'Oil change recorded.', (d) => {
      setForm(blank());
      onSaved(d.oilLog);
    });
  }

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField id="ch-changedAt" name="changedAt" label="When (airfield time)" type="datetime-local" value={form.changedAt} onChange={set('changedAt')} error={fields.changedAt} />
        <TextField id="ch-engineHours" name="engineHours" label="Engine hours" inputMode="decimal" value={form.engineHours} onChange={set('engineHours')} error={fields.engineHours} />
        <TextField id="ch-oilGrade" name="oilGrade" label="Oil grade" value={form.oilGrade} onChange={set('oilGrade')} error={fields.oilGrade} hint="e.g. SAE 15W-50" autoComplete="off" />
        <TextField id="ch-quantity" name="quantity" label={`Quantity filled (${volumeLabel(volumeUnit)})`} inputMode="decimal" value={form.quantity} onChange={set('quantity')} error={fields.quantity} />
      </div>
      <TextField id="ch-notes" name="notes" label="Notes" value={form.notes} onChange={set('notes')} error={fields.notes} autoComplete="off" />
      <SubmitRow label="Record oil change" pending={pending} status={status} canRetry={canRetry} onRetry={() => void retry()} variant="secondary" />
    </form>
  );
}

export function IntervalForm({ aircraftId, hours, months, onSaved }: { aircraftId: number; hours: number | null; months: number | null; onSaved: () => void }) {
  const [h, setH] = useState(hours !== null ? String(hours) : '');
  const [m, setM] = useState(months !== null ? String(months) : '');
  const { fields, status, pending, submit, canRetry, retry } = useSubmit();
  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    await submit(`/api/aircraft/${aircraftId}/oil/settings`, 'PATCH', { oilChangeIntervalHours: h, oilChangeIntervalMonths: m }, 'Interval saved.', () => onSaved());
  }

  return (
    <form onSubmit={onSubmit} className="space-y-3" noValidate>
      <div className="grid grid-cols-2 gap-3">
        <TextField id="int-hours" name="oilChangeIntervalHours" label="Every (engine hours)" inputMode="decimal" value={h} onChange={(e) => setH(e.target.value)} error={fields.oilChangeIntervalHours} />
        <TextField id="int-months" name="oilChangeIntervalMonths" label="Or every (months)" inputMode="numeric" value={m} onChange={(e) => setM(e.target.value)} error={fields.oilChangeIntervalMonths} />
      </div>
      <p className="text-xs text-slate-500 dark:text-slate-400">Whichever comes first. Leave one empty to use only the other. Follow the engine manufacturer&apos;s schedule.</p>
      <SubmitRow label="Save interval" pending={pending} status={status} canRetry={canRetry} onRetry={() => void retry()} variant="secondary" />
    </form>
  );
}
