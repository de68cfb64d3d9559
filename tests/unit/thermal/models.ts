// fast-check generators of soak-model inputs for the property tests (not a test file).
import fc from 'fast-check';
import type { HeaterInterval, SoakModel } from '@/lib/thermal';

export const H = 3_600_000;
export const MIN = 60_000;

export interface GenOptions {
  /** Shelters to draw from. */
  shelters?: ('tie-down' | 'hangar')[];
  heaters?: boolean;
  wind?: boolean;
  hours?: number;
}

/** Heat capacities and losses in the range of light-aircraft engines and small shelters. */
const node = (initial: fc.Arbitrary<number>) =>
  fc.record({
    heatCapacityJPerK: fc.double({ min: 3e3, max: 2e5, noNaN: true }),
    lossWPerK: fc.double({ min: 0.5, max: 20, noNaN: true }),
    initialTempC: initial,
  });

/** Whole minutes, so the output grids in the tests can land on the edges. */
const minuteIn = (hours: number) => fc.integer({ min: 0, max: hours * 60 }).map((m) => m * MIN);

export function heatersArb(hours: number, nodes: ('oil' | 'engine')[]): fc.Arbitrary<HeaterInterval[]> {
  return fc.array(
    fc.record({ node: fc.constantFrom(...nodes), powerW: fc.double({ min: 0, max: 600, noNaN: true }), a: minuteIn(hours), b: minuteIn(hours) }).filter((h) => h.a !== h.b),
    { maxLength: 3 },
  ).map((hs) => hs.map((h) => ({ node: h.node, powerW: h.powerW, fromMs: Math.min(h.a, h.b), toMs: Math.max(h.a, h.b) })));
}

export function modelArb(o: GenOptions = {}): fc.Arbitrary<SoakModel> {
  const hours = o.hours ?? 12;
  const shelters = o.shelters ?? ['tie-down', 'hangar'];
  return fc
    .record({
      kind: fc.constantFrom(...shelters),
      two: fc.boolean(),
      oil: node(fc.double({ min: -20, max: 95, noNaN: true })),
      engine: node(fc.double({ min: -20, max: 95, noNaN: true })),
      coupling: fc.double({ min: 0, max: 20, noNaN: true }),
      cover: fc.boolean(),
      coverFactor: fc.double({ min: 0.2, max: 1, noNaN: true }),
      hangarC: fc.double({ min: 5e5, max: 3e7, noNaN: true }),
      hangarG: fc.double({ min: 100, max: 1500, noNaN: true }),
      temps: fc.array(fc.double({ min: -30, max: 10, noNaN: true }), { minLength: 2, maxLength: hours + 1 }),
      spacingMin: fc.integer({ min: 20, max: 120 }),
      winds: fc.array(fc.double({ min: 0, max: 12, noNaN: true }), { minLength: 1, maxLength: 6 }),
    })
    .chain((r) =>
      heatersArb(hours, r.two ? ['oil', 'engine'] : ['oil']).map((heaters) => {
        const m: SoakModel = {
          startMs: 0,
          endMs: hours * H,
          outside: r.temps.map((tempC, i) => ({ atMs: i * r.spacingMin * MIN, tempC })),
          shelter: r.kind === 'hangar' ? { kind: 'hangar', heatCapacityJPerK: r.hangarC, lossWPerK: r.hangarG } : { kind: 'tie-down' },
          oil: r.oil,
          engine: r.two ? r.engine : undefined,
          couplingWPerK: r.two ? r.coupling : undefined,
          cover: r.cover,
          coverFactor: r.coverFactor,
          wind: o.wind === false ? undefined : r.winds.map((mps, i) => ({ atMs: (i * hours * H) / r.winds.length, mps })),
          heaters: o.heaters === false ? [] : heaters,
        };
        return m;
      }),
    );
}
