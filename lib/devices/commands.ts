// Relay commands (pure: no I/O, no clock — the caller passes `nowMs`).
//
// A command is the whole schedule for one relay: "on from … until …" windows and a hard expiry after
// which the relay stays off whatever it last heard, so a relay that loses the server never stays on
// past the plan. Interlocks decide what may be sent:
//   - a combustion heater (propane forced air) is never switched remotely;
//   - a heater's total on-time in one command never exceeds its maximum on-time;
//   - a heater is never on while the aircraft is marked flying (those intervals are cut out).
import { z } from 'zod';

export const COMBUSTION_HEATER_KINDS: readonly string[] = ['forced-air-propane'];
/** Default maximum on-time per heater and command, minutes (estimate: a long winter night). */
export const DEFAULT_MAX_ON_MINUTES = 12 * 60;
/** How long a relay has to acknowledge before the operators are alerted, ms. */
export const ACK_TIMEOUT_MS = 60_000;

export interface OnWindow {
  fromMs: number;
  untilMs: number;
}

export interface InterlockInput {
  heaterKind: string;
  maxOnMinutes?: number;
  /** Intervals in which the aircraft is marked flying. */
  flying: readonly OnWindow[];
  windows: readonly OnWindow[];
}

export type RefusalReason = 'combustion-heater' | 'max-on-time' | 'aircraft-flying';

export interface InterlockResult {
  windows: OnWindow[];
  refusals: { reason: RefusalReason; window: OnWindow }[];
}

export function isCombustion(heaterKind: string): boolean {
  return COMBUSTION_HEATER_KINDS.includes(heaterKind);
}

/** Sorted, merged, non-empty windows. */
export function normaliseWindows(ws: readonly OnWindow[]): OnWindow[] {
  const sorted = ws.filter((w) => Number.isFinite(w.fromMs) && Number.isFinite(w.untilMs) && w.untilMs > w.fromMs).map((w) => ({ ...w })).sort((a, b) => a.fromMs - b.fromMs);
  const out: OnWindow[] = [];
  for (const w of sorted) {
    const last = out[out.length - 1];
    if (last && w.fromMs <= last.untilMs) last.untilMs = Math.max(last.untilMs, w.untilMs);
    else out.push(w);
  }
  return out;
}

/** Removes `cut` from each window. */
function subtract(ws: OnWindow[], cut: readonly OnWindow[]): { kept: OnWindow[]; removed: OnWindow[] } {
  let kept = ws;
  const removed: OnWindow[] = [];
  for (const c of normaliseWindows(cut)) {
    const next: OnWindow[] = [];
    for (const w of kept) {
      if (c.untilMs <= w.fromMs || c.fromMs >= w.untilMs) {
        next.push(w);
        continue;
      }
      removed.push({ fromMs: Math.max(w.fromMs, c.fromMs), untilMs: Math.min(w.untilMs, c.untilMs) });
      if (w.fromMs < c.fromMs) next.push({ fromMs: w.fromMs, untilMs: c.fromMs });
      if (c.untilMs < w.untilMs) next.push({ fromMs: c.untilMs, untilMs: w.untilMs });
    }
    kept = next;
  }
  return { kept, removed };
}

/** What may be sent for one heater, and every refusal (for the audit log). */
export function applyInterlocks(input: InterlockInput): InterlockResult {
  const ws = normaliseWindows(input.windows);
  if (isCombustion(input.heaterKind)) return { windows: [], refusals: ws.map((window) => ({ reason: 'combustion-heater', window })) };
  const refusals: InterlockResult['refusals'] = [];
  const { kept, removed } = subtract(ws, input.flying);
  for (const window of removed) refusals.push({ reason: 'aircraft-flying', window });
  const maxMs = Math.max(0, input.maxOnMinutes ?? DEFAULT_MAX_ON_MINUTES) * 60_000;
  const out: OnWindow[] = [];
  let used = 0;
  for (const w of kept) {
    const room = maxMs - used;
    const len = w.untilMs - w.fromMs;
    if (room <= 0) {
      refusals.push({ reason: 'max-on-time', window: w });
    } else if (len > room) {
      out.push({ fromMs: w.fromMs, untilMs: w.fromMs + room });
      refusals.push({ reason: 'max-on-time', window: { fromMs: w.fromMs + room, untilMs: w.untilMs } });
      used = maxMs;
    } else {
      out.push(w);
      used += len;
    }
  }
  return { windows: out, refusals };
}

