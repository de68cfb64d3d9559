// The words Thawline uses for a departure's readiness and for what its heater is doing, in one place.
// Pure (no I/O, no clock): the board, the pilot view, the map, the alerts and the e-mails all ask here,
// so one stored plan reads the same everywhere. Readiness is what the plan predicts for the departure;
// the heater state is what the plan has the heater doing at a given instant.
import { formatDayTime, formatTime, localDateKey, localDateOf } from '@/lib/time';

/** What the plan predicts for the departure (the stored values; their order is the severity order below). */
export const READINESS = ['no-heat', 'ready', 'warming', 'short', 'unplanned'] as const;
export type Readiness = (typeof READINESS)[number];

const RANK: Record<Readiness, number> = { 'no-heat': 0, ready: 0, warming: 1, unplanned: 2, short: 3 };

/** The most severe of several readiness states (a field's tag on the map), or null for none. */
export function worstReadiness(list: readonly Readiness[]): Readiness | null {
  return list.length ? list.reduce((w, r) => (RANK[r] > RANK[w] ? r : w)) : null;
}

/** Word, glyph (so it reads without colour) and a hint for each readiness state. */
export const READINESS_STYLE: Record<Readiness, { label: string; glyph: string; hint: string }> = {
  'no-heat': { label: 'No heat needed', glyph: '○', hint: 'meets the engine maker’s rule unheated (estimate: follow the manual)' },
  ready: { label: 'Ready', glyph: '✓', hint: 'warm enough at departure without heat' },
  warming: { label: 'Heat planned', glyph: '▲', hint: 'a heat plan reaches the ready temperature by departure' },
  short: { label: 'Short', glyph: '!', hint: 'no plan reaches the ready temperature in time' },
  unplanned: { label: 'Unplanned', glyph: '?', hint: 'needs heat, no plan (no heater, or none that can be planned)' },
};

export const READINESS_LABEL: Record<Readiness, string> = Object.fromEntries(
  READINESS.map((r) => [r, READINESS_STYLE[r].label]),
) as Record<Readiness, string>;

/**
 * What the heater is doing at an instant, by the plan:
 * - `no-heat`: the oil is warm enough without heat;
 * - `scheduled`: the plan switches the heater on later;
 * - `switch-on-now`: the switch-on time has come (within SWITCH_ON_NOW_MS of it);
 * - `heating`: the plan has the heater on;
 * - `done`: the plan's heating is over (the departure time, or the end of the hold, has passed);
 * - `short`, `unplanned`: no plan reaches the ready temperature (the readiness says which).
 */
export type HeaterState = 'no-heat' | 'scheduled' | 'switch-on-now' | 'heating' | 'done' | 'short' | 'unplanned';

/** "Switch on now" stays up this long after the switch-on time, then the state reads "Heating". */
export const SWITCH_ON_NOW_MS = 15 * 60_000;

export interface PlanTimes {
  status: Readiness;
  /** ISO instant of the first switch-on, or null when the plan has no heat. */
  switchOnAt: string | null;
  /** The plan's heater-on intervals (ISO instants). */
  heaterOn: readonly { from: string; to: string }[];
  departAt: string;
}

export function heaterStateAt(p: PlanTimes, nowMs: number): HeaterState {
  if (p.status === 'short' || p.status === 'unplanned') return p.status;
  if (!p.switchOnAt || !p.heaterOn.length) return p.status === 'ready' || p.status === 'no-heat' ? 'no-heat' : 'scheduled';
  const on = Date.parse(p.switchOnAt);
  if (nowMs < on) return 'scheduled';
  const lastEnd = Math.max(...p.heaterOn.map((i) => Date.parse(i.to)), Date.parse(p.departAt));
  if (nowMs >= lastEnd) return 'done';
  if (nowMs < on + SWITCH_ON_NOW_MS) return 'switch-on-now';
  return 'heating';
}

/** Word, glyph and tone of each heater state. `tone` picks the badge colours. */
export const HEATER_STATE_STYLE: Record<HeaterState, { label: string; glyph: string; tone: 'ready' | 'heat' | 'plan' | 'short' | 'unplanned'; hint: string }> = {
  'no-heat': { label: 'Ready', glyph: '✓', tone: 'ready', hint: 'warm enough without heat' },
  scheduled: { label: 'Scheduled', glyph: '◷', tone: 'plan', hint: 'the heater is not on yet; the plan switches it on later' },
  'switch-on-now': { label: 'Switch on now', glyph: '▶', tone: 'heat', hint: 'the switch-on time has come' },
  heating: { label: 'Heating', glyph: '▲', tone: 'heat', hint: 'the plan has the heater on' },
  done: { label: 'Heat plan done', glyph: '✓', tone: 'ready', hint: 'the plan’s heating is over' },
  short: { label: 'Short', glyph: '!', tone: 'short', hint: 'no plan reaches the ready temperature in time' },
  unplanned: { label: 'Unplanned', glyph: '?', tone: 'unplanned', hint: 'needs heat, no plan' },
};

/** One line for what the plan says about the heater, at an instant: "Switch on at Thu 02:11", "Switch on now"… */
export function heaterLine(p: PlanTimes, zone: string, nowMs: number): string | null {
  const s = heaterStateAt(p, nowMs);
  if (!p.switchOnAt) return null;
  const at = whenLabel(Date.parse(p.switchOnAt), zone, nowMs);
  switch (s) {
    case 'scheduled':
      return `Switch on at ${at}`;
    case 'switch-on-now':
      return `Switch on now (planned ${at})`;
    case 'heating':
      return `Heater on since ${at}`;
    case 'done':
      return `Heated from ${at}`;
    default:
      return null;
  }
}

/** True when two instants fall on the same local date in the zone. */
export function sameLocalDay(aMs: number, bMs: number, zone: string): boolean {
  return localDateKey(localDateOf(zone, aMs)) === localDateKey(localDateOf(zone, bMs));
}

/** A time for people: "02:11" when it is today in the zone, "Thu 02:11" on any other day. */
export function whenLabel(ms: number, zone: string, nowMs: number): string {
  return sameLocalDay(ms, nowMs, zone) ? formatTime(ms, zone) : formatDayTime(ms, zone);
}

/** What the pilot does at the end of the start window: the heater stays on until just before start. */
export const HOLD_ADVICE = 'Leave on until just before start; unplug before start.';

/**
 * The start window in one line when the plan keeps the heater on past departure: "Ready through 08:30:
 * leave on until just before start; unplug before start." Null without a hold.
 */
export function holdLine(p: { hold: { until: string; heaterOn: boolean } | null; holdMinutes?: number }, zone: string, nowMs: number): string | null {
  if (!p.hold || !p.hold.heaterOn) return null;
  return `Ready through ${whenLabel(Date.parse(p.hold.until), zone, nowMs)}${p.holdMinutes ? ` (${p.holdMinutes} min start window)` : ''}: ${HOLD_ADVICE.charAt(0).toLowerCase()}${HOLD_ADVICE.slice(1)}`;
}
