'use client';
import useSWR from 'swr';
import { useState } from 'react';
import { Button, Card, EmptyState, Notice } from '@/components/ui/primitives';
import { SelectField } from '@/components/ui/Field';
import { fetcher, sendJson } from '@/lib/client/fetcher';
import type { FeedRow } from '@/lib/data/calendar';

export function CalendarFeeds({ initial, airfields }: { initial: FeedRow[]; airfields: { id: number; name: string }[] }) {
  const { data, mutate } = useSWR<{ feeds: FeedRow[] }>('/api/calendar-feeds', fetcher, { fallbackData: { feeds: initial } });
  const [airfield, setAirfield] = useState('');
  const [created, setCreated] = useState<string | null>(null);
  const [status, setStatus] = useState('');
  const feeds = data?.feeds ?? initial;

  async function create(e: React.FormEvent) {
    e.preventDefault();
    const r = await sendJson<{ url: string }>('/api/calendar-feeds', 'POST', airfield ? { airfieldId: Number(airfield) } : {});
    if (r.ok) {
      setCreated(r.data.url);
      setStatus('Feed created. Copy the address now: it is shown only once.');
      mutate();
    } else setStatus(r.message);
  }
  async function revoke(id: number) {
    const r = await sendJson(`/api/calendar-feeds/${id}`, 'DELETE');
    setStatus(r.ok ? 'Feed revoked: calendars using it stop updating.' : r.message);
    mutate();
  }

  return (
    <div className="grid gap-4 lg:grid-cols-[22rem_1fr]">
      <Card aria-labelledby="new-feed-h">
        <h2 id="new-feed-h" className="text-base font-semibold">New feed</h2>
        <form onSubmit={create} className="mt-3 space-y-4">
          <SelectField id="feed-airfield" label="Airfield" value={airfield} onChange={(e) => setAirfield(e.target.value)}>
            <option value="">All airfields</option>
            {airfields.map((a) => (
              <option key={a.id} value={a.id}>{a.name}</option>
            ))}
          </SelectField>
          <Button type="submit" className="w-full">Create feed address</Button>
        </form>
        <p role="status" aria-live="polite" className="mt-3 text-sm text-slate-600 dark:text-slate-400">{status}</p>
        {created ? (
          <div className="mt-2 space-y-2">
            <label htmlFor="feed-url" className="text-sm font-medium">Feed address (secret)</label>
            <input id="feed-url" readOnly value={created} className="block w-full rounded-xl border border-slate-300 bg-slate-50 px-3 py-2 font-mono text-xs dark:border-slate-700 dark:bg-slate-950" onFocus={(e) => e.currentTarget.select()} />
            <Notice tone="caution">Anyone with this address sees your switch-on times. Revoke it if it leaks.</Notice>
          </div>
        ) : null}
      </Card>
      <Card aria-labelledby="feeds-h" className="p-0 sm:p-0">
        <h2 id="feeds-h" className="border-b border-slate-200 px-4 py-3 text-base font-semibold dark:border-slate-800">Your feeds</h2>
        {feeds.length ? (
          <ul className="divide-y divide-slate-200 dark:divide-slate-800">
            {feeds.map((f) => (
              <li key={f.id} className="flex items-center justify-between gap-3 px-4 py-3 text-sm">
                <div>
                  <div className="font-medium">{f.airfield?.name ?? 'All airfields'}</div>
                  <div className="text-xs text-slate-500">Created {new Date(f.createdAt).toLocaleString('en-GB')}{f.revokedAt ? ' · revoked' : ''}</div>
                </div>
                {f.revokedAt ? null : (
                  <Button variant="danger" className="min-h-10 px-3" onClick={() => revoke(f.id)}>
                    Revoke<span className="sr-only"> the feed for {f.airfield?.name ?? 'all airfields'}</span>
                  </Button>
                )}
              </li>
            ))}
          </ul>
        ) : (
          <div className="p-4">
            <EmptyState title="No feeds yet">Create one to see switch-on times in your calendar.</EmptyState>
          </div>
        )}
      </Card>
    </div>
  );
}
