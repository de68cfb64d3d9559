// Oil used per engine hour, from corrected dipstick levels. Between two checks with engine hours and no
// oil change between them, the oil used is the first level plus what was added after it, less the
// second level. The figure for an aircraft pools the recent checks: the slope of cumulative oil used
// against engine hours, each stretch between oil changes with its own intercept (a level jumps at a change).
import { correctedLevelL } from './level';

export interface CheckInput {
  id: number;
  atMs: number;
  levelL: number;
  oilTempC: number;
  engineHours: number | null;
  addedL: number;
}

export interface ChangeInput {
  id: number;
  atMs: number;
  engineHours: number;
}

export interface CheckAnalysis {
  id: number;
  correctedL: number;
  /** Engine hours since the last oil change (null without hours on both). */
  oilAgeHours: number | null;
  /** Days since the last oil change (null when no change is logged before it). */
  oilAgeDays: number | null;
  /** Oil used per engine hour since the previous check (null when it cannot be told). */
  sincePreviousLPerH: number | null;
}

export interface ConsumptionSummary {
  /** L per engine hour over the recent checks, null when fewer than 3 checks over 3 engine hours. */
  recentLPerH: number | null;
  /** Engine hours and checks it rests on. */
  hours: number;
  checks: number;
  /** The engine class's usual figure, L/h. */
  usualLPerH: number | null;
  /** True when the recent figure is above the usual one. */
  high: boolean;
}

/** Engine hours looked back over for the recent figure. */
export const RECENT_HOURS = 50;

function lastChangeBefore(changes: ChangeInput[], atMs: number): ChangeInput | null {
  let c: ChangeInput | null = null;
  for (const ch of changes) if (ch.atMs <= atMs) c = ch;
  return c;
}

/** Per-check corrected levels, oil age and interval consumption; checks and changes in any order. */
export function analyseChecks(checksIn: CheckInput[], changesIn: ChangeInput[]): CheckAnalysis[] {
  const checks = [...checksIn].sort((a, b) => a.atMs - b.atMs);
  const changes = [...changesIn].sort((a, b) => a.atMs - b.atMs);
  const out: CheckAnalysis[] = [];
  for (let i = 0; i < checks.length; i++) {
    const c = checks[i];
    const change = lastChangeBefore(changes, c.atMs);
    const corrected = correctedLevelL(c.levelL, c.oilTempC);
    let since: number | null = null;
    const p = checks[i - 1];
    if (p && p.engineHours !== null && c.engineHours !== null && lastChangeBefore(changes, p.atMs) === change) {
      const dh = c.engineHours - p.engineHours;
      if (dh >= 0.5) since = (correctedLevelL(p.levelL, p.oilTempC) + p.addedL - corrected) / dh;
    }
    out.push({
      id: c.id,
      correctedL: corrected,
      oilAgeHours: change && c.engineHours !== null ? Math.max(0, c.engineHours - change.engineHours) : null,
      oilAgeDays: change ? (c.atMs - change.atMs) / 86_400_000 : null,
      sincePreviousLPerH: since,
    });
  }
  return out;
}

/** The recent consumption figure (L/h) and whether it is above the class's usual one. */
export function consumptionSummary(checksIn: CheckInput[], changesIn: ChangeInput[], usualLPerH: number | null, recentHours = RECENT_HOURS): ConsumptionSummary {
  const checks = [...checksIn].filter((c) => c.engineHours !== null).sort((a, b) => a.atMs - b.atMs);
  const changes = [...changesIn].sort((a, b) => a.atMs - b.atMs);
  const none: ConsumptionSummary = { recentLPerH: null, hours: 0, checks: 0, usualLPerH, high: false };
  if (checks.length < 3) return none;
  const latest = checks[checks.length - 1].engineHours!;
  const recent = checks.filter((c) => c.engineHours! >= latest - recentHours);
  // Cumulative oil used within each stretch between oil changes.
  const groups = new Map<number, { h: number[]; u: number[] }>();
  let prev: CheckInput | null = null;
  let cum = 0;
  for (const c of recent) {
    const key = lastChangeBefore(changes, c.atMs)?.id ?? 0;
    if (!prev || (lastChangeBefore(changes, prev.atMs)?.id ?? 0) !== key) cum = 0;
    else cum += correctedLevelL(prev.levelL, prev.oilTempC) + prev.addedL - correctedLevelL(c.levelL, c.oilTempC);
    const g = groups.get(key) ?? { h: [], u: [] };
    g.h.push(c.engineHours!);
    g.u.push(cum);
    groups.set(key, g);
    prev = c;
  }
  let sxy = 0;
  let sxx = 0;
  let n = 0;
  let span = 0;
  for (const g of groups.values()) {
    if (g.h.length < 2) continue;
    const mh = g.h.reduce((a, b) => a + b, 0) / g.h.length;
    const mu = g.u.reduce((a, b) => a + b, 0) / g.u.length;
    for (let i = 0; i < g.h.length; i++) {
      sxy += (g.h[i] - mh) * (g.u[i] - mu);
      sxx += (g.h[i] - mh) ** 2;
    }
    n += g.h.length;
    span += g.h[g.h.length - 1] - g.h[0];
  }
  if (n < 3 || span < 3 || sxx <= 0) return { ...none, hours: span, checks: n };
  const rate = sxy / sxx;
  return { recentLPerH: rate, hours: span, checks: n, usualLPerH, high: usualLPerH !== null && rate > usualLPerH * (1 + 1e-6) };
}
