// Which column of a logger file is which: time (or a date and a time column), oil temperature,
// ambient (outside or shelter air), a heater on/off column, a per-row unit column.

export interface ColumnRoles {
  time: number;
  /** A separate time-of-day column joined to a date column. */
  timeOfDay: number | null;
  oil: number;
  ambient: number | null;
  heater: number | null;
  unit: number | null;
}

const norm = (h: string) => h.toLowerCase().replace(/\s+/g, ' ').trim();

export const TIME_NAME = /^(date ?\/? ?time|time ?stamp|timestamp|datetime|date|time|local time|utc time|time \(.*\)|zeit|aika|tid|unix|epoch|unix time|epoch time|t)$|\b(time|date|timestamp)\b/;
const DATE_ONLY = /^(date|datum|päivä|day)$/;
const TIME_ONLY = /^(time|time of day|clock|kello|uhrzeit|hh:mm(:ss)?)$/;
const OIL = /\boil\b|öl|oel|öljy|olja|sump|tank/;
const AMBIENT = /ambient|outside|outdoor|\boat\b|\bair\b|shelter|hangar|room|environment|\bext(ernal)?\b|\bout\b|ulko/;
const HEATER = /heater|preheat|\bheat\b|heating|lämmitin/;
const UNIT = /^(units?|unit of measure|scale)$/;
const TEMP = /temp|°|deg|\bt\d\b|probe|channel|ch ?\d|sensor|celsius|fahrenheit|\u2103|\u2109/;

export function looksLikeHeader(cells: string[]): boolean {
  return cells.some((c) => {
    const n = norm(c);
    return TIME_NAME.test(n) || OIL.test(n) || AMBIENT.test(n) || TEMP.test(n);
  });
}

/**
 * Roles from a header row. Returns the roles found, or a message naming what is missing.
 * `timeByContent` is the index of a column whose first data cell parses as a time (used when no header
 * names one).
 */
export function rolesFromHeader(header: string[], timeByContent: number | null): { roles: ColumnRoles } | { missing: 'time' | 'oil'; message: string } {
  const names = header.map(norm);
  const used = new Set<number>();
  const find = (re: RegExp, skip?: (n: string) => boolean) => {
    const i = names.findIndex((n, k) => !used.has(k) && re.test(n) && !(skip && skip(n)));
    if (i >= 0) used.add(i);
    return i >= 0 ? i : null;
  };
  let time: number | null = null;
  let timeOfDay: number | null = null;
  const dateCol = names.findIndex((n) => DATE_ONLY.test(n));
  const todCol = names.findIndex((n) => TIME_ONLY.test(n));
  if (dateCol >= 0 && todCol >= 0 && dateCol !== todCol) {
    time = dateCol;
    timeOfDay = todCol;
    used.add(dateCol).add(todCol);
  } else {
    time = find(TIME_NAME, (n) => OIL.test(n) || TEMP.test(n) || HEATER.test(n));
  }
  if (time === null && timeByContent !== null) {
    time = timeByContent;
    used.add(time);
  }
  const quoted = header.map((h) => `"${h}"`).join(', ');
  if (time === null) {
    return { missing: 'time', message: `No time column: none of the columns ${quoted} is named like a time (time, date, timestamp) or holds times.` };
  }
  const unit = find(UNIT);
  const heater = find(HEATER, (n) => TEMP.test(n) && !/on|off|state|status/.test(n));
  let oil = find(OIL);
  const ambient = find(AMBIENT, (n) => OIL.test(n));
  if (oil === null) {
    // One remaining temperature-like column is taken as the oil; otherwise the first remaining column.
    const rest = names.map((n, k) => k).filter((k) => !used.has(k) && names[k] !== '');
    const tempLike = rest.filter((k) => TEMP.test(names[k]));
    if (tempLike.length >= 1) oil = tempLike[0];
    else if (rest.length >= 1) oil = rest[0];
    if (oil !== null) used.add(oil);
  }
  if (oil === null) {
    return { missing: 'oil', message: `No oil temperature column: the columns are ${quoted}; name one "oil" (e.g. "Oil (°C)").` };
  }
  return { roles: { time, timeOfDay, oil, ambient, heater, unit } };
}

/** A heater cell: 1 on, 0 off, null if unreadable. */
export function parseHeaterCell(raw: string): 0 | 1 | null {
  const s = raw.trim().toLowerCase();
  if (s === '' || s === '0' || s === 'off' || s === 'false' || s === 'no' || s === 'n') return 0;
  if (s === '1' || s === 'on' || s === 'true' || s === 'yes' || s === 'y') return 1;
  const n = Number(s.replace(',', '.'));
  if (Number.isFinite(n)) return n > 0 ? 1 : 0; // a power column: on when above zero
  return null;
}
