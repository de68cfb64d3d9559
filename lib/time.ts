// Time-zone and format helpers: every time Thawline shows is in the airfield's own zone. Built on
// Intl (through lib/weather/tz) and suncalc; no clock — `now` is always passed in. Safe to import in
// client components.
import { getTimes } from 'suncalc';
import { isValidTimeZone, localDateOf, offsetSecondsAt } from '@/lib/weather/tz';

export { isValidTimeZone, localDateOf, offsetSecondsAt };

const HOUR_MS = 3_600_000;

export interface LocalDate {
  year: number;
  /** 1..12 */
  month: number;
  day: number;
}

/**
 * The canonical IANA name of a zone Intl knows ("europe/helsinki" → "Europe/Helsinki"), or null.
 * Offsets and abbreviations that are not zone names ("+02:00", "EET5") are refused.
 */
export function canonicalTimeZone(zone: string): string | null {
  const z = zone.trim();
  if (!/^[A-Za-z][A-Za-z0-9_+-]*(\/[A-Za-z0-9_+-]+){0,2}$/.test(z) || z.length > 64) return null;
  if (!isValidTimeZone(z)) return null;
  try {
    const resolved = new Intl.DateTimeFormat('en-US', { timeZone: z }).resolvedOptions().timeZone;
    return resolved || z;
  } catch {
    return null;
  }
}

/** Every zone name Intl lists, for pickers (falls back to a few when the runtime lists none). */
export function timeZoneNames(): string[] {
  const intl = Intl as unknown as { supportedValuesOf?: (k: string) => string[] };
  const list = intl.supportedValuesOf?.('timeZone') ?? [];
  return list.length ? [...list, ...(list.includes('UTC') ? [] : ['UTC'])] : ['UTC', 'Europe/Helsinki', 'Europe/Stockholm', 'America/Anchorage'];
}

/**
 * The UTC instant (epoch ms) of a local wall-clock time in a zone. Day, hour and minute may overflow
 * (day + 1 is the next day). A wall time skipped by a daylight-saving change maps to the instant an
 * hour later; a repeated one to its first occurrence.
 */
export function zonedTimeToUtc(zone: string, year: number, month: number, day: number, hour = 0, minute = 0): number {
  const wall = Date.UTC(year, month - 1, day, hour, minute);
  let guess = wall - offsetSecondsAt(zone, wall) * 1000;
  guess = wall - offsetSecondsAt(zone, guess) * 1000;
  return guess;
}

/** The local date a number of days after `d` (calendar arithmetic, no zone involved). */
export function addDays(d: LocalDate, days: number): LocalDate {
  const t = new Date(Date.UTC(d.year, d.month - 1, d.day + days));
  return { year: t.getUTCFullYear(), month: t.getUTCMonth() + 1, day: t.getUTCDate() };
}

export function localDateKey(d: LocalDate): string {
  return `${d.year}-${String(d.month).padStart(2, '0')}-${String(d.day).padStart(2, '0')}`;
}

/** The hour of the day (0..23, fractional) of an instant in a zone. */
export function localHourOf(zone: string, ms: number): number {
  const local = ms + offsetSecondsAt(zone, ms) * 1000;
  return ((local % 86_400_000) + 86_400_000) % 86_400_000 / HOUR_MS;
}

export interface NightWindow {
  /** Evening start, epoch ms. */
  fromMs: number;
  /** Morning end, epoch ms. */
  toMs: number;
  /** The local date of the evening the night starts on. */
  evening: LocalDate;
}

/**
 * The night being planned at an airfield ("tonight" on every page): from `fromHour` (default 18:00) on
 * the evening to `toHour` (default 09:00) the next morning, local time. Until `switchHour` (default
 * 06:00) it is the night still under way (it began the evening before; its departures are close);
 * from then on it is the coming night, the one the Morning board plans for. So at 08:00 the map, the
 * airfields and the board all speak of the night that ends tomorrow morning, never of the one ending.
 */
export function tonightWindow(
  zone: string,
  now: Date,
  opts: { fromHour?: number; toHour?: number; switchHour?: number } = {},
): NightWindow {
  const fromHour = opts.fromHour ?? 18;
  const toHour = opts.toHour ?? 9;
  const switchHour = Math.min(opts.switchHour ?? 6, toHour);
  const nowMs = now.getTime();
  const today = localDateOf(zone, nowMs);
  const evening = localHourOf(zone, nowMs) < switchHour ? addDays(today, -1) : today;
  const next = addDays(evening, 1);
  return {
    fromMs: zonedTimeToUtc(zone, evening.year, evening.month, evening.day, fromHour),
    toMs: zonedTimeToUtc(zone, next.year, next.month, next.day, toHour),
    evening,
  };
}

