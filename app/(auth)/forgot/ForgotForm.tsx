'use client';
import { useState } from 'react';
import { Button, Card } from '@/components/ui/primitives';
import { TextField } from '@/components/ui/Field';
import { sendJson } from '@/lib/client/fetcher';

export function ForgotForm() {
  const [email, setEmail] = useState('');
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState('');
  const [sent, setSent] = useState(false);
  const [pending, setPending] = useState(false);

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    const r = await sendJson<{ message: string }>('/api/tokens/reset-request', 'POST', { email });
    setPending(false);
    if (r.ok) {
      setFields({});
      setSent(true);
      setStatus(r.data.message);
    } else {
      setFields(r.fields);
      setStatus(r.fields.email ? '' : r.message);
    }
  }

  return (
    <Card className="p-6">
      <h1 className="text-xl font-semibold text-slate-900 dark:text-white">Forgot your password?</h1>
      <p className="mt-1 text-sm text-slate-600 dark:text-slate-400">Enter the e-mail address of your account. We send a link to choose a new password.</p>
      <form onSubmit={onSubmit} className="mt-5 space-y-4" noValidate>
        <TextField id="email" label="E-mail" type="email" autoComplete="email" inputMode="email" value={email} onChange={(e) => setEmail(e.target.value)} error={fields.email} />
        <div role="status" aria-live="polite" className="min-h-5 text-sm font-medium text-ice-900 dark:text-ice-100">
          {status}
        </div>
        <Button type="submit" className="w-full" disabled={pending || !email}>
          {pending ? 'Sending…' : sent ? 'Send another link' : 'Send the reset link'}
        </Button>
        <a href="/signin" className="block text-center text-sm font-medium text-ice-800 underline dark:text-ice-200">
          Back to sign-in
        </a>
      </form>
    </Card>
  );
}
