import { describe, expect, it } from 'vitest';
import { getPosition } from 'suncalc';
import {
  addDays,
  canonicalTimeZone,
  formatAge,
  formatTime,
  formatTimeSeconds,
  localHourOf,
  sunDay,
  tonightWindow,
  zonedTimeToUtc,
} from '@/lib/time';

const MIN = 60_000;
const HOUR = 3_600_000;

describe('suncalc against the NREL Solar Position Algorithm test case', () => {
  // NREL SPA test case: 17 Oct 2003, latitude 39.742476°, longitude −105.1786°, UTC−7.
  // Source: Reda & Andreas, NREL/TP-560-34302, Table A5.1 (docs/sources.md "Sun position").
  // suncalc is a simpler algorithm: docs/sources.md allows ≈ 2 min and ≈ 0.5°.
  const zone = 'Etc/GMT+7'; // the fixed zone UTC−7 (POSIX sign: "GMT+7" is seven hours behind)
  const lat = 39.742476;
  const lon = -105.1786;
  const day = sunDay(zone, lat, lon, { year: 2003, month: 10, day: 17 });
  const local = (h: number, m: number, s: number) => Date.UTC(2003, 9, 17, h + 7, m, s);

  it('sunrise 06:12:43 local, within 2 min', () => {
    expect(day.sunrise).not.toBeNull();
    expect(Math.abs(day.sunrise! - local(6, 12, 43))).toBeLessThanOrEqual(2 * MIN);
    expect(formatTime(day.sunrise!, zone)).toMatch(/^06:1[0-4]$/);
  });

  it('sunset 17:20:19 local, within 2 min', () => {
    expect(day.sunset).not.toBeNull();
    expect(Math.abs(day.sunset! - local(17, 20, 19))).toBeLessThanOrEqual(2 * MIN);
    expect(formatTimeSeconds(day.sunset!, zone)).toMatch(/^17:(1[89]|2[0-2]):\d\d$/);
  });

  it('sun elevation at 12:30:30 local is 39.888° (zenith 50.11162°), within 0.5°', () => {
    const p = getPosition(new Date(local(12, 30, 30)), lat, lon);
    expect(Math.abs(p.altitude - 39.888)).toBeLessThanOrEqual(0.5);
  });

  it('civil twilight brackets the day: dawn before sunrise, dusk after sunset, on the same local date', () => {
    expect(day.date).toBe('2003-10-17');
    expect(day.civilDawn!).toBeLessThan(day.sunrise!);
    expect(day.civilDusk!).toBeGreaterThan(day.sunset!);
    expect(day.sunrise! - day.civilDawn!).toBeLessThan(HOUR);
    expect(day.polar).toBeNull();
  });

  it('in polar night there is no sunrise and the day says so', () => {
    // 78° N in late December: the sun stays below the horizon all day (from memory: polar night north of ~67° N at the solstice).
    const d = sunDay('UTC', 78.2, 15.6, { year: 2024, month: 12, day: 21 });
    expect(d.sunrise).toBeNull();
    expect(d.polar).toBe('night');
  });
});

