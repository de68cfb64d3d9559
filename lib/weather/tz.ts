// Small time-zone helpers for the forecast layer, built on Intl only (no clock, no I/O).
// A zone's offset is read from Intl at a given instant, so daylight-saving changes are honoured.

const formatters = new Map<string, Intl.DateTimeFormat>();

function isUtcName(zone: string): boolean {
  return zone === 'GMT' || zone === 'UTC' || zone === 'Etc/UTC' || zone === 'Etc/GMT';
}

function formatterFor(zone: string): Intl.DateTimeFormat {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    formatters.set(zone, f);
  }
  return f;
}

/** True when Intl knows the IANA zone name. */
export function isValidTimeZone(zone: string): boolean {
  if (isUtcName(zone)) return true;
  try {
    formatterFor(zone);
    return true;
  } catch {
    return false;
  }
}

// Intl's formatToParts is slow next to everything else a board read does, and the same instants (forecast
// hours, departures, slot edges) recur for every aircraft of an airfield: remember each answer. The
// result depends only on the whole second, so the memo is exact; it is dropped whole when it grows large.
const offsetMemo = new Map<string, number>();
const OFFSET_MEMO_MAX = 100_000;

/** The zone's offset from UTC, in seconds, at the instant `ms` (epoch milliseconds). */
export function offsetSecondsAt(zone: string, ms: number): number {
  if (isUtcName(zone)) return 0;
  const key = `${zone}|${Math.floor(ms / 1000)}`;
  const known = offsetMemo.get(key);
  if (known !== undefined) return known;
  const offset = computeOffsetSeconds(zone, ms);
  if (offsetMemo.size >= OFFSET_MEMO_MAX) offsetMemo.clear();
  offsetMemo.set(key, offset);
  return offset;
}

function computeOffsetSeconds(zone: string, ms: number): number {
  const parts = formatterFor(zone).formatToParts(new Date(ms));
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value);
  const wall = Date.UTC(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'), get('second'));
  const wholeSecondMs = Math.floor(ms / 1000) * 1000;
  return Math.round((wall - wholeSecondMs) / 1000);
}

/** The zone's short name at an instant ("GMT", "CET", "GMT+3" …). */
export function zoneAbbreviationAt(zone: string, ms: number): string {
  if (isUtcName(zone)) return 'GMT';
  const parts = new Intl.DateTimeFormat('en-US', { timeZone: zone, timeZoneName: 'short' }).formatToParts(new Date(ms));
  return parts.find((p) => p.type === 'timeZoneName')?.value ?? zone;
}

/** The local calendar date (year, month 1-12, day) of an instant in a zone. */
export function localDateOf(zone: string, ms: number): { year: number; month: number; day: number } {
  const local = new Date(ms + offsetSecondsAt(zone, ms) * 1000);
  return { year: local.getUTCFullYear(), month: local.getUTCMonth() + 1, day: local.getUTCDate() };
}

/** The UTC instant (epoch ms) of local midnight starting the given local date in a zone. */
export function localMidnightUtc(zone: string, year: number, month: number, day: number): number {
  const wallMidnight = Date.UTC(year, month - 1, day);
  // Two passes settle the offset even when midnight sits next to a daylight-saving change.
  let guess = wallMidnight - offsetSecondsAt(zone, wallMidnight) * 1000;
  guess = wallMidnight - offsetSecondsAt(zone, guess) * 1000;
  return guess;
}

/** Local wall time of an instant as Open-Meteo writes it in iso8601 mode: "YYYY-MM-DDTHH:MM". */
export function localIsoMinutes(zone: string, ms: number): string {
  const local = new Date(ms + offsetSecondsAt(zone, ms) * 1000);
  return local.toISOString().slice(0, 16);
}
