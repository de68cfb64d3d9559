// suncalc against the NREL Solar Position Algorithm test case (Reda & Andreas, NREL/TP-560-34302,
// Table A5.1, published): 17 Oct 2003 12:30:30 local (UTC−7), 39.742476° N, 105.1786° W.
// suncalc is a simpler algorithm: ≈ 0.5° and ≈ 2 min allowed (docs/sources.md).
import { getPosition, getTimes } from 'suncalc';
import { describe, expect, it } from 'vitest';
import { sunElevationDeg } from '@/lib/thermal';

const lat = 39.742476;
const lon = -105.1786;
const at = new Date('2003-10-17T19:30:30Z');

describe('suncalc vs NREL SPA', () => {
  it('elevation 39.888° (zenith 50.11162°) ± 0.5°', () => {
    expect(Math.abs(getPosition(at, lat, lon).altitude - 39.888)).toBeLessThan(0.5);
    expect(Math.abs(sunElevationDeg(at.getTime(), lat, lon) - (90 - 50.11162))).toBeLessThan(0.5);
  });

  it('azimuth 194.34024° ± 0.5° (suncalc 2 reports degrees clockwise from north, as SPA does)', () => {
    const az = getPosition(at, lat, lon).azimuth;
    expect(Math.abs(az - 194.34024)).toBeLessThan(0.5);
  });

  it('sunrise 06:12:43 and sunset 17:20:19 local (UTC−7) ± 2 min', () => {
    const t = getTimes(at, lat, lon);
    const rise = Date.parse('2003-10-17T13:12:43Z');
    const set = Date.parse('2003-10-18T00:20:19Z');
    expect(Math.abs(t.sunrise!.getTime() - rise)).toBeLessThan(2 * 60_000);
    expect(Math.abs(t.sunset!.getTime() - set)).toBeLessThan(2 * 60_000);
  });
});
