'use client';
import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { useState } from 'react';
import { UnreadBadge } from '@/components/alerts/UnreadBadge';
import { Icon } from './Icon';
import type { NavItem } from './nav';

function isActive(pathname: string, href: string) {
  return pathname === href || pathname.startsWith(href + '/');
}

/** Desktop: the side rail. */
export function SideNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  return (
    <nav aria-label="Sections" className="flex flex-col gap-1">
      {items.map((it) => {
        const active = isActive(pathname, it.href);
        return (
          <Link
            key={it.href}
            href={it.href}
            aria-current={active ? 'page' : undefined}
            className={`flex min-h-11 items-center gap-3 rounded-xl px-3 text-sm font-medium transition ${
              active
                ? 'bg-ice-100 text-ice-900 dark:bg-ice-900/60 dark:text-ice-50'
                : 'text-slate-700 hover:bg-slate-100 dark:text-slate-300 dark:hover:bg-slate-800'
            }`}
          >
            <Icon name={it.icon} />
            {it.label}
            {it.badge === 'alerts' ? <UnreadBadge /> : null}
          </Link>
        );
      })}
    </nav>
  );
}

/** Phone: a bottom bar within thumb reach, with the rest of the sections under "More". */
export function BottomNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  const [open, setOpen] = useState(false);
  const primary = items.filter((i) => i.primary).slice(0, 4);
  const rest = items.filter((i) => !primary.includes(i));
  return (
    <>
      {open ? (
        <div className="fixed inset-0 z-40 bg-slate-950/40" onClick={() => setOpen(false)} aria-hidden="true" />
      ) : null}
      {open ? (
        <nav
          id="more-sections"
          aria-label="More sections"
          className="fixed inset-x-2 bottom-[4.75rem] z-50 grid grid-cols-2 gap-1 rounded-2xl border border-slate-200 bg-white p-2 shadow-xl dark:border-slate-700 dark:bg-slate-900"
        >
          {rest.map((it) => (
            <Link
              key={it.href}
              href={it.href}
              onClick={() => setOpen(false)}
              aria-current={isActive(pathname, it.href) ? 'page' : undefined}
              className="flex min-h-12 items-center gap-2 rounded-xl px-3 text-sm font-medium text-slate-800 hover:bg-slate-100 aria-[current=page]:bg-ice-100 dark:text-slate-100 dark:hover:bg-slate-800 dark:aria-[current=page]:bg-ice-900"
            >
              <Icon name={it.icon} />
              {it.label}
            </Link>
          ))}
        </nav>
      ) : null}
      <nav
        aria-label="Main sections"
        className="no-print fixed inset-x-0 bottom-0 z-50 border-t border-slate-200 bg-white/95 pb-[env(safe-area-inset-bottom)] backdrop-blur dark:border-slate-800 dark:bg-slate-950/95 lg:hidden"
      >
        <ul className="grid grid-cols-5">
          {primary.map((it) => {
            const active = isActive(pathname, it.href);
            return (
              <li key={it.href}>
                <Link
                  href={it.href}
                  aria-current={active ? 'page' : undefined}
                  className={`flex min-h-16 flex-col items-center justify-center gap-1 text-[11px] font-medium ${
                    active ? 'text-ice-700 dark:text-ice-300' : 'text-slate-600 dark:text-slate-400'
                  }`}
                >
                  <span className="relative">
                    <Icon name={it.icon} className="h-6 w-6" />
                    {it.badge === 'alerts' ? <UnreadBadge compact /> : null}
                  </span>
                  <span className="max-w-full truncate px-1">{it.label.replace('Morning board', 'Board')}</span>
                </Link>
              </li>
            );
          })}
          <li>
            <button
              type="button"
              aria-expanded={open}
              aria-controls="more-sections"
              onClick={() => setOpen((o) => !o)}
              className="flex min-h-16 w-full flex-col items-center justify-center gap-1 text-[11px] font-medium text-slate-600 dark:text-slate-400"
            >
              <Icon name="more" className="h-6 w-6" />
              More
            </button>
          </li>
        </ul>
      </nav>
    </>
  );
}
