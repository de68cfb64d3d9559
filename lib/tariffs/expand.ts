// Expanding a time-of-use tariff into priced intervals. Pure: no I/O; the clock and zone come in.
import { offsetSecondsAt } from '@/lib/time';
import { DEFAULT_TARIFF, type TariffShape } from '@/lib/validation/tariffs';
import type { PricedInterval } from '@/lib/views/tariffs';

const HOUR_MS = 3_600_000;
/** Longest span tariffPeriodsBetween expands (a guard against runaway loops). */
const MAX_SPAN_MS = 400 * 24 * HOUR_MS;

/**
 * The price over [fromMs, toMs) as consecutive intervals, reading the month × hour schedule in the
 * airfield's local time (weekday or weekend by the local date). Local hours are found from the zone's
 * offset at each instant (Intl), so a daylight-saving change gives a 23- or 25-hour day with the
 * skipped hour absent and the repeated hour priced twice. Adjacent hours of the same period merge.
 * A null tariff is the flat default.
 */
export function tariffPeriodsBetween({ tariff, timeZone, fromMs, toMs }: { tariff: TariffShape | null; timeZone: string; fromMs: number; toMs: number }): PricedInterval[] {
  const t = tariff ?? DEFAULT_TARIFF;
  if (!Number.isFinite(fromMs) || !Number.isFinite(toMs)) throw new RangeError('tariffPeriodsBetween needs finite bounds');
  if (toMs - fromMs > MAX_SPAN_MS) throw new RangeError('tariffPeriodsBetween spans at most 400 days');
  const out: PricedInterval[] = [];
  let at = fromMs;
  while (at < toMs) {
    const offsetMs = offsetSecondsAt(timeZone, at) * 1000;
    const local = new Date(at + offsetMs);
    const weekend = local.getUTCDay() === 0 || local.getUTCDay() === 6;
    const idx = (weekend ? t.weekendSchedule : t.weekdaySchedule)[local.getUTCMonth()]?.[local.getUTCHours()] ?? 0;
    const period = t.periods[idx] ?? t.periods[0];
    // The next local hour boundary, at the offset in force now; a change of offset there is picked up next turn.
    let next = Math.floor((at + offsetMs) / HOUR_MS) * HOUR_MS + HOUR_MS - offsetMs;
    if (next <= at) next = at + HOUR_MS;
    const end = Math.min(next, toMs);
    const last = out[out.length - 1];
    if (last && last.toMs === at && last.pricePerKWh === period.pricePerKWh && last.period === period.name) last.toMs = end;
    else out.push({ fromMs: at, toMs: end, pricePerKWh: period.pricePerKWh, period: period.name });
    at = end;
  }
  return out;
}
