'use client';
import Link from 'next/link';
import useSWR from 'swr';
import { useState } from 'react';
import { Button, Card, EmptyState, Notice, PageHeader } from '@/components/ui/primitives';
import { fetcher, sendJson } from '@/lib/client/fetcher';
import type { CapturedDetail, MailViewerData } from '@/lib/views/mail';
import { formatDay, formatTime } from '@/lib/time';

type MailListData = MailViewerData;

const KIND_LABEL: Record<string, string> = {
  'oil-too-cold': 'Oil-too-cold warning',
  'switch-on': 'Switch-on reminder',
  'cold-night': 'Cold-night notice',
  invite: 'Invitation',
  reset: 'Password reset',
  'address-in-use': 'Account notice',
};
const KIND_TONE: Record<string, string> = {
  'oil-too-cold': 'bg-red-50 text-red-800 dark:bg-red-950 dark:text-red-200',
  'switch-on': 'bg-ember-50 text-ember-800 dark:bg-ember-900/40 dark:text-ember-200',
  'cold-night': 'bg-ice-50 text-ice-900 dark:bg-ice-950 dark:text-ice-100',
};

const when = (iso: string, zone: string) => `${formatDay(Date.parse(iso), zone)} ${formatTime(Date.parse(iso), zone)}`;

function KindPill({ kind }: { kind: string | null }) {
  if (!kind) return null;
  return <span className={`rounded-full px-2 py-0.5 text-[11px] font-semibold ${KIND_TONE[kind] ?? 'bg-slate-100 text-slate-700 dark:bg-slate-800 dark:text-slate-200'}`}>{KIND_LABEL[kind] ?? kind}</span>;
}

/** Links in the captured message open in a new tab; nothing in it runs (sandboxed, no scripts). */
function withBase(html: string): string {
  const base = '<base target="_blank">';
  return /<head[^>]*>/i.test(html) ? html.replace(/<head[^>]*>/i, (m) => `${m}${base}`) : `${base}${html}`;
}

function Outbox({ outbox, zone, onRetry, retrying }: { outbox: MailListData['outbox']; zone: string; onRetry: () => void; retrying: boolean }) {
  const c = outbox.counts;
  const waiting = c.pending + c.sending;
  const stats: [string, number, string][] = [
    ['Waiting', waiting, 'text-slate-900 dark:text-white'],
    ['Sent', c.sent, 'text-slate-900 dark:text-white'],
    ['Failed', c.failed, c.failed ? 'text-red-700 dark:text-red-300' : 'text-slate-900 dark:text-white'],
    ['Not sent', c.expired + c.cancelled, 'text-slate-900 dark:text-white'],
  ];
  const failing = outbox.recent.filter((r) => r.lastError && r.status !== 'sent');
  return (
    <Card aria-labelledby="outbox-h" className="mb-4">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="outbox-h" className="text-sm font-semibold text-slate-900 dark:text-white">Outbox</h2>
        <dl className="flex flex-wrap gap-x-5 gap-y-1 text-sm">
          {stats.map(([label, n, tone]) => (
            <div key={label} className="flex items-baseline gap-1.5">
              <dt className="text-slate-500 dark:text-slate-400">{label}</dt>
              <dd className={`font-semibold tabular-nums ${tone}`}>{n}</dd>
            </div>
          ))}
        </dl>
        {c.failed ? (
          <Button variant="secondary" className="ml-auto" onClick={onRetry} disabled={retrying}>
            {retrying ? 'Queuing…' : 'Try the failed ones again'}
          </Button>
        ) : null}
      </div>
      {failing.length ? (
        <ul className="mt-3 space-y-1 text-xs text-slate-600 dark:text-slate-400">
          {failing.slice(0, 3).map((r) => (
            <li key={r.id}>
              <span className="font-medium text-slate-800 dark:text-slate-200">{r.subject}</span> to {r.to}: {r.lastError} ({r.attempts} attempt{r.attempts === 1 ? '' : 's'}
              {r.status === 'pending' ? `, next ${when(r.nextAttemptAt, zone)}` : ''})
            </li>
          ))}
        </ul>
      ) : null}
    </Card>
  );
}