/** The payload on `…/cmd` (device contract, README). */
export interface RelayCommand {
  v: 1;
  commandId: string;
  issuedAt: string;
  /** After this instant the relay is off whatever it last heard. */
  expiresAt: string;
  windows: { from: string; until: string }[];
}

export function relayCommand({ commandId, nowMs, windows }: { commandId: string; nowMs: number; windows: readonly OnWindow[] }): RelayCommand {
  const ws = normaliseWindows(windows).filter((w) => w.untilMs > nowMs);
  const lastEnd = ws.length ? ws[ws.length - 1].untilMs : nowMs;
  return {
    v: 1,
    commandId,
    issuedAt: new Date(nowMs).toISOString(),
    expiresAt: new Date(lastEnd).toISOString(),
    windows: ws.map((w) => ({ from: new Date(Math.max(w.fromMs, nowMs)).toISOString(), until: new Date(w.untilMs).toISOString() })),
  };
}

/** Whether a relay obeying `cmd` is on at `atMs` (what the simulator and a real relay do). */
export function relayOnAt(cmd: RelayCommand, atMs: number): boolean {
  if (atMs >= Date.parse(cmd.expiresAt)) return false;
  return cmd.windows.some((w) => atMs >= Date.parse(w.from) && atMs < Date.parse(w.until));
}

const ackSchema = z.object({ commandId: z.string().min(1).max(64).regex(/^[A-Za-z0-9_-]+$/) });

/** A relay's acknowledgement `{ "commandId": "…" }`, or null when malformed. */
export function parseAck(payload: string): { commandId: string } | null {
  try {
    const r = ackSchema.safeParse(JSON.parse(payload));
    return r.success ? r.data : null;
  } catch {
    return null;
  }
}

/** Whether an acknowledgement is overdue: sent more than ACK_TIMEOUT_MS ago and not acknowledged. */
export function ackOverdue({ sentAtMs, ackedAtMs, nowMs }: { sentAtMs: number; ackedAtMs: number | null; nowMs: number }): boolean {
  return ackedAtMs === null && nowMs - sentAtMs > ACK_TIMEOUT_MS;
}

const atSchema = z.string().max(40).refine((s) => Number.isFinite(Date.parse(s)));
const tempSchema = z.object({ tempC: z.number(), at: atSchema.optional() });
const stateSchema = z.object({ on: z.boolean(), powerW: z.number().min(0).max(100_000).optional(), at: atSchema.optional() });

/** A probe's `{ tempC, at? }`: null when malformed; `flagged` when the value is impossible (never trusted). */
export function parseTemp(payload: string, nowMs: number): { atMs: number; tempC: number; flagged: boolean } | null {
  try {
    const r = tempSchema.safeParse(JSON.parse(payload));
    if (!r.success) return null;
    const atMs = readingTime(r.data.at, nowMs);
    const t = r.data.tempC;
    return { atMs, tempC: t, flagged: !(Number.isFinite(t) && t > -60 && t < 200) };
  } catch {
    return null;
  }
}

/** A relay's `{ on, powerW?, at? }`, or null when malformed. */
export function parseState(payload: string, nowMs: number): { atMs: number; on: boolean; powerW: number | null } | null {
  try {
    const r = stateSchema.safeParse(JSON.parse(payload));
    return r.success ? { atMs: readingTime(r.data.at, nowMs), on: r.data.on, powerW: r.data.powerW ?? null } : null;
  } catch {
    return null;
  }
}

/** The device's own time stamp if within 10 minutes of the server's clock, else the server's. */
function readingTime(at: string | undefined, nowMs: number): number {
  const t = at ? Date.parse(at) : Number.NaN;
  return Number.isFinite(t) && Math.abs(t - nowMs) < 10 * 60_000 ? t : nowMs;
}
