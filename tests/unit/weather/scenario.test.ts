// Scenario files and their loader.
import { describe, expect, it } from 'vitest';
import {
  eventWeight,
  eventWindowMs,
  listScenarios,
  loadScenario,
  ScenarioError,
  ScenarioSchema,
  type ScenarioEvent,
} from '@/lib/weather/scenario';

const HOUR_MS = 3_600_000;

describe('loadScenario', () => {
  it('loads the shipped scenarios', () => {
    expect(listScenarios()).toEqual(expect.arrayContaining(['cold-snap', 'seasonal']));
    expect(loadScenario('seasonal').events).toEqual([]);
    const snap = loadScenario('cold-snap').events[0];
    expect(snap.deltaK).toBeLessThanOrEqual(-10);
    expect(snap.deltaK).toBeGreaterThanOrEqual(-12);
    expect(snap.cloud).toBeLessThanOrEqual(0.2);
  });

  it('accepts only [a-z0-9-] names and names missing files plainly', () => {
    for (const name of ['../package', 'Cold-Snap', 'cold_snap', 'a/b', '', 'x'.repeat(65)]) {
      expect(() => loadScenario(name), name).toThrow(ScenarioError);
    }
    expect(() => loadScenario('no-such-scenario')).toThrow(/unknown scenario "no-such-scenario"/);
  });
});

describe('ScenarioSchema', () => {
  const event = { offsetHoursFromNow: [6, 60], deltaK: -11, cloud: 0.1, windMps: 1.5 };

  it('fills the ramp default', () => {
    const s = ScenarioSchema.parse({ events: [event] });
    expect(s.events[0].rampHours).toBe(6);
  });

  it('rejects windows given twice or not at all, reversed windows, unknown keys, cloud above 1', () => {
    const bad = [
      { ...event, offsetHoursFromLocalMidnight: [0, 10] },
      { deltaK: -5 },
      { ...event, offsetHoursFromNow: [60, 6] },
      { ...event, colour: 'blue' },
      { ...event, cloud: 10 },
    ];
    for (const e of bad) expect(ScenarioSchema.safeParse({ events: [e] }).success, JSON.stringify(e)).toBe(false);
  });
});

describe('event windows', () => {
  const now = Date.UTC(2025, 11, 10, 21, 0);
  const fromNow: ScenarioEvent = { offsetHoursFromNow: [6, 60], deltaK: -11, rampHours: 6 };
  const fromMidnight: ScenarioEvent = { offsetHoursFromLocalMidnight: [12, 84], deltaK: -11, rampHours: 6 };

  it('places a now-relative window from now', () => {
    expect(eventWindowMs(fromNow, now, 37.6)).toEqual([now + 6 * HOUR_MS, now + 60 * HOUR_MS]);
  });

  it('places a midnight-relative window from local solar midnight, the same all day', () => {
    const shift = (30 / 15) * HOUR_MS; // 30° E: solar time is UTC + 2 h
    const midnight = Date.UTC(2025, 11, 10) - shift;
    expect(eventWindowMs(fromMidnight, now, 30)).toEqual([midnight + 12 * HOUR_MS, midnight + 84 * HOUR_MS]);
    expect(eventWindowMs(fromMidnight, midnight + HOUR_MS, 30)).toEqual(eventWindowMs(fromMidnight, now, 30));
  });

  it('ramps in and out smoothly and is full in between', () => {
    const [a, b] = eventWindowMs(fromNow, now, 0);
    expect(eventWeight(fromNow, a, now, 0)).toBe(0);
    expect(eventWeight(fromNow, a + 3 * HOUR_MS, now, 0)).toBeCloseTo(0.5, 6);
    expect(eventWeight(fromNow, a + 6 * HOUR_MS, now, 0)).toBe(1);
    expect(eventWeight(fromNow, (a + b) / 2, now, 0)).toBe(1);
    expect(eventWeight(fromNow, b - 3 * HOUR_MS, now, 0)).toBeCloseTo(0.5, 6);
    expect(eventWeight(fromNow, b + HOUR_MS, now, 0)).toBe(0);
  });
});
