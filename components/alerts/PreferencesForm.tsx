'use client';
import { useState } from 'react';
import { useSWRConfig } from 'swr';
import { Button } from '@/components/ui/primitives';
import { SelectField, TextField } from '@/components/ui/Field';
import { sendJson } from '@/lib/client/fetcher';
import { ALERT_KIND_LABEL } from '@/lib/alerts/content';
import { CHANNEL_LABEL, MAX_LEAD_MINUTES, MIN_LEAD_MINUTES } from '@/lib/validation/alerts';
import type { PreferencesView } from '@/lib/views/alerts';

const HINT: Record<PreferencesView['kinds'][number], string> = {
  'oil-too-cold': 'When a departure you fly or look after will not be warm enough. Always shown here; it also goes in quiet hours.',
  'switch-on': 'Before a heater that is switched by hand must go on.',
  'cold-night': "In the evening, when tonight's forecast low is below your organization's threshold.",
};

interface FormState {
  oilTooCold: 'email' | 'app';
  switchOn: 'email' | 'app' | 'off';
  coldNight: 'email' | 'app' | 'off';
  emailEnabled: boolean;
  quiet: boolean;
  quietStart: string;
  quietEnd: string;
  timeZone: string;
  reminderLeadMinutes: string;
  tempUnit: 'C' | 'F';
}

function toForm(p: PreferencesView): FormState {
  return {
    oilTooCold: p.oilTooCold,
    switchOn: p.switchOn,
    coldNight: p.coldNight,
    emailEnabled: p.emailEnabled,
    quiet: !!(p.quietStart && p.quietEnd),
    quietStart: p.quietStart ?? '22:00',
    quietEnd: p.quietEnd ?? '06:00',
    timeZone: p.timeZone,
    reminderLeadMinutes: String(p.reminderLeadMinutes),
    tempUnit: p.tempUnit,
  };
}

