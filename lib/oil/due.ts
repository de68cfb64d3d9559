// When the next oil change is due: by engine hours or by months since the last change, whichever comes first.

export interface DueInput {
  last: { atMs: number; engineHours: number } | null;
  intervalHours: number | null;
  intervalMonths: number | null;
  /** The latest engine hours known (from checks or changes). */
  currentHours: number | null;
  nowMs: number;
}

export interface OilChangeDue {
  status: 'ok' | 'soon' | 'overdue' | 'unknown';
  /** Which limit comes first. */
  by: 'hours' | 'months' | null;
  dueAtHours: number | null;
  hoursLeft: number | null;
  dueAtMs: number | null;
  daysLeft: number | null;
  /** What is missing for an answer, when status is unknown. */
  missing?: 'interval' | 'change';
}

/** The same day of the month `months` later (clamped to the month's last day), in UTC. */
export function addMonths(ms: number, months: number): number {
  const d = new Date(ms);
  const y = d.getUTCFullYear();
  const m = d.getUTCMonth() + months;
  const last = new Date(Date.UTC(y, m + 1, 0)).getUTCDate();
  return Date.UTC(y, m, Math.min(d.getUTCDate(), last), d.getUTCHours(), d.getUTCMinutes(), d.getUTCSeconds());
}

export function oilChangeDue(i: DueInput): OilChangeDue {
  const unknown = (missing: 'interval' | 'change'): OilChangeDue => ({ status: 'unknown', by: null, dueAtHours: null, hoursLeft: null, dueAtMs: null, daysLeft: null, missing });
  if (i.intervalHours === null && i.intervalMonths === null) return unknown('interval');
  if (!i.last) return unknown('change');
  const dueAtHours = i.intervalHours !== null ? i.last.engineHours + i.intervalHours : null;
  const hoursLeft = dueAtHours !== null && i.currentHours !== null ? dueAtHours - i.currentHours : null;
  const dueAtMs = i.intervalMonths !== null ? addMonths(i.last.atMs, i.intervalMonths) : null;
  const daysLeft = dueAtMs !== null ? (dueAtMs - i.nowMs) / 86_400_000 : null;
  // Which limit comes first: compare the fraction of each interval left.
  const fracH = hoursLeft !== null && i.intervalHours ? hoursLeft / i.intervalHours : Infinity;
  const fracM = daysLeft !== null && i.intervalMonths ? daysLeft / (i.intervalMonths * 30.44) : Infinity;
  const by = fracH === Infinity && fracM === Infinity ? null : fracH <= fracM ? 'hours' : 'months';
  let status: OilChangeDue['status'] = 'ok';
  if ((hoursLeft !== null && hoursLeft <= 0) || (daysLeft !== null && daysLeft <= 0)) status = 'overdue';
  else if ((hoursLeft !== null && hoursLeft <= Math.max(5, 0.1 * (i.intervalHours ?? 0))) || (daysLeft !== null && daysLeft <= 14)) status = 'soon';
  return { status, by, dueAtHours, hoursLeft, dueAtMs, daysLeft };
}