export interface SunDay {
  /** Local date, YYYY-MM-DD. */
  date: string;
  /** Epoch ms; null when the sun does not reach that angle that day (polar night or midnight sun). */
  civilDawn: number | null;
  sunrise: number | null;
  sunset: number | null;
  civilDusk: number | null;
  /** Sun above the horizon all day / below it all day (only when sunrise is null). */
  polar: 'day' | 'night' | null;
}

/**
 * Sunrise, sunset and civil twilight (sun 6° below the horizon) for a local date at a site, from
 * suncalc. Asked at local noon, so the events are those of that local day.
 */
export function sunDay(zone: string, latitude: number, longitude: number, date: LocalDate): SunDay {
  const noon = zonedTimeToUtc(zone, date.year, date.month, date.day, 12);
  const t = getTimes(new Date(noon), latitude, longitude);
  const ms = (d: Date | null | undefined) => (d && Number.isFinite(d.getTime()) ? d.getTime() : null);
  const sunrise = ms(t.sunrise);
  const extra = t as unknown as { alwaysUp?: boolean; alwaysDown?: boolean };
  return {
    date: localDateKey(date),
    civilDawn: ms(t.dawn),
    sunrise,
    sunset: ms(t.sunset),
    civilDusk: ms(t.dusk),
    polar: sunrise === null ? (extra.alwaysUp ? 'day' : extra.alwaysDown ? 'night' : null) : null,
  };
}

// ---------------------------------------------------------------------------------------------
// Formatting (en-GB style, 24-hour clock: the way line crews write times)

const fmtCache = new Map<string, Intl.DateTimeFormat>();
function fmt(zone: string, key: string, o: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const k = `${zone}|${key}`;
  let f = fmtCache.get(k);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', { timeZone: zone, hourCycle: 'h23', ...o });
    fmtCache.set(k, f);
  }
  return f;
}

/** "06:12" in the zone. */
export function formatTime(ms: number, zone: string): string {
  return fmt(zone, 't', { hour: '2-digit', minute: '2-digit' }).format(ms);
}

/** "06:12:43" in the zone. */
export function formatTimeSeconds(ms: number, zone: string): string {
  return fmt(zone, 'ts', { hour: '2-digit', minute: '2-digit', second: '2-digit' }).format(ms);
}

/** "Tue 06:12" in the zone. */
export function formatDayTime(ms: number, zone: string): string {
  return fmt(zone, 'dt', { weekday: 'short', hour: '2-digit', minute: '2-digit' }).format(ms).replace(',', '');
}

/** "Tue 17 Oct" in the zone. */
export function formatDay(ms: number, zone: string): string {
  return fmt(zone, 'd', { weekday: 'short', day: 'numeric', month: 'short' }).format(ms).replace(',', '');
}

/** "17 Oct 2003, 06:12" in the zone. */
export function formatDateTime(ms: number, zone: string): string {
  return fmt(zone, 'full', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' }).format(ms);
}

/** The zone's short name at an instant ("EET", "GMT+2"…). */
export function zoneLabel(zone: string, ms: number): string {
  const parts = new Intl.DateTimeFormat('en-GB', { timeZone: zone, timeZoneName: 'short' }).formatToParts(ms);
  return parts.find((p) => p.type === 'timeZoneName')?.value ?? zone;
}

/** "UTC+02:00" for an instant in a zone. */
export function formatUtcOffset(zone: string, ms: number): string {
  const s = offsetSecondsAt(zone, ms);
  const sign = s < 0 ? '−' : '+';
  const a = Math.abs(s);
  return `UTC${sign}${String(Math.floor(a / 3600)).padStart(2, '0')}:${String(Math.floor((a % 3600) / 60)).padStart(2, '0')}`;
}

/** A forecast's age for people: "just now", "12 min", "3 h 5 min", "2 d 4 h". */
export function formatAge(minutes: number): string {
  const m = Math.max(0, Math.floor(minutes));
  if (m < 1) return 'just now';
  if (m < 60) return `${m} min`;
  const h = Math.floor(m / 60);
  if (h < 24) return m % 60 ? `${h} h ${m % 60} min` : `${h} h`;
  const d = Math.floor(h / 24);
  return h % 24 ? `${d} d ${h % 24} h` : `${d} d`;
}

