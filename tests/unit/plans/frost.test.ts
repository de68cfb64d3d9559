import { describe, expect, it } from 'vitest';
import { frostRisk, isOutside, lastSunsetBefore } from '@/lib/plans/frost';

// A clear, calm winter night at 61° N: the wing radiates to the sky and sits about 3 K below the air
// (the soak model's skin estimate, docs/soak-model.md); frost forms when the skin is at or below the
// frost point of the air (Magnus over ice, docs/sources.md).
const LAT = 61.5;
const LON = 24;
const DEPART = Date.parse('2026-12-03T05:30:00Z'); // 07:30 local
const night = (dewDepressionK: number, cloud = 0, wind = 0.5) =>
  Array.from({ length: 24 }, (_, i) => {
    const atMs = DEPART - (23 - i) * 3_600_000;
    return { atMs, tempC: -8, dewPointC: -8 - dewDepressionK, windMps: wind, cloudFraction: cloud };
  });

describe('frost on the airframe before departure', () => {
  it('flags a tie-down night whose dew point is above the skin temperature', () => {
    const r = frostRisk({ hours: night(0.8), shelterKind: 'tie-down', departAtMs: DEPART, lat: LAT, lon: LON })!;
    expect(r.likely).toBe(true);
    expect(r.hours).toBeGreaterThan(5);
    expect(r.fromMs).toBeGreaterThanOrEqual(lastSunsetBefore(DEPART, LAT, LON));
  });
  it('does not flag an aircraft under a roof', () => {
    for (const kind of ['t-hangar', 'unheated-hangar', 'heated-hangar']) {
      expect(frostRisk({ hours: night(0.8), shelterKind: kind, departAtMs: DEPART, lat: LAT, lon: LON })).toBeNull();
    }
    expect(isOutside(null)).toBe(true);
  });
  it('does not flag dry air, nor an overcast windy night with the skin at the air temperature', () => {
    expect(frostRisk({ hours: night(8), shelterKind: 'tie-down', departAtMs: DEPART, lat: LAT, lon: LON })!.likely).toBe(false);
    // Dew point 1 K below the air: with full cloud the skin stays at the air temperature, above the frost point.
    expect(frostRisk({ hours: night(1.5, 1, 6), shelterKind: 'tie-down', departAtMs: DEPART, lat: LAT, lon: LON })!.likely).toBe(false);
  });
  it('counts only the hours from the last sunset to departure', () => {
    const r = frostRisk({ hours: night(0.8), shelterKind: 'tie-down', departAtMs: DEPART, lat: LAT, lon: LON })!;
    expect(r.toMs).toBeLessThanOrEqual(DEPART);
    expect(r.hours).toBeLessThanOrEqual(Math.ceil((DEPART - lastSunsetBefore(DEPART, LAT, LON)) / 3_600_000));
  });
});
