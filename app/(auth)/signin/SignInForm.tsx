'use client';
import { signIn } from 'next-auth/react';
import { useState } from 'react';
import { Button, Card } from '@/components/ui/primitives';
import { TextField } from '@/components/ui/Field';

function messageFor(error: string | null | undefined): string {
  if (!error) return '';
  const m = /TooManyAttempts:(\d+)/.exec(error);
  if (m) {
    const seconds = Number(m[1]);
    if (seconds < 90) return `Several failed attempts on this account: wait ${seconds} second${seconds === 1 ? '' : 's'}, then try again.`;
    const minutes = Math.ceil(seconds / 60);
    return `Too many failed attempts. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`;
  }
  // The same words whether or not the address has an account.
  return 'That e-mail and password do not match an active account.';
}

export function SignInForm({ next, initialError }: { next?: string; initialError?: string }) {
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [error, setError] = useState(initialError ?? '');
  const [pending, setPending] = useState(false);

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    setError('');
    const res = await signIn('credentials', { email, password, redirect: false });
    if (!res || res.error || !res.ok) {
      setPending(false);
      setError(messageFor(res?.error ?? 'failed'));
      return;
    }
    window.location.assign(next ?? '/');
  }

  return (
    <Card className="p-6">
      <h1 className="text-xl font-semibold text-slate-900 dark:text-white">Sign in</h1>
      <p className="mt-1 text-sm text-slate-600 dark:text-slate-400">Use the account your club or operator set up for you.</p>
      <form onSubmit={onSubmit} className="mt-5 space-y-4" noValidate>
        <TextField id="email" label="E-mail" type="email" autoComplete="email" inputMode="email" required value={email} onChange={(e) => setEmail(e.target.value)} />
        <TextField id="password" label="Password" type="password" autoComplete="current-password" required value={password} onChange={(e) => setPassword(e.target.value)} />
        <div aria-live="polite" role="status" className="min-h-5 text-sm font-medium text-red-700 dark:text-red-300">
          {error}
        </div>
        <Button type="submit" className="w-full" disabled={pending || !email || !password}>
          {pending ? 'Signing in…' : 'Sign in'}
        </Button>
      </form>
      <p className="mt-4 text-center text-sm">
        <a href="/forgot" className="font-medium text-ice-700 underline-offset-2 hover:underline dark:text-ice-300">Forgot your password?</a>
      </p>
    </Card>
  );
}
