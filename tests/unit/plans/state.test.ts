import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { heaterLine, heaterStateAt, sameLocalDay, SWITCH_ON_NOW_MS, whenLabel, worstReadiness, type PlanTimes } from '@/lib/plans/state';

// The state words: what a mechanic standing at the aircraft would check against the clock.
const Z = 'Europe/Helsinki';
const at = (s: string) => Date.parse(s);
const plan: PlanTimes = {
  status: 'warming',
  switchOnAt: '2026-12-03T00:11:00.000Z', // 02:11 Thursday, Helsinki (UTC+2)
  heaterOn: [{ from: '2026-12-03T00:11:00.000Z', to: '2026-12-03T05:30:00.000Z' }],
  departAt: '2026-12-03T05:30:00.000Z',
};

describe('heater state', () => {
  it('reads Scheduled before the switch-on, Switch on now at it, Heating after, done after departure', () => {
    expect(heaterStateAt(plan, at('2026-12-02T14:00:00Z'))).toBe('scheduled');
    expect(heaterStateAt(plan, at('2026-12-03T00:11:00Z'))).toBe('switch-on-now');
    expect(heaterStateAt(plan, at('2026-12-03T00:11:00Z') + SWITCH_ON_NOW_MS - 1)).toBe('switch-on-now');
    expect(heaterStateAt(plan, at('2026-12-03T00:11:00Z') + SWITCH_ON_NOW_MS)).toBe('heating');
    expect(heaterStateAt(plan, at('2026-12-03T05:30:00Z'))).toBe('done');
  });
  it('keeps heating through a hold that ends after the departure', () => {
    const held = { ...plan, heaterOn: [{ from: plan.switchOnAt!, to: '2026-12-03T06:00:00.000Z' }] };
    expect(heaterStateAt(held, at('2026-12-03T05:45:00Z'))).toBe('heating');
  });
  it('never says a heater is heating or due before its switch-on time (property)', () => {
    let checked = 0;
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 48 * 60 }), fc.integer({ min: -600, max: 3000 }), (onMin, nowMin) => {
        const base = at('2026-12-02T12:00:00Z');
        const on = base + onMin * 60_000;
        const p: PlanTimes = { status: 'warming', switchOnAt: new Date(on).toISOString(), heaterOn: [{ from: new Date(on).toISOString(), to: new Date(on + 3_600_000).toISOString() }], departAt: new Date(on + 3_600_000).toISOString() };
        const s = heaterStateAt(p, base + nowMin * 60_000);
        checked++;
        if (base + nowMin * 60_000 < on) expect(s).toBe('scheduled');
        else expect(s).not.toBe('scheduled');
      }),
    );
    expect(checked).toBeGreaterThanOrEqual(100);
  });
  it('has no heater words for a plan that needs no heat, or cannot be met', () => {
    expect(heaterStateAt({ ...plan, status: 'ready', switchOnAt: null, heaterOn: [] }, 0)).toBe('no-heat');
    expect(heaterStateAt({ ...plan, status: 'short' }, 0)).toBe('short');
    expect(heaterStateAt({ ...plan, status: 'unplanned', switchOnAt: null, heaterOn: [] }, 0)).toBe('unplanned');
  });
});

describe('times carry their day unless they are today', () => {
  it('shows 02:11 on Thursday with its day when it is Wednesday afternoon', () => {
    expect(whenLabel(at(plan.switchOnAt!), Z, at('2026-12-02T14:00:00Z'))).toBe('Thu 02:11');
    expect(heaterLine(plan, Z, at('2026-12-02T14:00:00Z'))).toBe('Switch on at Thu 02:11');
  });
  it('drops the day when the time is today in the airfield’s zone', () => {
    expect(whenLabel(at(plan.switchOnAt!), Z, at('2026-12-02T22:30:00Z'))).toBe('02:11'); // 00:30 Thursday local
    expect(sameLocalDay(at('2026-12-02T21:59:00Z'), at('2026-12-02T22:01:00Z'), Z)).toBe(false); // local midnight between
  });
  it('uses the zone, not the server’s clock: the same instant is today in Tokyo and yesterday in Anchorage', () => {
    const ms = at('2026-12-03T00:11:00Z');
    expect(whenLabel(ms, 'Asia/Tokyo', at('2026-12-03T05:00:00Z'))).toBe('09:11');
    expect(whenLabel(ms, 'America/Anchorage', at('2026-12-03T12:00:00Z'))).toBe('Wed 15:11');
  });
});

describe('worst readiness', () => {
  it('orders short above unplanned above heat planned above ready', () => {
    expect(worstReadiness(['ready', 'warming'])).toBe('warming');
    expect(worstReadiness(['unplanned', 'warming', 'short'])).toBe('short');
    expect(worstReadiness(['ready', 'unplanned'])).toBe('unplanned');
    expect(worstReadiness([])).toBeNull();
  });
});
