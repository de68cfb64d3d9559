import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { tariffPeriodsBetween } from '@/lib/tariffs/expand';
import { DEFAULT_TARIFF, tariffSchema, uniformSchedule, type TariffShape } from '@/lib/validation/tariffs';

const HOUR = 3_600_000;
const utc = (s: string) => Date.parse(s);

// Night 22–07, day 07–17 and 21–22, evening peak 17–21 on weekdays; weekends night and day only.
// The structure (periods, 12×24 weekday/weekend month-by-hour matrices) is the OpenEI Utility Rate
// Database schema's (docs/sources.md); the prices are invented for the test, peak 2.5× night
// (docs/sources.md: peak typically 2–3× off-peak, from memory).
const weekdayHours = Array.from({ length: 24 }, (_, h) => (h >= 22 || h < 7 ? 0 : h >= 17 && h < 21 ? 2 : 1));
const weekendHours = Array.from({ length: 24 }, (_, h) => (h >= 22 || h < 7 ? 0 : 1));
const TOU: TariffShape = {
  currency: 'EUR',
  periods: [
    { name: 'Night', pricePerKWh: 0.08 },
    { name: 'Day', pricePerKWh: 0.14 },
    { name: 'Peak', pricePerKWh: 0.2 },
  ],
  weekdaySchedule: uniformSchedule(weekdayHours),
  weekendSchedule: uniformSchedule(weekendHours),
};

const brief = (list: { fromMs: number; toMs: number; pricePerKWh: number }[]) =>
  list.map((p) => [new Date(p.fromMs).toISOString().slice(0, 16), new Date(p.toMs).toISOString().slice(0, 16), p.pricePerKWh]);

