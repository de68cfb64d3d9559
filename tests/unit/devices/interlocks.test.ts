import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { applyInterlocks, normaliseWindows, parseAck, relayCommand, relayOnAt, type OnWindow } from '@/lib/devices/commands';
import { HEATER_KINDS } from '@/lib/thermal/presets';
import { parseDeviceTopic, withinOwnTopics } from '@/lib/devices/topics';

const T0 = Date.UTC(2026, 0, 10, 18);
const windowArb = fc.record({ a: fc.integer({ min: 0, max: 24 * 60 }), len: fc.integer({ min: -30, max: 16 * 60 }) }).map(({ a, len }) => ({ fromMs: T0 + a * 60_000, untilMs: T0 + (a + len) * 60_000 }));
const windowsArb = fc.array(windowArb, { maxLength: 8 });
const kindArb = fc.constantFrom(...Object.keys(HEATER_KINDS));

const total = (ws: readonly OnWindow[]) => normaliseWindows(ws).reduce((s, w) => s + w.untilMs - w.fromMs, 0);
const overlaps = (a: OnWindow, b: OnWindow) => a.fromMs < b.untilMs && b.fromMs < a.untilMs;

describe('relay interlocks (properties over random plans and overrides)', () => {
  it('never switches a combustion heater, never exceeds the maximum on-time, never on while flying', () => {
    fc.assert(
      fc.property(kindArb, windowsArb, windowsArb, fc.integer({ min: 0, max: 20 * 60 }), (kind, plan, flying, maxOn) => {
        const r = applyInterlocks({ heaterKind: kind, windows: plan, flying, maxOnMinutes: maxOn });
        if (kind === 'forced-air-propane') expect(r.windows).toEqual([]);
        expect(total(r.windows)).toBeLessThanOrEqual(maxOn * 60_000);
        for (const w of r.windows) for (const f of flying) if (f.untilMs > f.fromMs) expect(overlaps(w, f)).toBe(false);
        // Nothing is switched on that the plan did not ask for.
        for (const w of r.windows) expect(normaliseWindows(plan).some((p) => p.fromMs <= w.fromMs && w.untilMs <= p.untilMs)).toBe(true);
        // What is sent plus what is refused is what was asked.
        expect(total(r.windows) + r.refusals.reduce((s, x) => s + x.window.untilMs - x.window.fromMs, 0)).toBe(total(plan));
      }),
    );
  });

  it('a command is off from its expiry on, whatever its windows', () => {
    fc.assert(
      fc.property(windowsArb, fc.integer({ min: 0, max: 40 * 60 }), (ws, at) => {
        const cmd = relayCommand({ commandId: 'c1', nowMs: T0, windows: ws });
        const atMs = T0 + at * 60_000;
        if (atMs >= Date.parse(cmd.expiresAt)) expect(relayOnAt(cmd, atMs)).toBe(false);
        const inPlan = normaliseWindows(ws).some((w) => atMs >= w.fromMs && atMs < w.untilMs);
        expect(relayOnAt(cmd, atMs)).toBe(inPlan);
      }),
    );
  });

  it('acknowledgements and topics are parsed strictly', () => {
    expect(parseAck('{"commandId":"abc-1"}')).toEqual({ commandId: 'abc-1' });
    expect(parseAck('{"commandId":"a/b"}')).toBeNull();
    expect(parseAck('not json')).toBeNull();
    expect(withinOwnTopics(3, 'r1', 'thawline/v1/3/r1/cmd')).toBe(true);
    expect(withinOwnTopics(3, 'r1', 'thawline/v1/3/r1/#')).toBe(true);
    expect(withinOwnTopics(3, 'r1', 'thawline/v1/3/#')).toBe(false);
    expect(withinOwnTopics(3, 'r1', 'thawline/v1/3/r10/cmd')).toBe(false);
    expect(parseDeviceTopic('thawline/v1/3/r1/temp')).toEqual({ orgId: 3, deviceName: 'r1', channel: 'temp' });
    expect(parseDeviceTopic('thawline/v1/3/r1/other')).toBeNull();
  });
});
