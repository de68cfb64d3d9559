'use client';
import { signIn } from 'next-auth/react';
import { useState } from 'react';
import { Button, Card } from '@/components/ui/primitives';
import { TextField } from '@/components/ui/Field';
import { sendJson } from '@/lib/client/fetcher';

/**
 * Choosing a password with a single-use token (invitation or reset): on success the person is signed
 * in with the new password and taken to their home page.
 */
export function NewPasswordForm({
  token,
  endpoint,
  email,
  title,
  intro,
  submitLabel,
  askName,
}: {
  token: string;
  endpoint: '/api/tokens/invite' | '/api/tokens/reset';
  email: string;
  title: string;
  intro: string;
  submitLabel: string;
  askName?: string;
}) {
  const [name, setName] = useState(askName ?? '');
  const [password, setPassword] = useState('');
  const [confirm, setConfirm] = useState('');
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState('');
  const [pending, setPending] = useState(false);
  const [done, setDone] = useState(false);

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    setStatus('');
    const r = await sendJson<{ email: string }>(endpoint, 'POST', { token, password, confirm, ...(askName !== undefined ? { name } : {}) });
    if (!r.ok) {
      setPending(false);
      setFields(r.fields);
      setStatus(r.fields.token ?? r.message);
      return;
    }
    setFields({});
    setDone(true);
    setStatus('Password saved. Signing you in…');
    const s = await signIn('credentials', { email: r.data.email, password, redirect: false });
    if (s?.ok && !s.error) window.location.assign('/');
    else {
      setPending(false);
      setStatus('Password saved. Sign in with it now.');
    }
  }

  return (
    <Card className="p-6">
      <h1 className="text-xl font-semibold text-slate-900 dark:text-white">{title}</h1>
      <p className="mt-1 text-sm text-slate-600 dark:text-slate-400">{intro}</p>
      <p className="mt-3 rounded-xl bg-ice-50 px-3 py-2 text-sm text-ice-900 dark:bg-ice-950 dark:text-ice-100">
        Account: <span className="font-semibold">{email}</span>
      </p>
      <form onSubmit={onSubmit} className="mt-5 space-y-4" noValidate>
        {askName !== undefined ? <TextField id="name" label="Your name" autoComplete="name" value={name} onChange={(e) => setName(e.target.value)} error={fields.name} /> : null}
        <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
        <TextField id="password" label="New password" type="password" autoComplete="new-password" value={password} onChange={(e) => setPassword(e.target.value)} error={fields.password} hint="At least 10 characters." />
        <TextField id="confirm" label="Repeat the password" type="password" autoComplete="new-password" value={confirm} onChange={(e) => setConfirm(e.target.value)} error={fields.confirm} />
        <div role="status" aria-live="polite" className={`min-h-5 text-sm font-medium ${done ? 'text-ice-800 dark:text-ice-200' : 'text-red-700 dark:text-red-300'}`}>
          {status}
        </div>
        <Button type="submit" className="w-full" disabled={pending || done || !password}>
          {pending ? 'Saving…' : submitLabel}
        </Button>
        {done && !pending ? (
          <a href="/signin" className="block text-center text-sm font-medium text-ice-800 underline dark:text-ice-200">
            Go to sign-in
          </a>
        ) : null}
      </form>
    </Card>
  );
}

/** Why a token link cannot be used, with the way on. */
export function TokenProblem({ title, message, action }: { title: string; message: string; action: { href: string; label: string } }) {
  return (
    <Card className="p-6">
      <h1 className="text-xl font-semibold text-slate-900 dark:text-white">{title}</h1>
      <p role="alert" className="mt-2 text-sm text-slate-700 dark:text-slate-300">{message}</p>
      <a href={action.href} className="mt-5 inline-flex min-h-11 w-full items-center justify-center rounded-xl bg-ice-700 px-4 text-sm font-semibold text-white hover:bg-ice-800 dark:bg-ice-500 dark:text-slate-950">
        {action.label}
      </a>
    </Card>
  );
}
