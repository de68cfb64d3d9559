import { formatTemp } from '@/components/airfields/format';
import { heaterLine, heaterStateAt, holdLine } from '@/lib/plans/state';
import type { PlanView } from '@/lib/views/plans';
import { ReadinessBadge } from './ReadinessBadge';
import Link from 'next/link';
import { FrostNote } from './FrostNote';

/** A departure's readiness in a list: status, predicted oil at departure, chance, and the switch-on time. */
export function ReadinessCell({ plan, units, nowMs }: { plan: PlanView; units: 'C' | 'F'; nowMs: number }) {
  const zone = plan.airfield?.timeZone ?? 'UTC';
  return (
    <div className="space-y-1 text-sm">
      <div className="flex flex-wrap items-center gap-2">
        <ReadinessBadge status={plan.status} />
        {plan.probabilityReady !== null ? <span className="text-xs text-slate-600 dark:text-slate-400">{Math.round(plan.probabilityReady * 100)} % chance ready</span> : null}
      </div>
      <div className="tabular-nums">
        Oil at departure <strong className={plan.status !== 'no-heat' && plan.oilAtDepartureC !== null && plan.oilAtDepartureC < plan.readyC ? 'text-red-700 dark:text-red-300' : ''}>{formatTemp(plan.oilAtDepartureC, units, 0)}</strong>
        <span className="text-slate-500"> · ready {formatTemp(plan.readyC, units, 0)}</span>
      </div>
      {plan.switchOnAt ? (
        <div className={`text-xs ${['switch-on-now', 'heating'].includes(heaterStateAt(plan, nowMs)) ? 'font-semibold text-ember-700 dark:text-ember-300' : 'text-slate-700 dark:text-slate-300'}`}>{heaterLine(plan, zone, nowMs)}</div>
      ) : null}
      {holdLine(plan, zone, nowMs) ? <div className="text-xs text-ember-800 dark:text-ember-200">{holdLine(plan, zone, nowMs)}</div> : null}
      {(plan.warnings ?? []).map((w) => (
        <div key={w.code} role="note" className="rounded-md border border-amber-400 bg-amber-50 px-2 py-1 text-xs text-amber-900 dark:border-amber-600 dark:bg-amber-950 dark:text-amber-100">
          <strong>Warning:</strong> {w.text} <span className="block">Suggestion: {w.suggestion}</span>
        </div>
      ))}
      <FrostNote plan={plan} />
      {/* The chart needs the page's width: the plan opens on its own page, not inside a table cell. */}
      <Link href={`/departures/${plan.departureId}/plan`} className="inline-flex min-h-10 items-center text-xs font-semibold text-ice-700 underline-offset-2 hover:underline dark:text-ice-300">
        Soak forecast and heat plan<span className="sr-only"> of {plan.aircraft.registration}</span>
      </Link>
    </div>
  );
}
