// Dew and frost points (Magnus constants of Alduchov & Eskridge 1996; ice constants from memory)
// and oil volume against temperature (Engineering ToolBox β).
import { describe, expect, it } from 'vitest';
import {
  airframeSurfaceC,
  dewPointC,
  frostFlags,
  frostPointC,
  frostPointFromDewPointC,
  oilVolumeAt,
  relativeHumidityPercent,
} from '@/lib/thermal';

describe('dew point and frost point (docs/sources.md: computed from those constants)', () => {
  it('−5 °C, RH 80 % → dew point −7.92 °C, frost point −7.02 °C', () => {
    expect(dewPointC(-5, 80)).toBeCloseTo(-7.92, 2);
    expect(frostPointC(-5, 80)).toBeCloseTo(-7.02, 2);
  });

  it('+2 °C, RH 90 % → dew point 0.53 °C', () => {
    expect(dewPointC(2, 90)).toBeCloseTo(0.53, 2);
  });

  it('frost point from the dew point, and RH from the dew point, are consistent', () => {
    expect(frostPointFromDewPointC(dewPointC(-5, 80))).toBeCloseTo(-7.02, 2);
    expect(relativeHumidityPercent(-5, dewPointC(-5, 80))).toBeCloseTo(80, 9);
  });
});

describe('frost on the airframe of an aircraft on a tie-down', () => {
  it('flags a clear calm night near saturation, not a cloudy windy one, nor above freezing', () => {
    const dew = dewPointC(-4, 90);
    const [clearCalm, cloudyWindy, mild] = frostFlags([
      { atMs: 0, airC: -4, dewPointC: dew, cloudFraction: 0, windMps: 0 },
      { atMs: 1, airC: -4, dewPointC: dewPointC(-4, 70), cloudFraction: 1, windMps: 8 },
      { atMs: 2, airC: 6, dewPointC: 5, cloudFraction: 0, windMps: 0 },
    ]);
    expect(clearCalm.frost).toBe(true);
    expect(clearCalm.surfaceC).toBeCloseTo(-7, 9); // 3 K radiation deficit (estimate)
    expect(cloudyWindy.frost).toBe(false);
    expect(mild.frost).toBe(false);
  });

  it('takes the skin at air temperature while the sun is up', () => {
    expect(airframeSurfaceC({ airC: -3, sunElevationDeg: 10 })).toBe(-3);
    expect(airframeSurfaceC({ airC: -3, sunElevationDeg: -5, cloudFraction: 0.5, windMps: 2 })).toBeCloseTo(-3.75, 9);
  });
});

describe('oil volume (β = 0.00070 1/K, Engineering ToolBox "Volumetric (Cubic) Thermal Expansion")', () => {
  it('grows ≈ 6 % from 15 °C to 100 °C: 3.0 L → ≈ 3.18 L', () => {
    const v = oilVolumeAt(3.0, 15, 100);
    expect(v).toBeCloseTo(3.18, 2);
    expect(v / 3 - 1).toBeCloseTo(0.06, 2);
  });

  it('reads about 5 % more hot than cold (common practice), e.g. 80 °C against 10 °C', () => {
    expect(oilVolumeAt(1, 10, 80)).toBeGreaterThan(1.04);
    expect(oilVolumeAt(1, 10, 80)).toBeLessThan(1.06);
  });

  it('corrects there and back to the same reading', () => {
    expect(oilVolumeAt(oilVolumeAt(5.7, 15, 73), 73, 15)).toBeCloseTo(5.7, 12);
  });
});
