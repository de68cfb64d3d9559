import Link from 'next/link';
import type { ReactNode } from 'react';
import { Wordmark } from '@/components/ui/Logo';
import { can, ROLE_LABEL } from '@/lib/auth/permissions';
import type { CurrentUser } from '@/lib/auth/guards';
import { NAV } from './nav';
import { BottomNav, SideNav } from './NavLinks';
import { SignOutButton } from './SignOutButton';

export function AppShell({ user, orgName, children }: { user: CurrentUser; orgName: string; children: ReactNode }) {
  const items = NAV.filter((i) => can(user.role, i.permission));
  return (
    <div className="min-h-dvh lg:grid lg:grid-cols-[16rem_1fr]">
      <aside className="no-print hidden border-r border-slate-200 bg-white px-3 py-4 dark:border-slate-800 dark:bg-slate-900 lg:flex lg:flex-col lg:gap-6">
        <Link href="/" className="px-2">
          <Wordmark />
        </Link>
        <SideNav items={items} />
        <div className="mt-auto space-y-2 border-t border-slate-200 px-2 pt-4 text-sm dark:border-slate-800">
          <p className="font-medium text-slate-900 dark:text-white">{user.name}</p>
          <p className="text-slate-600 dark:text-slate-400">
            {ROLE_LABEL[user.role]} · {orgName}
          </p>
          <SignOutButton />
        </div>
      </aside>
      <div className="flex min-w-0 flex-col">
        <header className="no-print sticky top-0 z-30 flex items-center justify-between border-b border-slate-200 bg-white/95 px-4 py-2 backdrop-blur dark:border-slate-800 dark:bg-slate-950/95 lg:hidden">
          <Link href="/">
            <Wordmark />
          </Link>
          <div className="flex items-center gap-1">
            <span className="rounded-full bg-ice-100 px-2.5 py-1 text-xs font-semibold text-ice-900 dark:bg-ice-900 dark:text-ice-100">
              {ROLE_LABEL[user.role]}
            </span>
            <SignOutButton compact />
          </div>
        </header>
        <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 pb-28 pt-5 sm:px-6 lg:pb-10">
          {children}
        </main>
      </div>
      <BottomNav items={items} />
    </div>
  );
}