function Message({ m, zone }: { m: CapturedDetail; zone: string }) {
  const [view, setView] = useState<'html' | 'text' | 'source'>(m.html ? 'html' : 'text');
  const tabs: [typeof view, string][] = [
    ['html', 'Rendered'],
    ['text', 'Plain text'],
    ['source', 'Source'],
  ];
  return (
    <Card aria-labelledby="msg-h" className="min-w-0">
      <Link href="/mail" className="mb-3 inline-flex min-h-11 items-center text-sm font-medium text-ice-800 hover:underline dark:text-ice-200 lg:hidden">
        ← All captured messages
      </Link>
      <div className="flex flex-wrap items-center gap-2">
        <KindPill kind={m.kind} />
      </div>
      <h2 id="msg-h" className="mt-2 text-lg font-semibold leading-snug text-slate-900 dark:text-white">{m.subject || '(no subject)'}</h2>
      <dl className="mt-2 grid grid-cols-[4.5rem_1fr] gap-x-3 gap-y-0.5 text-sm">
        <dt className="text-slate-500">From</dt>
        <dd className="break-all text-slate-800 dark:text-slate-200">{m.from}</dd>
        <dt className="text-slate-500">To</dt>
        <dd className="break-all text-slate-800 dark:text-slate-200">{m.to}</dd>
        <dt className="text-slate-500">Received</dt>
        <dd className="text-slate-800 dark:text-slate-200"><time dateTime={m.receivedAt}>{when(m.receivedAt, zone)}</time> · {(m.sizeBytes / 1024).toFixed(1)} KB</dd>
      </dl>
      {m.redacted ? (
        <p className="mt-3 rounded-xl border border-ice-200 bg-ice-50 p-3 text-sm text-slate-800 dark:border-ice-800 dark:bg-slate-900 dark:text-slate-200">
          Its single-use link is hidden: only the recipient may open it. If an invitation went astray, send a new one from Users.
        </p>
      ) : null}
      <div role="tablist" aria-label="How to show the message" className="mt-4 flex gap-1 rounded-xl bg-slate-100 p-1 dark:bg-slate-800">
        {tabs.map(([id, label]) => (
          <button
            key={id}
            role="tab"
            type="button"
            aria-selected={view === id}
            aria-controls={`msg-${id}`}
            onClick={() => setView(id)}
            disabled={id === 'html' && !m.html}
            className="min-h-10 flex-1 rounded-lg px-3 text-sm font-medium text-slate-700 aria-selected:bg-white aria-selected:text-slate-900 aria-selected:shadow-sm disabled:opacity-50 dark:text-slate-300 dark:aria-selected:bg-slate-950 dark:aria-selected:text-white"
          >
            {label}
          </button>
        ))}
      </div>
      <div id={`msg-${view}`} role="tabpanel" className="mt-3">
        {view === 'html' ? (
          <iframe title={`Rendered message: ${m.subject}`} sandbox="allow-popups allow-popups-to-escape-sandbox" srcDoc={withBase(m.html)} className="h-[75vh] min-h-[32rem] w-full rounded-xl border border-slate-200 bg-white dark:border-slate-700" />
        ) : (
          <pre className="max-h-[75vh] overflow-auto whitespace-pre-wrap break-words rounded-xl border border-slate-200 bg-slate-50 p-4 font-mono text-[13px] leading-relaxed text-slate-900 dark:border-slate-700 dark:bg-slate-950 dark:text-slate-100">
            {view === 'text' ? m.text || '(no plain-text part)' : m.raw}
          </pre>
        )}
      </div>
    </Card>
  );
}

/** The local mail capture for managers: what Thawline sent while no SMTP server is configured. */
export function MailViewer({ initial, selected }: { initial: MailListData; selected: CapturedDetail | null }) {
  const { data, mutate } = useSWR<MailListData>('/api/mail', fetcher, { fallbackData: initial, refreshInterval: 10_000 });
  const [retrying, setRetrying] = useState(false);
  const [status, setStatus] = useState('');
  const list = data ?? initial;

  async function retry() {
    setRetrying(true);
    const r = await sendJson<{ requeued: number }>('/api/mail/outbox/retry', 'POST');
    setRetrying(false);
    setStatus(r.ok ? `${r.data.requeued} message${r.data.requeued === 1 ? '' : 's'} queued again.` : r.message);
    await mutate();
  }

  return (
    <>
      <PageHeader
        title="Local mail capture"
        subtitle="Thawline's own SMTP capture on this server keeps every e-mail it sends instead of delivering it. You see the mail to people of your organization."
      />
      {list.transport === 'smtp' ? (
        <div className="mb-4">
          <Notice tone="info" title="Mail goes to a real SMTP server">SMTP_URL is set, so new e-mail is delivered there; this capture only shows what it received before.</Notice>
        </div>
      ) : null}
      <Outbox outbox={list.outbox} zone={list.timeZone} onRetry={retry} retrying={retrying} />
      <p role="status" aria-live="polite" className="sr-only">{status}</p>
      <div className="grid items-start gap-4 lg:grid-cols-[22rem_minmax(0,1fr)]">
        <nav aria-label="Captured messages" className={selected ? 'hidden lg:block' : ''}>
          {!list.messages.length ? (
            <EmptyState title="No mail captured yet">Alerts, invitations and password resets appear here as soon as they are sent.</EmptyState>
          ) : (
            <ul className="divide-y divide-slate-200 overflow-hidden rounded-2xl border border-slate-200 bg-white dark:divide-slate-800 dark:border-slate-800 dark:bg-slate-900">
              {list.messages.map((m) => {
                const active = selected?.id === m.id;
                return (
                  <li key={m.id}>
                    <Link
                      href={`/mail/${m.id}`}
                      aria-current={active ? 'page' : undefined}
                      className={`block min-h-11 px-4 py-3 text-sm hover:bg-slate-50 dark:hover:bg-slate-800 ${active ? 'bg-ice-50 dark:bg-ice-950' : ''}`}
                    >
                      <span className="flex items-center gap-2">
                        <KindPill kind={m.kind} />
                        <time dateTime={m.receivedAt} className="ml-auto shrink-0 text-xs text-slate-500">{when(m.receivedAt, list.timeZone)}</time>
                      </span>
                      <span className="mt-1 block font-medium leading-snug text-slate-900 dark:text-white">{m.subject || '(no subject)'}</span>
                      <span className="block truncate text-xs text-slate-500 dark:text-slate-400">To {m.to}</span>
                    </Link>
                  </li>
                );
              })}
            </ul>
          )}
        </nav>
        {selected ? (
          <Message key={selected.id} m={selected} zone={list.timeZone} />
        ) : list.messages.length ? (
          <div className="hidden lg:block">
            <EmptyState title="Choose a message">Its rendered HTML, plain text and source show here.</EmptyState>
          </div>
        ) : null}
      </div>
    </>
  );
}
