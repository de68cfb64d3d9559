'use client';
import { signOut } from 'next-auth/react';
import { Icon } from './Icon';

export function SignOutButton({ compact = false }: { compact?: boolean }) {
  return (
    <button
      type="button"
      onClick={() => signOut({ callbackUrl: '/signin' })}
      className="inline-flex min-h-11 items-center gap-2 rounded-xl px-3 text-sm font-medium text-slate-700 hover:bg-slate-100 dark:text-slate-300 dark:hover:bg-slate-800"
    >
      <Icon name="signout" />
      {compact ? <span className="sr-only">Sign out</span> : 'Sign out'}
    </button>
  );
}
