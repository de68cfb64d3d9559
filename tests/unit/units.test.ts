import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fromDisplayTemp, fromDisplayVolume, toDisplayTemp, toDisplayVolume } from '@/lib/units';

describe('units', () => {
  it('water freezes at 32 °F and boils at 212 °F; −40 is the same in both (definition of the scales)', () => {
    expect(toDisplayTemp(0, 'F')).toBe(32);
    expect(toDisplayTemp(100, 'F')).toBe(212);
    expect(toDisplayTemp(-40, 'F')).toBe(-40);
  });
  it('one US liquid quart is 0.946352946 L (exact by definition)', () => {
    expect(fromDisplayVolume(1, 'qt')).toBeCloseTo(0.946352946, 9);
    expect(toDisplayVolume(3.785411784, 'qt')).toBeCloseTo(4, 9); // a US gallon
  });
  it('conversions round-trip', () => {
    fc.assert(fc.property(fc.double({ min: -100, max: 200, noNaN: true }), (c) => Math.abs(fromDisplayTemp(toDisplayTemp(c, 'F'), 'F') - c) < 1e-9));
    fc.assert(fc.property(fc.double({ min: 0, max: 100, noNaN: true }), (l) => Math.abs(fromDisplayVolume(toDisplayVolume(l, 'qt'), 'qt') - l) < 1e-9));
  });
});
