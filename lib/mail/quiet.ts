// Quiet hours: a daily window in the user's local time during which alert e-mails wait (the
// oil-too-cold warning does not). Pure: the clock is passed in.
import { addDays, localDateOf, localHourOf, zonedTimeToUtc } from '@/lib/time';

export interface QuietHours {
  /** 'HH:MM' local; start === end or either null: no quiet hours. */
  start: string | null;
  end: string | null;
  timeZone: string;
}

export function minutesOfDay(hhmm: string): number {
  const m = /^([01]\d|2[0-3]):([0-5]\d)$/.exec(hhmm);
  if (!m) throw new Error(`not a HH:MM time: ${hhmm}`);
  return Number(m[1]) * 60 + Number(m[2]);
}

/** Whether the instant falls inside the quiet hours (a window may run past midnight, 22:00–06:30). */
export function inQuietHours(q: QuietHours, nowMs: number): boolean {
  if (!q.start || !q.end || q.start === q.end) return false;
  const s = minutesOfDay(q.start);
  const e = minutesOfDay(q.end);
  const m = Math.floor(localHourOf(q.timeZone, nowMs) * 60 + 1e-9);
  return s < e ? m >= s && m < e : m >= s || m < e;
}

/** When the quiet hours under way end (epoch ms), or null when the instant is not in quiet hours. */
export function quietHoursEnd(q: QuietHours, nowMs: number): number | null {
  if (!inQuietHours(q, nowMs)) return null;
  const e = minutesOfDay(q.end!);
  const m = localHourOf(q.timeZone, nowMs) * 60;
  const today = localDateOf(q.timeZone, nowMs);
  const day = m < e ? today : addDays(today, 1);
  return zonedTimeToUtc(q.timeZone, day.year, day.month, day.day, Math.floor(e / 60), e % 60);
}
