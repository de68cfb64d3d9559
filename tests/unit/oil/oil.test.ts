import { describe, expect, it } from 'vitest';
import { addMonths, analyseChecks, consumptionSummary, correctedLevelL, correctionFraction, oilChangeDue, OIL_BETA_PER_K, type CheckInput } from '@/lib/oil';
import { oilVolumeAt } from '@/lib/thermal/oil';

describe('dipstick readings corrected to 15 °C', () => {
  it('uses β = 0.00070 1/K (Engineering ToolBox, "Volumetric (Cubic) Thermal Expansion")', () => {
    expect(OIL_BETA_PER_K).toBe(0.0007);
  });

  it('a reading taken at 90 °C corrected to 15 °C is about 5 % lower (Engineering ToolBox β; common practice)', () => {
    const f = correctionFraction(90);
    expect(f).toBeLessThan(-0.045);
    expect(f).toBeGreaterThan(-0.06);
    expect(correctedLevelL(3.0, 90)).toBeCloseTo(3.0 * (1 - 0.051), 2);
  });

  it('3.0 L at 15 °C is about 3.18 L at 100 °C (docs/sources.md: ≈ 6 % from 15 to 100 °C)', () => {
    expect(oilVolumeAt(3.0, 15, 100)).toBeCloseTo(3.18, 2);
  });

  it('leaves a reading at 15 °C as it is, raises a reading taken colder, and corrects there and back exactly', () => {
    expect(correctedLevelL(7.2, 15)).toBe(7.2);
    expect(correctedLevelL(7.2, -20)).toBeGreaterThan(7.2);
    expect(oilVolumeAt(correctedLevelL(7.2, 60), 15, 60)).toBeCloseTo(7.2, 12);
  });
});

// A season of checks of an engine using exactly 0.1 L per engine hour, read at varying temperatures,
// topped up now and then, with an oil change in the middle.
function season(rate: number) {
  const checks: CheckInput[] = [];
  const changes = [{ id: 1, atMs: Date.UTC(2026, 9, 1), engineHours: 100 }, { id: 2, atMs: Date.UTC(2026, 10, 1), engineHours: 130 }];
  let hours = 100;
  let level15 = 7.5;
  let id = 1;
  for (let day = 1; day <= 60; day++) {
    const atMs = Date.UTC(2026, 9, 1) + day * 86_400_000;
    if (atMs >= changes[1].atMs && hours < 130) {
      hours = 130;
      level15 = 7.5;
    }
    const oilTempC = [-15, 5, 40, 70][day % 4];
    const levelL = level15 * Math.exp(OIL_BETA_PER_K * (oilTempC - 15));
    const addedL = level15 < 6.5 ? 1 : 0;
    checks.push({ id: id++, atMs, levelL, oilTempC, engineHours: hours, addedL });
    level15 += addedL;
    const flown = day % 3 === 0 ? 0 : 1.5;
    hours += flown;
    level15 -= rate * flown;
  }
  return { checks, changes };
}

