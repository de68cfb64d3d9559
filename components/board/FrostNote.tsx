import { FROST_CAUTION } from '@/lib/plans/frost';
import { formatTime } from '@/lib/time';
import type { PlanView } from '@/lib/views/plans';

/** The frost flag of a departure whose airframe spends the night outside: a chip, or a line with the caution. */
export function FrostNote({ plan, compact = false }: { plan: Pick<PlanView, 'frost' | 'airfield'>; compact?: boolean }) {
  if (!plan.frost?.likely) return null;
  const zone = plan.airfield?.timeZone ?? 'UTC';
  const when = plan.frost.from && plan.frost.to ? ` (${formatTime(Date.parse(plan.frost.from), zone)}–${formatTime(Date.parse(plan.frost.to), zone)})` : '';
  if (compact) {
    return (
      <span className="inline-flex items-center gap-1 whitespace-nowrap rounded-full bg-sky-50 px-2 py-0.5 text-xs font-semibold text-sky-900 ring-1 ring-inset ring-sky-700/30 dark:bg-sky-950 dark:text-sky-100" title={FROST_CAUTION}>
        <span aria-hidden="true">❄</span> Frost likely
      </span>
    );
  }
  return (
    <p className="rounded-lg bg-sky-50 px-3 py-2 text-xs text-sky-950 ring-1 ring-inset ring-sky-700/30 dark:bg-sky-950 dark:text-sky-100">
      <span aria-hidden="true">❄ </span>
      <strong>Frost likely — check and remove before flight.</strong> The airframe is below the frost point for about {plan.frost.hours} h{when} before departure. No take-off with frost, ice or
      snow on wings, tail or propeller.
    </p>
  );
}
