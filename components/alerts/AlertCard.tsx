'use client';
import Link from 'next/link';
import { Button } from '@/components/ui/primitives';
import { ALERT_KIND_LABEL, describeAlert, type ColdNightData, type OilTooColdData, type SwitchOnData } from '@/lib/alerts/content';
import { CAUTIONS } from '@/lib/alerts/safety';
import { formatDayTime, formatTime } from '@/lib/time';
import type { AlertView } from '@/lib/views/alerts';
import type { TempUnit } from '@/lib/units';

const ACCENT: Record<AlertView['kind'], string> = {
  'oil-too-cold': 'border-l-red-600 dark:border-l-red-400',
  'switch-on': 'border-l-ember-500',
  'cold-night': 'border-l-ice-500',
};
const PILL: Record<AlertView['kind'], string> = {
  'oil-too-cold': 'bg-red-50 text-red-800 ring-red-600/30 dark:bg-red-950 dark:text-red-200',
  'switch-on': 'bg-ember-50 text-ember-800 ring-ember-600/30 dark:bg-ember-900/40 dark:text-ember-200',
  'cold-night': 'bg-ice-50 text-ice-900 ring-ice-600/30 dark:bg-ice-950 dark:text-ice-100',
};
const LINK_LABEL: Record<string, string> = { '/departures': 'Open your departures', '/board': 'Open the Morning board' };

export function zoneOf(a: AlertView): string {
  return a.kind === 'cold-night' ? (a.data as ColdNightData).timeZone : (a.data as OilTooColdData | SwitchOnData).airfield.timeZone;
}

function emailLine(a: AlertView): string {
  const z = zoneOf(a);
  const t = (iso: string | null) => (iso ? formatDayTime(Date.parse(iso), z) : '');
  switch (a.email.state) {
    case 'sent':
      return `E-mail sent ${t(a.email.at)}`;
    case 'queued':
      return 'E-mail on its way';
    case 'held':
      return `E-mail held for your quiet hours, goes ${t(a.email.at)}`;
    case 'failed':
      return 'E-mail could not be delivered';
    case 'not-sent':
      return 'E-mail not sent';
    default:
      return 'Shown in the app only';
  }
}

