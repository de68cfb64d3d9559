import type { ShelterKind } from '@/models/Shelter';
import type { ThermalParams } from '@/models/Aircraft';
import { SHELTER_KINDS as SHELTER_PRESETS } from '@/lib/thermal/presets';

export interface ShelterDefaults {
  heatCapacityJPerK: number;
  lossWPerK: number;
  solarApertureM2: number;
  setpointC?: number;
  heatingPowerW?: number;
}

/** Thermal defaults for a new shelter of a kind: the soak model's shelter presets (a tie-down has no air node: zeros). */
export function shelterDefaultsFor(kind: ShelterKind): ShelterDefaults {
  const hangar = SHELTER_PRESETS[kind].hangar;
  if (!hangar) return { heatCapacityJPerK: 0, lossWPerK: 0, solarApertureM2: 0 };
  return { ...hangar };
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
