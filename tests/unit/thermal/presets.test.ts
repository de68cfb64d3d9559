// Engine-class and shelter presets: plausible magnitudes (the numbers themselves are estimates).
import { describe, expect, it } from 'vitest';
import { ENGINE_CLASSES, ENGINE_CLASS_IDS, engineFromPreset, oilHeatCapacity, shelterFromPreset, SHELTER_KINDS, simulate, type SoakModel } from '@/lib/thermal';

const H = 3_600_000;

describe('engine classes', () => {
  it('has the three generic classes', () => {
    expect(ENGINE_CLASS_IDS).toEqual(['lc-drysump-4', 'ac-wetsump-4', 'ac-wetsump-6']);
    expect(ENGINE_CLASSES['ac-wetsump-4'].oilL).toBe(7.5);
  });

  it('oil heat capacity = litres × 0.885 kg/L × cp(40 °C) from the docs/sources.md fit 1.80 + 0.0042·T kJ/kg·K', () => {
    expect(oilHeatCapacity(3)).toBeCloseTo(3 * 0.885 * 1968, 6);
  });

  it('an uncovered air-cooled four in a T-hangar has an oil time constant of a few hours (estimate)', () => {
    const e = engineFromPreset('ac-wetsump-4');
    const m: SoakModel = {
      startMs: 0,
      endMs: 24 * H,
      outside: [{ atMs: 0, tempC: 0 }],
      shelter: { ...(shelterFromPreset('t-hangar') as object), initialTempC: 0 } as SoakModel['shelter'],
      oil: e.nodes[0],
      engine: { ...e.nodes[1], initialTempC: e.nodes[0].initialTempC },
      couplingWPerK: e.couplingWPerK,
    };
    const s = simulate(m, { atMs: Array.from({ length: 97 }, (_, i) => i * 15 * 60_000) });
    // Time to fall 1 − 1/e of the way to the (steady) shelter air.
    const target = m.oil.initialTempC * Math.exp(-1);
    const j = s.oilC.findIndex((v) => v <= target);
    const tauH = (j * 15) / 60;
    expect(tauH).toBeGreaterThan(1.5);
    expect(tauH).toBeLessThan(4);
  });

  it('one-node form keeps the total heat capacity and loss', () => {
    for (const id of ENGINE_CLASS_IDS) {
      const two = engineFromPreset(id);
      const one = engineFromPreset(id, { nodes: 1 });
      expect(one.nodes[0].heatCapacityJPerK).toBeCloseTo(two.nodes[0].heatCapacityJPerK + two.nodes[1].heatCapacityJPerK, 6);
      expect(one.nodes[0].lossWPerK).toBeCloseTo(two.nodes[0].lossWPerK + two.nodes[1].lossWPerK, 9);
    }
  });
});

describe('shelter kinds', () => {
  it('a heated hangar carries a set-point and heating power, a tie-down no node', () => {
    expect(SHELTER_KINDS['heated-hangar'].hangar?.setpointC).toBeDefined();
    expect(shelterFromPreset('tie-down')).toEqual({ kind: 'tie-down' });
  });
});