describe('tariffPeriodsBetween', () => {
  it('with no tariff stored, the flat default price covers the whole span', () => {
    const r = tariffPeriodsBetween({ tariff: null, timeZone: 'Europe/Helsinki', fromMs: utc('2026-01-14T16:00:00Z'), toMs: utc('2026-01-15T07:00:00Z') });
    expect(r).toEqual([{ fromMs: utc('2026-01-14T16:00:00Z'), toMs: utc('2026-01-15T07:00:00Z'), pricePerKWh: DEFAULT_TARIFF.periods[0].pricePerKWh, period: 'Flat (default)' }]);
    expect(DEFAULT_TARIFF.periods[0].pricePerKWh).toBe(0.2);
  });

  it('a winter weekday night in Helsinki (UTC+2 in winter, from memory): peak, day, night, day at the local hours', () => {
    // Wednesday 14 Jan 2026, 18:00 local = 16:00Z, to Thursday 09:00 local = 07:00Z.
    const r = tariffPeriodsBetween({ tariff: TOU, timeZone: 'Europe/Helsinki', fromMs: utc('2026-01-14T16:00:00Z'), toMs: utc('2026-01-15T07:00:00Z') });
    expect(brief(r)).toEqual([
      ['2026-01-14T16:00', '2026-01-14T19:00', 0.2], // 18–21 local
      ['2026-01-14T19:00', '2026-01-14T20:00', 0.14], // 21–22
      ['2026-01-14T20:00', '2026-01-15T05:00', 0.08], // 22–07
      ['2026-01-15T05:00', '2026-01-15T07:00', 0.14], // 07–09
    ]);
  });

  it('cuts at the span’s own bounds inside an hour', () => {
    const r = tariffPeriodsBetween({ tariff: TOU, timeZone: 'Europe/Helsinki', fromMs: utc('2026-01-14T18:40:00Z'), toMs: utc('2026-01-14T20:10:00Z') });
    expect(brief(r)).toEqual([
      ['2026-01-14T18:40', '2026-01-14T19:00', 0.2],
      ['2026-01-14T19:00', '2026-01-14T20:00', 0.14],
      ['2026-01-14T20:00', '2026-01-14T20:10', 0.08],
    ]);
  });

  it('Friday evening follows the weekday schedule, Saturday the weekend one (local dates)', () => {
    // Friday 16 Jan 2026 18:00 local to Saturday 20:00 local.
    const r = tariffPeriodsBetween({ tariff: TOU, timeZone: 'Europe/Helsinki', fromMs: utc('2026-01-16T16:00:00Z'), toMs: utc('2026-01-17T18:00:00Z') });
    expect(brief(r)).toEqual([
      ['2026-01-16T16:00', '2026-01-16T19:00', 0.2],
      ['2026-01-16T19:00', '2026-01-16T20:00', 0.14],
      ['2026-01-16T20:00', '2026-01-17T05:00', 0.08],
      ['2026-01-17T05:00', '2026-01-17T18:00', 0.14], // no peak on Saturday
    ]);
  });

  it('spring forward: the night before EU summer time starts (last Sunday of March, 01:00 UTC; from memory) is one hour shorter', () => {
    // Saturday 28 Mar 2026 22:00 EET = 20:00Z; Sunday 07:00 EEST (UTC+3) = 04:00Z: 8 h of night, not 9.
    const r = tariffPeriodsBetween({ tariff: TOU, timeZone: 'Europe/Helsinki', fromMs: utc('2026-03-28T19:00:00Z'), toMs: utc('2026-03-29T06:00:00Z') });
    expect(brief(r)).toEqual([
      ['2026-03-28T19:00', '2026-03-28T20:00', 0.14],
      ['2026-03-28T20:00', '2026-03-29T04:00', 0.08],
      ['2026-03-29T04:00', '2026-03-29T06:00', 0.14],
    ]);
  });

  it('fall back: the night EU summer time ends (last Sunday of October, 01:00 UTC; from memory) is one hour longer', () => {
    // Saturday 24 Oct 2026 22:00 EEST = 19:00Z; Sunday 07:00 EET (UTC+2) = 05:00Z: 10 h of night.
    const r = tariffPeriodsBetween({ tariff: TOU, timeZone: 'Europe/Helsinki', fromMs: utc('2026-10-24T18:00:00Z'), toMs: utc('2026-10-25T06:00:00Z') });
    expect(brief(r)).toEqual([
      ['2026-10-24T18:00', '2026-10-24T19:00', 0.14],
      ['2026-10-24T19:00', '2026-10-25T05:00', 0.08],
      ['2026-10-25T05:00', '2026-10-25T06:00', 0.14],
    ]);
  });

  it('a zone half an hour off UTC (Asia/Kolkata, UTC+05:30, from memory) changes price at its own local hours', () => {
    // Wednesday 14 Jan 2026 21:00 local = 15:30Z; 22:00 local = 16:30Z.
    const r = tariffPeriodsBetween({ tariff: TOU, timeZone: 'Asia/Kolkata', fromMs: utc('2026-01-14T15:00:00Z'), toMs: utc('2026-01-14T17:00:00Z') });
    expect(brief(r)).toEqual([
      ['2026-01-14T15:00', '2026-01-14T15:30', 0.2],
      ['2026-01-14T15:30', '2026-01-14T16:30', 0.14],
      ['2026-01-14T16:30', '2026-01-14T17:00', 0.08],
    ]);
  });

  it('the month row applies: a peak only in winter months is absent in October and present in November', () => {
    const seasonal: TariffShape = {
      ...TOU,
      weekdaySchedule: Array.from({ length: 12 }, (_, m) => (m >= 10 || m <= 2 ? [...weekdayHours] : [...weekendHours])),
    };
    // Friday 30 Oct and Monday 2 Nov 2026, 18:00–19:00 local (EET, UTC+2 after 25 Oct).
    const oct = tariffPeriodsBetween({ tariff: seasonal, timeZone: 'Europe/Helsinki', fromMs: utc('2026-10-30T16:00:00Z'), toMs: utc('2026-10-30T17:00:00Z') });
    const nov = tariffPeriodsBetween({ tariff: seasonal, timeZone: 'Europe/Helsinki', fromMs: utc('2026-11-02T16:00:00Z'), toMs: utc('2026-11-02T17:00:00Z') });
    expect(oct[0].pricePerKWh).toBe(0.14);
    expect(nov[0].pricePerKWh).toBe(0.2);
  });

  it('an empty or reversed span gives no intervals; an over-long one is refused', () => {
    expect(tariffPeriodsBetween({ tariff: TOU, timeZone: 'UTC', fromMs: 10, toMs: 10 })).toEqual([]);
    expect(tariffPeriodsBetween({ tariff: TOU, timeZone: 'UTC', fromMs: 10, toMs: 5 })).toEqual([]);
    expect(() => tariffPeriodsBetween({ tariff: TOU, timeZone: 'UTC', fromMs: 0, toMs: 500 * 24 * HOUR })).toThrow(RangeError);
  });

  it('property: intervals tile the span, neighbours differ, and each price is the schedule’s at its local hour (read with Intl)', () => {
    const zones = ['Europe/Helsinki', 'America/Anchorage', 'America/St_Johns', 'Australia/Lord_Howe', 'Asia/Kathmandu', 'UTC'];
    const weekdayNames = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
    fc.assert(
      fc.property(
        fc.constantFrom(...zones),
        fc.integer({ min: utc('2025-01-01T00:00:00Z') / 60000, max: utc('2027-12-31T00:00:00Z') / 60000 }),
        fc.integer({ min: 1, max: 4 * 24 * 60 }),
        (zone, startMin, lenMin) => {
          const fromMs = startMin * 60000;
          const toMs = fromMs + lenMin * 60000;
          const r = tariffPeriodsBetween({ tariff: TOU, timeZone: zone, fromMs, toMs });
          expect(r[0].fromMs).toBe(fromMs);
          expect(r[r.length - 1].toMs).toBe(toMs);
          const fmt = new Intl.DateTimeFormat('en-US', { timeZone: zone, hourCycle: 'h23', weekday: 'short', month: 'numeric', hour: '2-digit' });
          for (let i = 0; i < r.length; i++) {
            expect(r[i].toMs).toBeGreaterThan(r[i].fromMs);
            if (i > 0) {
              expect(r[i].fromMs).toBe(r[i - 1].toMs);
              expect(r[i].period).not.toBe(r[i - 1].period);
            }
            // Sample every 30 minutes inside the interval (and its last minute).
            for (let t = r[i].fromMs; t < r[i].toMs; t += Math.min(30 * 60000, Math.max(60000, r[i].toMs - t - 60000))) {
              const parts = fmt.formatToParts(t);
              const get = (k: string) => parts.find((p) => p.type === k)!.value;
              const dow = weekdayNames.indexOf(get('weekday'));
              const sched = dow === 0 || dow === 6 ? TOU.weekendSchedule : TOU.weekdaySchedule;
              const expected = TOU.periods[sched[Number(get('month')) - 1][Number(get('hour'))]];
              expect(r[i].period).toBe(expected.name);
              if (r[i].toMs - t <= 60000) break;
            }
          }
        },
      ),
      { numRuns: 150 },
    );
  });
});

describe('tariffSchema', () => {
  it('accepts the three-period tariff and upper-cases the currency', () => {
    const t = tariffSchema.parse({ ...TOU, currency: 'eur' });
    expect(t.currency).toBe('EUR');
  });

  it('names the field at fault', () => {
    const r = tariffSchema.safeParse({ ...TOU, currency: 'euro', weekdaySchedule: TOU.weekdaySchedule.slice(0, 11) });
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['currency', 'weekdaySchedule']));
    const bad = structuredClone(TOU);
    bad.weekendSchedule[3][5] = 7;
    const r2 = tariffSchema.safeParse(bad);
    expect(r2.error!.issues[0].path.join('.')).toBe('weekendSchedule.3.5');
    const unused = { ...TOU, periods: [...TOU.periods, { name: 'Spare', pricePerKWh: 0.1 }] };
    expect(tariffSchema.safeParse(unused).error!.issues[0].path.join('.')).toBe('periods.3.name');
  });
});
