import type { ThermalParams } from '@/lib/views/aircraft';
import { ENGINE_CLASSES, SHELTER_KINDS as SHELTER_PRESETS, engineFromPreset, type EngineClassId, type ShelterKind } from '@/lib/thermal/presets';

// Defaults for new records (pure: forms, validation, the data layer and the seed read them), from the soak model's presets (lib/thermal/presets.ts, where each number
// carries its source or "estimate").

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

export function isEngineClass(id: string): id is EngineClassId {
  return id in ENGINE_CLASSES;
}

/** Oil quantity and two-node thermal parameters of an engine class (optionally for another oil quantity). */
export function aircraftDefaultsFor(engineClass: string, oilL?: number): { oilQuantityL: number; thermal: ThermalParams } {
  if (!isEngineClass(engineClass)) throw new Error(`Unknown engine class ${engineClass}`);
  const p = ENGINE_CLASSES[engineClass];
  const e = engineFromPreset(engineClass, { nodes: 2, oilL: oilL ?? p.oilL });
  return {
    oilQuantityL: oilL ?? p.oilL,
    thermal: {
      nodes: e.nodes.map((n) => ({ name: n.name, heatCapacityJPerK: n.heatCapacityJPerK, lossWPerK: n.lossWPerK })),
      couplingWPerK: e.couplingWPerK,
      coverFactor: e.coverFactor,
      windCoefficient: e.windCoefficient,
      source: 'preset',
    },
  };
}
