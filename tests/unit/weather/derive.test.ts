// Helpers over a forecast: night low, the soak model's series, staleness, forecast error by lead time.
import { describe, expect, it } from 'vitest';
import {
  ageMinutes,
  forecastSigmaK,
  isStale,
  leadHours,
  nightLow,
  tempAt,
  toOutsideSeries,
  toSoakInputs,
} from '@/lib/weather/derive';
import type { ForecastHour } from '@/lib/weather/types';

const hour = (at: string, tempC: number): ForecastHour => ({ at, tempC, dewPointC: tempC - 1, windMps: 2, cloudFraction: 0.5 });
const HOURS = [
  hour('2025-12-10T18:00:00.000Z', -2),
  hour('2025-12-10T21:00:00.000Z', -5),
  hour('2025-12-11T00:00:00.000Z', -7),
  hour('2025-12-11T03:00:00.000Z', -9),
  hour('2025-12-11T06:00:00.000Z', -8),
  hour('2025-12-11T09:00:00.000Z', -4),
];

describe('tempAt', () => {
  it('is linear between hours and undefined outside the forecast', () => {
    expect(tempAt(HOURS, '2025-12-10T19:30:00.000Z')).toBeCloseTo(-3.5, 9);
    expect(tempAt(HOURS, '2025-12-11T03:00:00.000Z')).toBe(-9);
    expect(tempAt(HOURS, '2025-12-10T17:00:00.000Z')).toBeUndefined();
    expect(tempAt(HOURS, 'not a time')).toBeUndefined();
  });
});

describe('nightLow', () => {
  it('finds the lowest hour in the window', () => {
    expect(nightLow(HOURS, '2025-12-10T18:00:00Z', '2025-12-11T09:00:00Z')).toEqual({
      tempC: -9,
      at: '2025-12-11T03:00:00.000Z',
    });
  });

  it('reads the line between hours at a window end', () => {
    // Window ends at 01:30, halfway from −7 to −9.
    expect(nightLow(HOURS, '2025-12-10T18:00:00Z', '2025-12-11T01:30:00Z')).toEqual({
      tempC: -8,
      at: '2025-12-11T01:30:00.000Z',
    });
  });

  it('is null without overlap or for a reversed window', () => {
    expect(nightLow(HOURS, '2025-12-12T18:00:00Z', '2025-12-13T09:00:00Z')).toBeNull();
    expect(nightLow(HOURS, '2025-12-11T09:00:00Z', '2025-12-10T18:00:00Z')).toBeNull();
    expect(nightLow([], '2025-12-10T18:00:00Z', '2025-12-11T09:00:00Z')).toBeNull();
  });
});

describe('toOutsideSeries', () => {
  it('sorts, drops duplicates and keeps only time and temperature', () => {
    const s = toOutsideSeries([HOURS[2], HOURS[0], HOURS[2], HOURS[1]]);
    expect(s).toEqual([
      { at: '2025-12-10T18:00:00.000Z', tempC: -2 },
      { at: '2025-12-10T21:00:00.000Z', tempC: -5 },
      { at: '2025-12-11T00:00:00.000Z', tempC: -7 },
    ]);
  });
});

describe('toSoakInputs', () => {
  it('gives the soak model epoch-ms series for outside air, wind and cloud', () => {
    const s = toSoakInputs([HOURS[1], HOURS[0]]);
    const t0 = Date.UTC(2025, 11, 10, 18);
    const t1 = Date.UTC(2025, 11, 10, 21);
    expect(s.outside).toEqual([
      { atMs: t0, tempC: -2 },
      { atMs: t1, tempC: -5 },
    ]);
    expect(s.wind).toEqual([
      { atMs: t0, mps: 2 },
      { atMs: t1, mps: 2 },
    ]);
    expect(s.cloud.map((c) => c.fraction)).toEqual([0.5, 0.5]);
  });
});

describe('isStale and ageMinutes', () => {
  const now = new Date('2025-12-10T12:00:00Z');
  it('is stale past an hour by default, or past the given age', () => {
    expect(isStale('2025-12-10T11:00:00Z', now)).toBe(false);
    expect(isStale('2025-12-10T10:59:00Z', now)).toBe(true);
    expect(isStale(new Date('2025-12-10T11:40:00Z'), now, 15)).toBe(true);
    expect(isStale('garbage', now)).toBe(true);
    expect(ageMinutes('2025-12-10T09:00:00Z', now)).toBe(180);
  });
});

describe('forecastSigmaK', () => {
  it('matches 1–2 K at 12–24 h and 2–3 K at 48–72 h (from memory)', () => {
    for (const h of [12, 18, 24]) {
      expect(forecastSigmaK(h)).toBeGreaterThanOrEqual(1);
      expect(forecastSigmaK(h)).toBeLessThanOrEqual(2);
    }
    for (const h of [48, 60, 72]) {
      expect(forecastSigmaK(h)).toBeGreaterThanOrEqual(2);
      expect(forecastSigmaK(h)).toBeLessThanOrEqual(3);
    }
  });

  it('never shrinks with lead time and stays finite', () => {
    let previous = forecastSigmaK(-5);
    for (let h = 0; h <= 600; h += 3) {
      const s = forecastSigmaK(h);
      expect(s).toBeGreaterThanOrEqual(previous);
      expect(Number.isFinite(s)).toBe(true);
      previous = s;
    }
    expect(forecastSigmaK(Number.NaN)).toBe(forecastSigmaK(0));
    expect(leadHours('2025-12-10T12:00:00Z', '2025-12-11T06:00:00Z')).toBe(18);
  });
});
