import type { ShelterKind } from '@/models/Shelter';
import type { ThermalParams } from '@/models/Aircraft';

// Defaults for new records, by kind and engine class. Provisional estimates until the soak model's presets land.
export function shelterDefaultsFor(kind: ShelterKind) {
  const table: Record<ShelterKind, { heatCapacityJPerK: number; lossWPerK: number; solarApertureM2: number; setpointC?: number; heatingPowerW?: number }> = {
    'heated-hangar': { heatCapacityJPerK: 4.0e7, lossWPerK: 900, solarApertureM2: 60, setpointC: 8, heatingPowerW: 15000 },
    'unheated-hangar': { heatCapacityJPerK: 3.0e7, lossWPerK: 1200, solarApertureM2: 60 },
    't-hangar': { heatCapacityJPerK: 4.0e6, lossWPerK: 350, solarApertureM2: 12 },
    'tie-down': { heatCapacityJPerK: 0, lossWPerK: 0, solarApertureM2: 0 },
  };
  return table[kind];
}

export function aircraftDefaultsFor(engineClass: string): { oilQuantityL: number; thermal: ThermalParams } {
  const table: Record<string, { oilQuantityL: number; thermal: ThermalParams }> = {
    'lc-drysump-4': { oilQuantityL: 3, thermal: { nodes: [{ name: 'oil', heatCapacityJPerK: 60000, lossWPerK: 6 }, { name: 'engine', heatCapacityJPerK: 50000, lossWPerK: 8 }], couplingWPerK: 4, coverFactor: 0.6, source: 'preset' } },
    'ac-wetsump-4': { oilQuantityL: 7.5, thermal: { nodes: [{ name: 'oil', heatCapacityJPerK: 90000, lossWPerK: 5 }, { name: 'engine', heatCapacityJPerK: 110000, lossWPerK: 12 }], couplingWPerK: 15, coverFactor: 0.6, source: 'preset' } },
    'ac-wetsump-6': { oilQuantityL: 11, thermal: { nodes: [{ name: 'oil', heatCapacityJPerK: 130000, lossWPerK: 6 }, { name: 'engine', heatCapacityJPerK: 160000, lossWPerK: 15 }], couplingWPerK: 20, coverFactor: 0.6, source: 'preset' } },
  };
  const d = table[engineClass];
  if (!d) throw new Error(`Unknown engine class ${engineClass}`);
  return d;
}