describe('zone arithmetic', () => {
  it('local wall time to UTC follows the zone offset, winter and summer', () => {
    // Helsinki is UTC+2 in winter and UTC+3 in summer (from memory: EET/EEST).
    expect(new Date(zonedTimeToUtc('Europe/Helsinki', 2025, 1, 15, 18)).toISOString()).toBe('2025-01-15T16:00:00.000Z');
    expect(new Date(zonedTimeToUtc('Europe/Helsinki', 2025, 7, 15, 18)).toISOString()).toBe('2025-07-15T15:00:00.000Z');
    expect(localHourOf('Europe/Helsinki', Date.UTC(2025, 0, 15, 16))).toBe(18);
  });

  it('tonight is 18:00 → 09:00 local; before 06:00 it is the night under way, from then the coming one', () => {
    const evening = tonightWindow('Europe/Helsinki', new Date('2025-01-15T12:00:00Z'));
    expect(new Date(evening.fromMs).toISOString()).toBe('2025-01-15T16:00:00.000Z');
    expect(new Date(evening.toMs).toISOString()).toBe('2025-01-16T07:00:00.000Z');
    const early = tonightWindow('Europe/Helsinki', new Date('2025-01-16T03:00:00Z')); // 05:00 local
    expect(early.fromMs).toBe(evening.fromMs);
    const after = tonightWindow('Europe/Helsinki', new Date('2025-01-16T07:30:00Z')); // 09:30 local
    expect(after.fromMs).toBe(evening.fromMs + 24 * HOUR);
    // 08:00 local: the night that is ending is no longer the one being planned.
    const morning = tonightWindow('Europe/Helsinki', new Date('2025-01-16T06:00:00Z'));
    expect(morning.fromMs).toBe(evening.fromMs + 24 * HOUR);
    expect(morning.evening).toEqual({ year: 2025, month: 1, day: 16 });
  });

  it('the night being planned follows each zone: 08:00 in Anchorage and in Tokyo at the same instant differ', () => {
    // One instant, 2025-01-16T17:00Z: 08:00 in America/Anchorage (UTC−9) → the coming night of the 16th;
    // 02:00 on the 17th in Asia/Tokyo (UTC+9) → the night under way, begun the evening of the 16th.
    const t = new Date('2025-01-16T17:00:00Z');
    expect(tonightWindow('America/Anchorage', t).evening).toEqual({ year: 2025, month: 1, day: 16 });
    expect(tonightWindow('Asia/Tokyo', t).evening).toEqual({ year: 2025, month: 1, day: 16 });
    expect(new Date(tonightWindow('Asia/Tokyo', t).toMs).toISOString()).toBe('2025-01-17T00:00:00.000Z');
    expect(new Date(tonightWindow('America/Anchorage', t).toMs).toISOString()).toBe('2025-01-17T18:00:00.000Z');
  });

  it('the switch to the coming night happens at 06:00 local on the day of the autumn clock change', () => {
    // EU clocks go back on the last Sunday of October at 01:00 UTC (from memory): 26 October 2025,
    // so Helsinki is UTC+3 before and UTC+2 after; 06:00 local that morning is 04:00Z.
    const before = tonightWindow('Europe/Helsinki', new Date('2025-10-26T03:59:00Z'));
    const after = tonightWindow('Europe/Helsinki', new Date('2025-10-26T04:00:00Z'));
    expect(before.evening).toEqual({ year: 2025, month: 10, day: 25 });
    expect(after.evening).toEqual({ year: 2025, month: 10, day: 26 });
    expect((before.toMs - before.fromMs) / HOUR).toBe(16);
  });

  it('a night across the spring daylight-saving change is an hour shorter', () => {
    // The EU moves clocks forward on the last Sunday of March at 01:00 UTC (from memory): 30 March 2025.
    const w = tonightWindow('Europe/Helsinki', new Date('2025-03-29T18:00:00Z'));
    expect(new Date(w.fromMs).toISOString()).toBe('2025-03-29T16:00:00.000Z');
    expect(new Date(w.toMs).toISOString()).toBe('2025-03-30T06:00:00.000Z');
    expect((w.toMs - w.fromMs) / HOUR).toBe(14);
  });

  it('calendar days roll over months and years', () => {
    expect(addDays({ year: 2024, month: 12, day: 31 }, 1)).toEqual({ year: 2025, month: 1, day: 1 });
    expect(addDays({ year: 2024, month: 3, day: 1 }, -1)).toEqual({ year: 2024, month: 2, day: 29 });
  });

  it('time zones are validated with Intl and canonicalised', () => {
    expect(canonicalTimeZone('Europe/Helsinki')).toBe('Europe/Helsinki');
    expect(canonicalTimeZone('Etc/GMT+7')).toBe('Etc/GMT+7');
    expect(canonicalTimeZone('UTC')).toBe('UTC');
    expect(canonicalTimeZone('Mars/Olympus_Mons')).toBeNull();
    expect(canonicalTimeZone('+02:00')).toBeNull();
    expect(canonicalTimeZone('')).toBeNull();
  });
});

describe('ages for people', () => {
  it.each([
    [0, 'just now'],
    [12, '12 min'],
    [60, '1 h'],
    [185, '3 h 5 min'],
    [60 * 52, '2 d 4 h'],
  ])('%i minutes → %s', (m, s) => {
    expect(formatAge(m)).toBe(s);
  });
});
