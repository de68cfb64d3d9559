// Time cells of logger files: ISO 8601 (with or without a zone), "30.11.2026 17:45", "11/30/2026 5:45 PM"
// or "30/11/2026 17:45", unix seconds or milliseconds. Wall-clock times are read in the airfield's zone
// (Intl only, through lib/weather/tz). A file uses one format; which one is decided from its first row.
import { offsetSecondsAt } from '@/lib/weather/tz';

export type TimeFormat = 'iso-zoned' | 'iso-local' | 'dmy-dot' | 'slash' | 'unix-s' | 'unix-ms';

export const TIME_FORMAT_LABEL: Record<TimeFormat | 'mdy-slash' | 'dmy-slash', string> = {
  'iso-zoned': 'ISO 8601 with a zone',
  'iso-local': 'YYYY-MM-DD hh:mm (local)',
  'dmy-dot': 'DD.MM.YYYY hh:mm (local)',
  slash: 'dates with slashes (local)',
  'mdy-slash': 'MM/DD/YYYY hh:mm (local)',
  'dmy-slash': 'DD/MM/YYYY hh:mm (local)',
  'unix-s': 'unix seconds',
  'unix-ms': 'unix milliseconds',
};

const ISO = /^(\d{4})-(\d{1,2})-(\d{1,2})(?:[T ]+(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,6}))?)?\s*(am|pm)?)?\s*(z|utc|gmt|[+-]\d{2}(?::?\d{2})?)?$/i;
const DOT = /^(\d{1,2})\.(\d{1,2})\.(\d{4})(?:[ T,]+(\d{1,2})[:.](\d{2})(?:[:.](\d{2})(?:[.,](\d{1,6}))?)?\s*(am|pm)?)?$/i;
const SLASH = /^(\d{1,2})\/(\d{1,2})\/(\d{4})(?:[ T,]+(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,6}))?)?\s*(am|pm)?)?$/i;
const UNIX_S = /^\d{9,10}(?:\.\d{1,6})?$/;
const UNIX_MS = /^\d{12,13}$/;

/** The format of one time cell, or null if it is none Thawline reads. */
export function detectTimeFormat(raw: string): TimeFormat | null {
  const s = raw.trim();
  if (UNIX_MS.test(s)) return 'unix-ms';
  if (UNIX_S.test(s)) return 'unix-s';
  const iso = ISO.exec(s);
  if (iso) return iso[9] ? 'iso-zoned' : 'iso-local';
  if (DOT.test(s)) return 'dmy-dot';
  if (SLASH.test(s)) return 'slash';
  return null;
}

function hour12(h: number, ampm: string | undefined): number {
  if (!ampm) return h;
  if (h < 1 || h > 12) return NaN;
  const pm = ampm.toLowerCase() === 'pm';
  return (h % 12) + (pm ? 12 : 0);
}

/** Wall-clock ms (the local time read as if it were UTC); NaN if a field is out of range. */
function wall(y: number, mo: number, d: number, h: number, mi: number, s: number, frac: string | undefined): number {
  if (mo < 1 || mo > 12 || d < 1 || d > 31 || !(h >= 0 && h <= 24) || mi > 59 || s > 60) return NaN;
  const ms = frac ? Math.round(Number('0.' + frac) * 1000) : 0;
  const t = Date.UTC(y, mo - 1, d, h, mi, s, ms);
  // Reject 31 February and the like: Date.UTC rolls them over.
  const back = new Date(t);
  if (h < 24 && (back.getUTCDate() !== d || back.getUTCMonth() !== mo - 1)) return NaN;
  return t;
}

function zoneOffsetMs(z: string): number {
  const u = z.toLowerCase();
  if (u === 'z' || u === 'utc' || u === 'gmt') return 0;
  const m = /^([+-])(\d{2}):?(\d{2})?$/.exec(z)!;
  const v = (Number(m[2]) * 60 + Number(m[3] ?? 0)) * 60_000;
  return m[1] === '-' ? -v : v;
}

/**
 * One time cell parsed in a given format. Zoned and unix formats give instants (`kind: 'utc'`);
 * the others give wall-clock ms to be placed in the zone by `WallClock`. For slashes both orders
 * are returned (month first and day first), each NaN where impossible; the file decides at the end.
 */
export type ParsedTime = { kind: 'utc'; ms: number } | { kind: 'wall'; ms: number } | { kind: 'slash'; mdy: number; dmy: number; ampm: boolean };

export function parseTimeCell(raw: string, format: TimeFormat): ParsedTime | null {
  const s = raw.trim();
  switch (format) {
    case 'unix-s':
      return UNIX_S.test(s) ? { kind: 'utc', ms: Math.round(Number(s) * 1000) } : null;
    case 'unix-ms':
      return UNIX_MS.test(s) ? { kind: 'utc', ms: Number(s) } : null;
    case 'iso-zoned':
    case 'iso-local': {
      const m = ISO.exec(s);
      if (!m || Boolean(m[9]) !== (format === 'iso-zoned')) return null;
      const h = hour12(Number(m[4] ?? 0), m[8]);
      const w = wall(Number(m[1]), Number(m[2]), Number(m[3]), h, Number(m[5] ?? 0), Number(m[6] ?? 0), m[7]);
      if (Number.isNaN(w)) return null;
      return format === 'iso-zoned' ? { kind: 'utc', ms: w - zoneOffsetMs(m[9]) } : { kind: 'wall', ms: w };
    }
    case 'dmy-dot': {
      const m = DOT.exec(s);
      if (!m) return null;
      const w = wall(Number(m[3]), Number(m[2]), Number(m[1]), hour12(Number(m[4] ?? 0), m[8]), Number(m[5] ?? 0), Number(m[6] ?? 0), m[7]);
      return Number.isNaN(w) ? null : { kind: 'wall', ms: w };
    }
    case 'slash': {
      const m = SLASH.exec(s);
      if (!m) return null;
      const a = Number(m[1]);
      const b = Number(m[2]);
      const y = Number(m[3]);
      const h = hour12(Number(m[4] ?? 0), m[8]);
      const mi = Number(m[5] ?? 0);
      const sec = Number(m[6] ?? 0);
      const mdy = wall(y, a, b, h, mi, sec, m[7]);
      const dmy = wall(y, b, a, h, mi, sec, m[7]);
      if (Number.isNaN(mdy) && Number.isNaN(dmy)) return null;
      return { kind: 'slash', mdy, dmy, ampm: Boolean(m[8]) };
    }
  }
}

/**
 * Places wall-clock times in a zone. The zone's offset is looked up once per quarter hour of wall time
 * (offsets change only on such boundaries), so 200,000 rows cost a few hundred Intl calls.
 * A wall time skipped by a daylight-saving change maps an hour later; a repeated one to its first occurrence.
 */
export class WallClock {
  private cache = new Map<number, number>();
  constructor(private zone: string) {}
  toUtc(wallMs: number): number {
    const key = Math.floor(wallMs / 900_000);
    let off = this.cache.get(key);
    if (off === undefined) {
      const w = key * 900_000;
      let guess = w - offsetSecondsAt(this.zone, w) * 1000;
      guess = w - offsetSecondsAt(this.zone, guess) * 1000;
      off = w - guess;
      this.cache.set(key, off);
    }
    return wallMs - off;
  }
}
