import { HEATER_STATE_STYLE, READINESS_STYLE, type HeaterState, type Readiness } from '@/lib/plans/state';

const TONE = {
  ready: 'bg-teal-50 text-teal-800 ring-teal-600/30 dark:bg-teal-950 dark:text-teal-200 dark:ring-teal-400/30',
  heat: 'bg-ember-50 text-ember-800 ring-ember-600/30 dark:bg-ember-900/40 dark:text-ember-200 dark:ring-ember-400/30',
  plan: 'bg-sky-50 text-sky-900 ring-sky-700/30 dark:bg-sky-950 dark:text-sky-200 dark:ring-sky-400/30',
  short: 'bg-red-50 text-red-800 ring-red-600/40 dark:bg-red-950 dark:text-red-200 dark:ring-red-400/40',
  unplanned: 'bg-violet-50 text-violet-800 ring-violet-600/30 dark:bg-violet-950 dark:text-violet-200 dark:ring-violet-400/30',
} as const;
const READINESS_TONE: Record<Readiness, keyof typeof TONE> = { 'no-heat': 'ready', ready: 'ready', warming: 'plan', short: 'short', unplanned: 'unplanned' };

function Chip({ tone, glyph, label, hint, large }: { tone: keyof typeof TONE; glyph: string; label: string; hint: string; large: boolean }) {
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full font-semibold ring-1 ring-inset ${large ? 'px-3 py-1 text-sm' : 'px-2 py-0.5 text-xs'} ${TONE[tone]}`} title={hint}>
      <span aria-hidden="true">{glyph}</span>
      {label}
    </span>
  );
}

/** The readiness the plan predicts, as a chip: colour, a glyph and the word, so it reads without colour too. */
export function ReadinessBadge({ status, large = false }: { status: Readiness; large?: boolean }) {
  const s = READINESS_STYLE[status];
  return <Chip tone={READINESS_TONE[status]} glyph={s.glyph} label={s.label} hint={s.hint} large={large} />;
}

/** What the heater is doing by the plan right now ("Scheduled", "Switch on now", "Heating"…), as a chip. */
export function HeaterStateBadge({ state, large = false }: { state: HeaterState; large?: boolean }) {
  const s = HEATER_STATE_STYLE[state];
  return <Chip tone={s.tone} glyph={s.glyph} label={s.label} hint={s.hint} large={large} />;
}