describe('oil used per engine hour', () => {
  it('recovers the rate from corrected levels across top-ups and an oil change', () => {
    const { checks, changes } = season(0.1);
    const s = consumptionSummary(checks, changes, 0.1);
    expect(s.recentLPerH).toBeCloseTo(0.1, 6);
    expect(s.checks).toBeGreaterThan(10);
    expect(s.high).toBe(false);
    // Uncorrected, check to check, the temperature swing hides it: some intervals even "make" oil.
    const raw = analyseChecks(checks.map((c) => ({ ...c, oilTempC: 15 })), changes).map((a) => a.sincePreviousLPerH).filter((v): v is number => v !== null);
    expect(Math.min(...raw)).toBeLessThan(0);
    expect(Math.max(...raw) - Math.min(...raw)).toBeGreaterThan(0.3);
  });

  it('flags a figure above the engine class usual one', () => {
    const { checks, changes } = season(0.25);
    const s = consumptionSummary(checks, changes, 0.1);
    expect(s.recentLPerH).toBeCloseTo(0.25, 6);
    expect(s.high).toBe(true);
  });

  it('gives no figure from fewer than three checks with engine hours', () => {
    const { checks, changes } = season(0.1);
    expect(consumptionSummary(checks.slice(0, 2), changes, 0.1).recentLPerH).toBeNull();
    expect(consumptionSummary(checks.map((c) => ({ ...c, engineHours: null })), changes, 0.1).recentLPerH).toBeNull();
  });

  it('per check: corrected level, oil age since the change and use since the previous check', () => {
    const { checks, changes } = season(0.1);
    const a = analyseChecks(checks, changes);
    expect(a[0].correctedL).toBeCloseTo(7.5, 10);
    expect(a[0].oilAgeHours).toBe(0);
    expect(a[0].oilAgeDays).toBeCloseTo(1, 10);
    const withRate = a.filter((x) => x.sincePreviousLPerH !== null);
    for (const x of withRate) expect(x.sincePreviousLPerH!).toBeCloseTo(0.1, 6);
    // Across the oil change there is no interval figure.
    const firstAfter = checks.findIndex((c) => c.atMs >= changes[1].atMs);
    expect(a[firstAfter].sincePreviousLPerH).toBeNull();
    expect(a[firstAfter].oilAgeHours).toBe(0);
  });
});

describe('the next oil change', () => {
  const last = { atMs: Date.UTC(2026, 8, 15), engineHours: 400 };
  it('is due by hours or by months, whichever comes first', () => {
    const byHours = oilChangeDue({ last, intervalHours: 50, intervalMonths: 4, currentHours: 440, nowMs: Date.UTC(2026, 9, 1) });
    expect(byHours).toMatchObject({ status: 'ok', by: 'hours', dueAtHours: 450, hoursLeft: 10 });
    const byMonths = oilChangeDue({ last, intervalHours: 50, intervalMonths: 4, currentHours: 410, nowMs: Date.UTC(2026, 11, 1) });
    expect(byMonths.by).toBe('months');
    expect(new Date(byMonths.dueAtMs!).toISOString().slice(0, 10)).toBe('2027-01-15');
    expect(byMonths.status).toBe('ok');
  });

  it('is soon within 10 % of the hours or 14 days, and overdue past either', () => {
    expect(oilChangeDue({ last, intervalHours: 50, intervalMonths: null, currentHours: 446, nowMs: last.atMs }).status).toBe('soon');
    expect(oilChangeDue({ last, intervalHours: null, intervalMonths: 4, currentHours: null, nowMs: Date.UTC(2027, 0, 5) }).status).toBe('soon');
    expect(oilChangeDue({ last, intervalHours: 50, intervalMonths: 4, currentHours: 451, nowMs: last.atMs }).status).toBe('overdue');
    expect(oilChangeDue({ last, intervalHours: 50, intervalMonths: 4, currentHours: 401, nowMs: Date.UTC(2027, 0, 16) }).status).toBe('overdue');
  });

  it('says what is missing: an interval or a logged change', () => {
    expect(oilChangeDue({ last, intervalHours: null, intervalMonths: null, currentHours: 1, nowMs: 0 })).toMatchObject({ status: 'unknown', missing: 'interval' });
    expect(oilChangeDue({ last: null, intervalHours: 50, intervalMonths: null, currentHours: 1, nowMs: 0 })).toMatchObject({ status: 'unknown', missing: 'change' });
  });

  it('adds calendar months, clamping to the end of a shorter month', () => {
    expect(new Date(addMonths(Date.UTC(2027, 0, 31), 1)).toISOString().slice(0, 10)).toBe('2027-02-28');
    expect(new Date(addMonths(Date.UTC(2026, 10, 30), 3)).toISOString().slice(0, 10)).toBe('2027-02-28');
  });
});