/** Which alerts, e-mail on or off, quiet hours in local time, the reminder's lead, the temperature unit. */
export function PreferencesForm({ initial, zones }: { initial: PreferencesView; zones: string[] }) {
  const [form, setForm] = useState<FormState>(() => toForm(initial));
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState('');
  const [pending, setPending] = useState(false);
  const { mutate } = useSWRConfig();
  const set = <K extends keyof FormState>(k: K, v: FormState[K]) => setForm((f) => ({ ...f, [k]: v }));
  const kinds = initial.kinds;

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    const body = {
      oilTooCold: form.oilTooCold,
      ...(kinds.includes('switch-on') ? { switchOn: form.switchOn, reminderLeadMinutes: form.reminderLeadMinutes } : {}),
      ...(kinds.includes('cold-night') ? { coldNight: form.coldNight } : {}),
      emailEnabled: form.emailEnabled,
      quietStart: form.quiet ? form.quietStart : null,
      quietEnd: form.quiet ? form.quietEnd : null,
      timeZone: form.timeZone,
      tempUnit: form.tempUnit,
    };
    const r = await sendJson<PreferencesView>('/api/me/preferences', 'PATCH', body);
    setPending(false);
    if (r.ok) {
      setFields({});
      setForm(toForm(r.data));
      setStatus('Preferences saved.');
      await mutate('/api/alerts');
    } else {
      setFields(r.fields);
      setStatus(r.message);
    }
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5">
      <fieldset className="space-y-4">
        <legend className="text-sm font-semibold text-slate-900 dark:text-white">Which alerts, and how</legend>
        {kinds.includes('oil-too-cold') ? (
          <SelectField id="pref-oil" label={ALERT_KIND_LABEL['oil-too-cold']} value={form.oilTooCold} onChange={(e) => set('oilTooCold', e.target.value as FormState['oilTooCold'])} error={fields.oilTooCold} hint={HINT['oil-too-cold']}>
            <option value="email">{CHANNEL_LABEL.email}</option>
            <option value="app">{CHANNEL_LABEL.app}</option>
          </SelectField>
        ) : null}
        {kinds.includes('switch-on') ? (
          <>
            <SelectField id="pref-switch" label={ALERT_KIND_LABEL['switch-on']} value={form.switchOn} onChange={(e) => set('switchOn', e.target.value as FormState['switchOn'])} error={fields.switchOn} hint={HINT['switch-on']}>
              {(['email', 'app', 'off'] as const).map((c) => (
                <option key={c} value={c}>{CHANNEL_LABEL[c]}</option>
              ))}
            </SelectField>
            <TextField
              id="pref-lead"
              label="Remind me this many minutes before"
              type="number"
              inputMode="numeric"
              min={MIN_LEAD_MINUTES}
              max={MAX_LEAD_MINUTES}
              step={5}
              value={form.reminderLeadMinutes}
              onChange={(e) => set('reminderLeadMinutes', e.target.value)}
              error={fields.reminderLeadMinutes}
              hint={`Between ${MIN_LEAD_MINUTES} and ${MAX_LEAD_MINUTES} minutes; alerts are checked every 10 minutes.`}
              disabled={form.switchOn === 'off'}
            />
          </>
        ) : null}
        {kinds.includes('cold-night') ? (
          <SelectField id="pref-cold" label={ALERT_KIND_LABEL['cold-night']} value={form.coldNight} onChange={(e) => set('coldNight', e.target.value as FormState['coldNight'])} error={fields.coldNight} hint={HINT['cold-night']}>
            {(['email', 'app', 'off'] as const).map((c) => (
              <option key={c} value={c}>{CHANNEL_LABEL[c]}</option>
            ))}
          </SelectField>
        ) : null}
      </fieldset>

      <fieldset className="space-y-3">
        <legend className="text-sm font-semibold text-slate-900 dark:text-white">E-mail</legend>
        <label className="flex min-h-11 items-center gap-3 text-sm text-slate-800 dark:text-slate-200">
          <input type="checkbox" className="h-5 w-5 rounded border-slate-400 text-ice-700 focus:ring-ice-300" checked={form.emailEnabled} onChange={(e) => set('emailEnabled', e.target.checked)} />
          Send me alert e-mails
        </label>
        <label className="flex min-h-11 items-center gap-3 text-sm text-slate-800 dark:text-slate-200">
          <input type="checkbox" className="h-5 w-5 rounded border-slate-400 text-ice-700 focus:ring-ice-300" checked={form.quiet} onChange={(e) => set('quiet', e.target.checked)} />
          Quiet hours
        </label>
        {form.quiet ? (
          <div className="space-y-3 rounded-xl bg-slate-50 p-3 dark:bg-slate-800/50">
            <div className="grid grid-cols-2 gap-3">
              <TextField id="pref-quiet-start" label="From" type="time" value={form.quietStart} onChange={(e) => set('quietStart', e.target.value)} error={fields.quietStart} />
              <TextField id="pref-quiet-end" label="Until" type="time" value={form.quietEnd} onChange={(e) => set('quietEnd', e.target.value)} error={fields.quietEnd} />
            </div>
            <SelectField id="pref-zone" label="In the time zone" value={form.timeZone} onChange={(e) => set('timeZone', e.target.value)} error={fields.timeZone}>
              {(zones.includes(form.timeZone) ? zones : [form.timeZone, ...zones]).map((z) => (
                <option key={z} value={z}>{z.replace(/_/g, ' ')}</option>
              ))}
            </SelectField>
            <p className="text-xs text-slate-600 dark:text-slate-400">
              Reminders and notices wait until the quiet hours end (a reminder that would come too late is shown here only). The oil-too-cold warning still goes.
            </p>
          </div>
        ) : null}
      </fieldset>

      <SelectField id="pref-unit" label="Temperatures in alerts and e-mails" value={form.tempUnit} onChange={(e) => set('tempUnit', e.target.value as FormState['tempUnit'])} error={fields.tempUnit} hint="The same unit as everywhere else in Thawline.">
        <option value="C">°C</option>
        <option value="F">°F</option>
      </SelectField>

      <div className="flex items-center gap-3">
        <Button type="submit" disabled={pending}>{pending ? 'Saving…' : 'Save preferences'}</Button>
        <p role="status" aria-live="polite" className="text-sm text-slate-600 dark:text-slate-400">{status}</p>
      </div>
    </form>
  );
}