/** One alert: what it says in the reader's units and the airfield's time, what would fix it, the cautions. */
export function AlertCard({
  alert,
  unit,
  nowMs,
  onAcknowledge,
  pending,
  cautionsOpen = false,
}: {
  alert: AlertView;
  unit: TempUnit;
  nowMs: number;
  onAcknowledge: (ack: boolean) => void;
  pending: boolean;
  /** The first unread warning shows its safety lines open; the others keep them folded. */
  cautionsOpen?: boolean;
}) {
  const d = describeAlert(alert.kind, alert.data, { unit, audience: alert.audience, nowMs });
  const read = !!alert.acknowledgedAt;
  const resolved = !!alert.resolvedAt;
  const z = zoneOf(alert);
  const headingId = `alert-${alert.id}-h`;
  return (
    <article
      id={`alert-${alert.id}`}
      aria-labelledby={headingId}
      className={`rounded-2xl border border-l-4 border-slate-200 bg-white p-4 shadow-sm dark:border-slate-800 dark:bg-slate-900 sm:p-5 ${ACCENT[alert.kind]} ${read || resolved ? 'opacity-80' : ''}`}
    >
      <div className="flex flex-wrap items-center gap-2 text-xs">
        <span className={`rounded-full px-2 py-0.5 font-semibold ring-1 ring-inset ${PILL[alert.kind]}`}>{ALERT_KIND_LABEL[alert.kind]}</span>
        {alert.revision > 1 ? <span className="rounded-full bg-slate-100 px-2 py-0.5 font-semibold text-slate-700 dark:bg-slate-800 dark:text-slate-200">Updated</span> : null}
        {resolved ? <span className="rounded-full bg-teal-50 px-2 py-0.5 font-semibold text-teal-800 dark:bg-teal-950 dark:text-teal-200">Resolved</span> : null}
        {!read && !resolved ? (
          <span className="inline-flex items-center gap-1 font-semibold text-ember-700 dark:text-ember-300">
            <span aria-hidden="true" className="h-2 w-2 rounded-full bg-ember-600" />
            Unread
          </span>
        ) : null}
        <span className="ml-auto text-slate-500 dark:text-slate-400">
          <time dateTime={alert.createdAt}>{formatDayTime(Date.parse(alert.createdAt), z)}</time>
        </span>
      </div>
      <h3 id={headingId} className="mt-2 text-lg font-semibold leading-snug text-slate-900 dark:text-white">
        {d.title}
      </h3>
      {resolved ? (
        <p className="mt-1 text-sm font-medium text-teal-800 dark:text-teal-200">
          {alert.kind === 'oil-too-cold' ? `No longer short: the plan is on track or the departure changed (${formatTime(Date.parse(alert.resolvedAt!), z)}).` : 'No longer current.'}
        </p>
      ) : null}
      {d.intro.map((p, i) => (
        <p key={i} className="mt-2 text-sm text-slate-700 dark:text-slate-300">
          {p}
        </p>
      ))}
      <dl className="mt-3 grid gap-x-6 gap-y-1.5 text-sm sm:grid-cols-2">
        {d.facts.map((f) => (
          <div key={f.label} className="flex justify-between gap-3 border-b border-slate-100 py-1 dark:border-slate-800 sm:block sm:border-0 sm:py-0">
            <dt className="text-slate-500 dark:text-slate-400">{f.label}</dt>
            <dd className={`text-right sm:text-left ${f.strong ? 'font-semibold text-slate-900 dark:text-white' : 'text-slate-800 dark:text-slate-200'}`}>{f.value}</dd>
          </div>
        ))}
      </dl>
      {d.sections.map((s) => (
        <div key={s.heading} className={`mt-4 rounded-xl border-l-4 px-4 py-3 text-sm ${s.tone === 'ice' ? 'border-ice-500 bg-ice-50 dark:bg-ice-950' : 'border-ember-500 bg-ember-50 dark:bg-ember-900/30'}`}>
          <p className="font-semibold text-slate-900 dark:text-white">{s.heading}</p>
          <ul className="mt-1 list-disc space-y-1 pl-5 text-slate-800 dark:text-slate-200">
            {s.items.map((i) => (
              <li key={i}>{i}</li>
            ))}
          </ul>
        </div>
      ))}
      {d.table ? (
        <div className="mt-4 overflow-x-auto">
          <table className="w-full min-w-[28rem] text-left text-sm">
            <caption className="mb-1 text-left font-semibold text-slate-900 dark:text-white">{d.table.caption}</caption>
            <thead className="text-xs uppercase tracking-wide text-slate-500">
              <tr>
                {d.table.columns.map((c) => (
                  <th key={c} scope="col" className="py-1 pr-3">{c}</th>
                ))}
              </tr>
            </thead>
            <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
              {d.table.rows.map((r, i) => (
                <tr key={i}>
                  {r.map((v, j) => (
                    <td key={j} className={`py-1.5 pr-3 align-top ${j === 0 ? 'font-medium' : ''}`}>
                      {v.split('\n')[0]}
                      {v.includes('\n') ? <span className="block text-xs font-normal text-slate-500 dark:text-slate-400">{v.split('\n').slice(1).join(' ')}</span> : null}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
            {d.table.footer ? (
              <tfoot>
                <tr className="border-t-2 border-slate-200 font-semibold dark:border-slate-700">
                  {d.table.footer.map((v, j) => (
                    <td key={j} className="py-1.5 pr-3">{v}</td>
                  ))}
                </tr>
              </tfoot>
            ) : null}
          </table>
        </div>
      ) : null}
      <details className="mt-4 rounded-xl border border-amber-300 bg-amber-50 px-4 py-2 text-xs text-amber-950 dark:border-amber-700 dark:bg-amber-950 dark:text-amber-100" open={cautionsOpen}>
        <summary className="cursor-pointer py-1 font-semibold">Safety: estimates only, the manufacturer&apos;s instructions come first</summary>
        <ul className="mb-1 mt-1 list-disc space-y-0.5 pl-4">
          {CAUTIONS[alert.kind].map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </details>
      <div className="mt-4 flex flex-wrap items-center gap-2">
        <Link href={alert.link} className="inline-flex min-h-11 items-center rounded-xl bg-ice-700 px-4 text-sm font-semibold text-white hover:bg-ice-800 dark:bg-ice-500 dark:text-slate-950 dark:hover:bg-ice-400">
          {LINK_LABEL[alert.link] ?? 'Open'}
        </Link>
        <Button variant="secondary" disabled={pending} onClick={() => onAcknowledge(!read)}>
          {read ? 'Mark unread' : 'Acknowledge'}
          <span className="sr-only">: {d.title}</span>
        </Button>
        <span className="text-xs text-slate-500 dark:text-slate-400 sm:ml-auto">{emailLine(alert)}</span>
      </div>
    </article>
  );
}
