'use client';
import { useRouter } from 'next/navigation';
import { signOut } from 'next-auth/react';
import { useState } from 'react';
import { Button } from '@/components/ui/primitives';
import { SelectField, TextField } from '@/components/ui/Field';
import { sendJson } from '@/lib/client/fetcher';
import { useSubmit } from '@/components/ui/useSubmit';
import { SubmitRow } from '@/components/ui/SubmitRow';

export function UnitsForm({ tempUnit, volumeUnit }: { tempUnit: 'C' | 'F'; volumeUnit: 'L' | 'qt' }) {
  const router = useRouter();
  const [t, setT] = useState(tempUnit);
  const [v, setV] = useState(volumeUnit);
  const [status, setStatus] = useState('');
  const [pending, setPending] = useState(false);
  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    const r = await sendJson('/api/me', 'PATCH', { tempUnit: t, volumeUnit: v });
    setPending(false);
    setStatus(r.ok ? 'Saved.' : r.message);
    if (r.ok) router.refresh();
  }
  return (
    <form onSubmit={onSubmit} className="space-y-4">
      <SelectField id="tempUnit" label="Temperature" value={t} onChange={(e) => setT(e.target.value as 'C' | 'F')}>
        <option value="C">Degrees Celsius (°C)</option>
        <option value="F">Degrees Fahrenheit (°F)</option>
      </SelectField>
      <SelectField id="volumeUnit" label="Oil quantity" value={v} onChange={(e) => setV(e.target.value as 'L' | 'qt')}>
        <option value="L">Litres (L)</option>
        <option value="qt">US quarts (qt)</option>
      </SelectField>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={pending}>{pending ? 'Saving…' : 'Save units'}</Button>
        <p role="status" aria-live="polite" className="text-sm text-slate-600 dark:text-slate-400">{status}</p>
      </div>
    </form>
  );
}

export function PasswordForm() {
  const [currentPassword, setCurrent] = useState('');
  const [newPassword, setNew] = useState('');
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState('');
  const [pending, setPending] = useState(false);
  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    const r = await sendJson('/api/me/password', 'POST', { currentPassword, newPassword });
    setPending(false);
    if (r.ok) {
      setFields({});
      setCurrent('');
      setNew('');
      // A new password ends every session of this account, this one too: sign in again with it.
      setStatus('Password changed. Sign in again with the new password.');
      await signOut({ callbackUrl: '/signin' });
    } else {
      setFields(r.fields);
      setStatus(r.message);
    }
  }
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <TextField id="currentPassword" label="Current password" type="password" autoComplete="current-password" value={currentPassword} onChange={(e) => setCurrent(e.target.value)} error={fields.currentPassword} />
      <TextField id="newPassword" label="New password" type="password" autoComplete="new-password" value={newPassword} onChange={(e) => setNew(e.target.value)} error={fields.newPassword} />
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={pending}>{pending ? 'Changing…' : 'Change password'}</Button>
        <p role="status" aria-live="polite" className="text-sm text-slate-600 dark:text-slate-400">{status}</p>
      </div>
    </form>
  );
}

/** Managers: the chance plans aim at and the start window new departures get. */
export function PlanningForm({ targetChance, holdMinutes }: { targetChance: number; holdMinutes: number }) {
  const router = useRouter();
  const [chance, setChance] = useState(String(Math.round(targetChance * 100)));
  const [hold, setHold] = useState(String(holdMinutes));
  const { fields, pending, status, canRetry, submit, retry } = useSubmit();
  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    const pct = Number(chance.trim().replace(',', '.'));
    await submit('/api/organization', 'PATCH', { targetChance: Number.isFinite(pct) ? pct / 100 : chance, holdMinutes: hold }, 'Saved. Plans are recomputed with the new settings.', () => router.refresh());
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <TextField
        id="org-targetChance"
        label="Plan to be ready with this chance (%)"
        inputMode="numeric"
        value={chance}
        onChange={(e) => setChance(e.target.value)}
        error={fields.targetChance}
        hint="50–99. Plans heat until the chance of being ready, counting the forecast, the aircraft model and the heater, reaches it."
      />
      <TextField
        id="org-holdMinutes"
        label="Start window for new departures (minutes)"
        inputMode="numeric"
        value={hold}
        onChange={(e) => setHold(e.target.value)}
        error={fields.holdMinutes}
        hint="0–120. Ready from the departure time through this window; the heater stays on until just before start."
      />
      <SubmitRow label="Save planning settings" pending={pending} status={status} canRetry={canRetry} onRetry={() => void retry()} />
    </form>
  );
}
