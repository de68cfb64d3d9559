'use client';
// Recording a cold oil check in the person's units, with the level corrected to 15 °C shown as they type.
import { useState } from 'react';
import { TextField } from '@/components/ui/Field';
import { correctedLevelL, correctionFraction } from '@/lib/oil/level';
import { localIsoMinutes } from '@/lib/weather/tz';
import { fromDisplayTemp, fromDisplayVolume, tempLabel, volumeLabel, type TempUnit, type VolumeUnit } from '@/lib/units';
import type { OilLog } from '@/lib/views/oil';
import { fmtLevel, fmtPercent } from './format';
import { useSubmit } from '@/components/ui/useSubmit';
import { SubmitRow } from '@/components/ui/SubmitRow';

const EMPTY = { level: '', oilTemp: '', outsideTemp: '', bladesTurned: '', engineHours: '', added: '', notes: '' };
const num = (s: string) => Number(s.trim().replace(',', '.').replace('\u2212', '-'));

export function OilCheckForm({ aircraftId, zone, drySump, tempUnit, volumeUnit, onSaved }: { aircraftId: number; zone: string; drySump: boolean; tempUnit: TempUnit; volumeUnit: VolumeUnit; onSaved: (log: OilLog) => void }) {
  const [form, setForm] = useState({ ...EMPTY, checkedAt: localIsoMinutes(zone, Date.now()) });
  const { fields, status, pending, submit, canRetry, retry } = useSubmit();
  const set = (k: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement>) => setForm((f) => ({ ...f, [k]: e.target.value }));
  const tl = tempLabel(tempUnit);
  const vl = volumeLabel(volumeUnit);

  const lv = num(form.level);
  const ot = num(form.oilTemp);
  const live =
    form.level.trim() && form.oilTemp.trim() && Number.isFinite(lv) && Number.isFinite(ot) && lv > 0
      ? (() => {
          const c = fromDisplayTemp(ot, tempUnit);
          return `At 15 °C this reads ${fmtLevel(correctedLevelL(fromDisplayVolume(lv, volumeUnit), c), volumeUnit)} (${fmtPercent(correctionFraction(c))}).`;
        })()
      : `Readings are compared corrected to 15 °C (the oil expands about 0.07 % per kelvin).`;

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    const body: Record<string, string> = {};
    for (const [k, v] of Object.entries(form)) if (v.trim() !== '' || k === 'level' || k === 'oilTemp' || k === 'outsideTemp') body[k] = v;
    await submit<{ id: number; oilLog: OilLog }>(`/api/aircraft/${aircraftId}/oil/checks`, 'POST', body, 'Oil check recorded.', (d) => {
      setForm({ ...EMPTY, checkedAt: localIsoMinutes(zone, Date.now()) });
      onSaved(d.oilLog);
    });
  }

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate aria-describedby="oil-live">
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField id="oc-checkedAt" name="checkedAt" label="Time of the check (airfield time)" type="datetime-local" value={form.checkedAt} onChange={set('checkedAt')} error={fields.checkedAt} required />
        <TextField id="oc-level" name="level" label={`Dipstick level (${vl})`} inputMode="decimal" value={form.level} onChange={set('level')} error={fields.level} required />
        <TextField id="oc-oilTemp" name="oilTemp" label={`Oil temperature (${tl})`} inputMode="decimal" value={form.oilTemp} onChange={set('oilTemp')} error={fields.oilTemp} hint="Best read cold, before the first flight." required />
        <TextField id="oc-outsideTemp" name="outsideTemp" label={`Outside temperature (${tl})`} inputMode="decimal" value={form.outsideTemp} onChange={set('outsideTemp')} error={fields.outsideTemp} required />
        <TextField
          id="oc-bladesTurned"
          name="bladesTurned"
          label="Blade turns until the oil returned"
          inputMode="numeric"
          value={form.bladesTurned}
          onChange={set('bladesTurned')}
          error={fields.bladesTurned}
          hint={drySump ? 'Dry-sump engine: count the blades turned by hand until the oil gurgled back.' : 'For dry-sump engines; leave empty otherwise.'}
        />
        <TextField id="oc-engineHours" name="engineHours" label="Engine hours" inputMode="decimal" value={form.engineHours} onChange={set('engineHours')} error={fields.engineHours} hint="Needed for oil used per hour." />
        <TextField id="oc-added" name="added" label={`Oil added after the check (${vl})`} inputMode="decimal" value={form.added} onChange={set('added')} error={fields.added} />
        <TextField id="oc-notes" name="notes" label="Notes" value={form.notes} onChange={set('notes')} error={fields.notes} autoComplete="off" />
      </div>
      <p id="oil-live" className="rounded-lg bg-ice-50 px-3 py-2 text-sm text-ice-900 dark:bg-ice-950 dark:text-ice-100" aria-live="polite">
        {live}
      </p>
      <SubmitRow label="Record oil check" pending={pending} status={status} canRetry={canRetry} onRetry={() => void retry()} className="w-full sm:w-auto" />
    </form>
  );
}
