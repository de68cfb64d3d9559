'use client';
import useSWR from 'swr';
import { fetcher } from '@/lib/client/fetcher';

export const UNREAD_KEY = '/api/alerts/unread';

/** The unread alerts count beside the Alerts section (refreshed every minute and after acknowledging). */
export function UnreadBadge({ compact = false }: { compact?: boolean }) {
  const { data } = useSWR<{ unread: number }>(UNREAD_KEY, fetcher, { refreshInterval: 60_000, shouldRetryOnError: false });
  const n = data?.unread ?? 0;
  if (!n) return null;
  const label = `${n} unread`;
  return compact ? (
    <span className="absolute -right-2 -top-1 min-w-5 rounded-full bg-ember-600 px-1 text-center text-[10px] font-bold leading-5 text-white ring-2 ring-white dark:ring-slate-950" aria-label={label}>
      {n > 99 ? '99+' : n}
    </span>
  ) : (
    <span className="ml-auto rounded-full bg-ember-600 px-2 py-0.5 text-xs font-bold tabular-nums text-white" aria-label={label}>
      {n > 99 ? '99+' : n}
    </span>
  );
}
