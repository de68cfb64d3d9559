'use client';
import { useRouter } from 'next/navigation';
import { signOut } from 'next-auth/react';
import { useState } from 'react';
import { Button } from '@/components/ui/primitives';
import { SelectField, TextField } from '@/components/ui/Field';
import { sendJson } from '@/lib/client/fetcher';

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
