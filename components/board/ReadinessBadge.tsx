import { READINESS_STYLE, type Readiness } from '@/components/map/marker';

const TONE: Record<Readiness, string> = {
  ready: 'bg-teal-50 text-teal-800 ring-teal-600/30 dark:bg-teal-950 dark:text-teal-200 dark:ring-teal-400/30',
  warming: 'bg-ember-50 text-ember-800 ring-ember-600/30 dark:bg-ember-900/40 dark:text-ember-200 dark:ring-ember-400/30',
  short: 'bg-red-50 text-red-800 ring-red-600/40 dark:bg-red-950 dark:text-red-200 dark:ring-red-400/40',
  unplanned: 'bg-violet-50 text-violet-800 ring-violet-600/30 dark:bg-violet-950 dark:text-violet-200 dark:ring-violet-400/30',
};

/** The readiness state as a chip: colour, a glyph and the word, so it reads without colour too. */
export function ReadinessBadge({ status, large = false }: { status: Readiness; large?: boolean }) {
  const s = READINESS_STYLE[status];
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full font-semibold ring-1 ring-inset ${large ? 'px-3 py-1 text-sm' : 'px-2 py-0.5 text-xs'} ${TONE[status]}`} title={s.hint}>
      <span aria-hidden="true">{s.glyph}</span>
      {s.label}
    </span>
  );
}
