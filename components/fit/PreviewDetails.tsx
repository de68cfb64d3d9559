'use client';
// What the reader found in a file: the columns and units, the time format and zone, the span, notes,
// the problems by row, the first rows as written and the log drawn with the suggested cool-down.
import { Notice } from '@/components/ui/primitives';
import { CooldownChart } from '@/components/charts/CooldownChart';
import { formatDateTime } from '@/lib/time';
import type { TempUnit } from '@/lib/units';
import type { LogPreview } from '@/lib/views/logs';

const UNIT_SOURCE: Record<LogPreview['layout']['unitSource'], string> = {
  header: 'from the header',
  cells: 'from the cells',
  form: 'as chosen on the form',
  default: 'assumed',
};

export function PreviewDetails({ preview: p, zone, tempUnit }: { preview: LogPreview; zone: string; tempUnit: TempUnit }) {
  const c = p.layout.columns;
  const facts: [string, string][] = [
    ['Rows', p.rowCount.toLocaleString('en-GB')],
    ['Size', `${(p.sizeBytes / 1024).toLocaleString('en-GB', { maximumFractionDigits: 0 })} KB`],
    ['Time', `${c.time} · ${p.layout.timeFormat}`],
    ['Oil', c.oil],
    ['Ambient', c.ambient ?? 'none (a constant surrounding temperature is fitted)'],
    ['Unit', `${p.layout.unit === 'F' ? '°F' : '°C'} ${UNIT_SOURCE[p.layout.unitSource]}`],
    ['Zone', p.layout.timeZone],
    ['Span', p.span ? `${formatDateTime(p.span.startMs, zone)} → ${formatDateTime(p.span.endMs, zone)}` : '—'],
  ];
  if (c.heater) facts.splice(5, 0, ['Heater', c.heater]);
  return (
    <div className="mt-4 space-y-4">
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-2">
        {facts.map(([k, v]) => (
          <div key={k} className="flex gap-2">
            <dt className="w-20 shrink-0 text-slate-500 dark:text-slate-400">{k}</dt>
            <dd className="min-w-0 break-words font-medium text-slate-900 dark:text-slate-100">{v}</dd>
          </div>
        ))}
      </dl>
      {p.warnings.length ? (
        <Notice tone="info" title="Notes">
          <ul className="list-disc space-y-0.5 pl-4">
            {p.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Notice>
      ) : null}
      {p.problemCount ? (
        <div role="alert" className="rounded-xl border border-red-300 bg-red-50 p-3 text-sm text-red-950 dark:border-red-800 dark:bg-red-950 dark:text-red-100">
          <p className="font-semibold">
            {p.problemCount} problem{p.problemCount === 1 ? '' : 's'} to fix before the file can be stored
            {p.problemCount > p.problems.length ? ` (the first ${p.problems.length} listed)` : ''}
          </p>
          <div className="mt-2 max-h-72 overflow-auto">
            <table className="w-full text-left text-xs sm:text-sm">
              <caption className="sr-only">Problems by row</caption>
              <thead>
                <tr className="text-red-800 dark:text-red-200">
                  <th scope="col" className="py-1 pr-3">Row</th>
                  <th scope="col" className="hidden py-1 pr-3 sm:table-cell">Column</th>
                  <th scope="col" className="py-1">Problem</th>
                </tr>
              </thead>
              <tbody>
                {p.problems.map((q, i) => (
                  <tr key={i} className="border-t border-red-200 align-top dark:border-red-900">
                    <td className="py-1 pr-3 tabular-nums">{q.row ?? '—'}</td>
                    <td className="hidden py-1 pr-3 sm:table-cell">{q.column ?? '—'}</td>
                    <td className="py-1">{q.message}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </div>
      ) : null}
      {p.series.tMs.length > 1 ? (
        <CooldownChart
          tMs={p.series.tMs}
          oilC={p.series.oilC}
          ambientC={p.series.ambientC}
          window={p.suggestion}
          points="line"
          unit={tempUnit}
          zone={zone}
          label={`The log ${p.fileName}${p.suggestion ? ' with the suggested cool-down' : ''}`}
        />
      ) : null}
      {p.ok && !p.suggestion ? (
        <Notice tone="caution" title="No cool-down found">
          The oil never falls by 3 K or more with the heater off. You can still store the log; choose the window by hand after.
        </Notice>
      ) : null}
      {p.sample.length ? (
        <details className="text-sm">
          <summary className="min-h-11 cursor-pointer py-2 font-medium">First rows as written</summary>
          <div className="overflow-x-auto">
            <table className="text-left font-mono text-xs">
              <tbody>
                {p.sample.map((r, i) => (
                  <tr key={i}>
                    {r.map((cell, j) => (
                      <td key={j} className="whitespace-nowrap border-b border-slate-200 py-1 pr-4 dark:border-slate-800">
                        {cell}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </details>
      ) : null}
    </div>
  );
}
