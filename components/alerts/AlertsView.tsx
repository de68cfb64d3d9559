'use client';
import useSWR, { useSWRConfig } from 'swr';
import { useState } from 'react';
import { Button, EmptyState, Notice } from '@/components/ui/primitives';
import { fetcher, sendJson } from '@/lib/client/fetcher';
import type { AlertView } from '@/lib/views/alerts';
import type { TempUnit } from '@/lib/units';
import { AlertCard } from './AlertCard';
import { UNREAD_KEY } from './UnreadBadge';

export interface AlertsData {
  alerts: AlertView[];
  unread: number;
  generatedAt: string;
}

const KEY = '/api/alerts';

/** The alerts list with its unread count, refreshed by SWR; acknowledge one or all. */
export function AlertsView({ initial, unit }: { initial: AlertsData; unit: TempUnit }) {
  const { data, mutate, error } = useSWR<AlertsData>(KEY, fetcher, { fallbackData: initial, refreshInterval: 30_000 });
  const { mutate: mutateKey } = useSWRConfig();
  const [pending, setPending] = useState<number | 'all' | null>(null);
  const [status, setStatus] = useState('');
  const list = data ?? initial;
  const nowMs = Date.parse(list.generatedAt);
  const open = list.alerts.filter((a) => !a.resolvedAt);
  const resolved = list.alerts.filter((a) => a.resolvedAt);
  const firstUnreadHeat = open.find((a) => !a.acknowledgedAt && a.kind !== 'cold-night')?.id;

  async function acknowledge(id: number, acknowledged: boolean) {
    setPending(id);
    const r = await sendJson<{ unread: number }>(`/api/alerts/${id}`, 'PATCH', { acknowledged });
    setPending(null);
    setStatus(r.ok ? (acknowledged ? 'Acknowledged.' : 'Marked unread.') : r.message);
    await mutate();
    await mutateKey(UNREAD_KEY);
  }

  async function acknowledgeAll() {
    setPending('all');
    const r = await sendJson<{ acknowledged: number }>('/api/alerts/acknowledge-all', 'POST', {});
    setPending(null);
    setStatus(r.ok ? `Acknowledged ${r.data.acknowledged}.` : r.message);
    await mutate();
    await mutateKey(UNREAD_KEY);
  }

  return (
    <section aria-labelledby="alerts-list-h" className="space-y-4">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="alerts-list-h" className="text-lg font-semibold text-slate-900 dark:text-white">
          <span data-testid="unread-count" className="tabular-nums">{list.unread}</span> unread
        </h2>
        {list.unread > 0 ? (
          <Button variant="secondary" className="ml-auto" disabled={pending === 'all'} onClick={acknowledgeAll}>
            {pending === 'all' ? 'Acknowledging…' : 'Acknowledge all'}
          </Button>
        ) : null}
      </div>
      <p role="status" aria-live="polite" className="sr-only">{status}</p>
      {error ? <Notice tone="caution">Could not refresh the alerts: {error.message}. Showing what was loaded last.</Notice> : null}
      {!open.length ? (
        <EmptyState title="No current alerts">
          When an engine will be too cold at departure, a heater needs switching on by hand, or a cold night is coming, it shows here and by e-mail.
        </EmptyState>
      ) : (
        open.map((a) => (
          <AlertCard key={a.id} alert={a} unit={unit} nowMs={nowMs} pending={pending === a.id} cautionsOpen={a.id === firstUnreadHeat} onAcknowledge={(ack) => acknowledge(a.id, ack)} />
        ))
      )}
      {resolved.length ? (
        <details className="rounded-2xl border border-slate-200 bg-white/60 p-4 dark:border-slate-800 dark:bg-slate-900/40">
          <summary className="cursor-pointer text-sm font-semibold text-slate-700 dark:text-slate-300">Resolved ({resolved.length})</summary>
          <div className="mt-3 space-y-3">
            {resolved.map((a) => (
              <AlertCard key={a.id} alert={a} unit={unit} nowMs={nowMs} pending={pending === a.id} onAcknowledge={(ack) => acknowledge(a.id, ack)} />
            ))}
          </div>
        </details>
      ) : null}
    </section>
  );
}
