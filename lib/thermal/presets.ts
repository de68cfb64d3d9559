// Generic engine classes and shelter kinds. Every number carries its source or "estimate".
// Heat capacities are masses × specific heats (constants.ts); loss coefficients are an effective
// exposed area × still-air conductance (free convection + linearised radiation, 9.2 W/m²·K).
// The areas are estimates chosen so an uncovered engine in still air has an overall time constant
// of 2–3 hours — the usual experience that an engine is near the hangar temperature by morning.
import {
  COOLANT_DENSITY_KG_PER_L,
  CP_ALUMINIUM,
  CP_COOLANT,
  CP_STEEL,
  DEFAULT_COVER_FACTOR,
  DEFAULT_WIND_COEFFICIENT,
  H_STILL_AIR,
  OIL_DENSITY_KG_PER_L,
  SOAK_MEAN_OIL_C,
  oilSpecificHeat,
} from './constants';
import type { NodeName } from './types';

export type HeaterKind = 'oil-pad' | 'cylinder-bands' | 'forced-air-electric' | 'forced-air-propane';

/** Typical heaters (docs/sources.md "Heaters", memory / trade press; for presets and the demo only). */
export const HEATER_KINDS: Record<HeaterKind, { label: string; typicalPowerW: number; node: NodeName }> = {
  'oil-pad': { label: 'Oil sump/tank pad', typicalPowerW: 200, node: 'oil' }, // 100–500 W
  'cylinder-bands': { label: 'Cylinder bands', typicalPowerW: 50, node: 'engine' }, // 25–50 W each
  'forced-air-electric': { label: 'Electric forced air', typicalPowerW: 1500, node: 'engine' }, // ≈ 1.5 kW
  'forced-air-propane': { label: 'Propane forced air', typicalPowerW: 10000, node: 'engine' }, // ≈ 10 kW
};

export type EngineClassId = 'lc-drysump-4' | 'ac-wetsump-4' | 'ac-wetsump-6';

export interface EngineClassPreset {
  id: EngineClassId;
  label: string;
  oilL: number;
  /** Non-oil mass lumped with the oil node (tank or sump), J/K. */
  oilContainerJPerK: number;
  /** Engine-mass node, J/K. */
  engineJPerK: number;
  /** Still-air, uncovered losses to the shelter air, W/K. */
  oilLossWPerK: number;
  engineLossWPerK: number;
  /** Oil ↔ engine conductance, W/K. */
  couplingWPerK: number;
  coverFactor: number;
  windCoefficient: number;
  heaters: { kind: HeaterKind; powerW: number; node: NodeName }[];
  shutdownOilC: number;
  shutdownEngineC: number;
  readyC: number;
  /**
   * The engine-mass threshold (crankcase and cylinders), °C, estimate: readiness needs the engine
   * node at or above it as well as the oil at readyC (an aircraft may override it).
   */
  engineReadyC: number;
  /**
   * Which node's oil readiness is judged on. 'oil': the oil node (a wet sump). 'engine': the engine
   * node — for the dry-sump class the oil that matters at start is on the engine side (crankcase,
   * lines, the sensor the pilot reads), and in this model it lies in the engine node with the metal;
   * the "oil" node is the tank and its oil. So the ready temperature applies to the engine node too.
   */
  readinessOil: 'oil' | 'engine';
  /**
   * The maker's rule for the class (generic, estimate; an aircraft takes its own manual's figures):
   * preheat is required when the engine has soaked below preheatBelowC for soakHours, and the oil must
   * be at least minStartOilC for start. A departure that meets both unheated needs no heat.
   */
  makerRule: MakerRule;
  oilConsumptionLPerH: number;
}

export interface MakerRule {
  preheatBelowC: number;
  soakHours: number;
  minStartOilC: number;
}

/** Oil heat capacity, J/K, at the soak's mean temperature. */
export function oilHeatCapacity(oilL: number): number {
  return oilL * OIL_DENSITY_KG_PER_L * oilSpecificHeat(SOAK_MEAN_OIL_C);
}

export const ENGINE_CLASSES: Record<EngineClassId, EngineClassPreset> = {
  'lc-drysump-4': {
    id: 'lc-drysump-4',
    label: 'Liquid-cooled-head dry-sump four, ~3 L oil',
    oilL: 3.0,
    // Separate oil tank, ~1.0 kg aluminium (estimate) × 883 J/kg·K.
    oilContainerJPerK: 1.0 * CP_ALUMINIUM,
    // ~56 kg dry (estimate): 40 kg aluminium × 883 + 16 kg steel × 490, plus 2.5 L 50/50 coolant (estimate) × 1.078 kg/L × 3300.
    engineJPerK: 40 * CP_ALUMINIUM + 16 * CP_STEEL + 2.5 * COOLANT_DENSITY_KG_PER_L * CP_COOLANT,
    // Tank on the firewall, ~0.2 m² exposed (estimate) × 9.2 W/m²·K.
    oilLossWPerK: 0.2 * H_STILL_AIR,
    // ~0.55 m² effective (estimate) × 9.2 W/m²·K.
    engineLossWPerK: 0.55 * H_STILL_AIR,
    // Tank and engine meet only through the oil lines when stopped (estimate).
    couplingWPerK: 1.0,
    coverFactor: DEFAULT_COVER_FACTOR,
    windCoefficient: DEFAULT_WIND_COEFFICIENT,
    // A small tank pad at the low end of 100–500 W (docs/sources.md "Heaters").
    heaters: [{ kind: 'oil-pad', powerW: 100, node: 'oil' }],
    // Normal oil 90–110 °C for this class (memory); shutdown after taxi at the low end (estimate).
    shutdownOilC: 90,
    shutdownEngineC: 80, // coolant-cooled mass a little below the oil (estimate)
    // Warmer than the wet-sump floor so the hand-turned oil return goes quickly (estimate).
    readyC: 20,
    // The engine-side oil is judged on the engine node (readinessOil), so its threshold is readyC;
    // this figure is the metal's own floor below that (estimate).
    engineReadyC: 10,
    readinessOil: 'engine',
    makerRule: { preheatBelowC: -10, soakHours: 2, minStartOilC: -10 }, // estimate
    oilConsumptionLPerH: 0.03, // estimate
  },
  'ac-wetsump-4': {
    id: 'ac-wetsump-4',
    label: 'Air-cooled wet-sump four, ~7.5 L oil',
    oilL: 7.5,
    // Cast sump ~4 kg aluminium (estimate) × 883 J/kg·K.
    oilContainerJPerK: 4 * CP_ALUMINIUM,
    // ~120 kg dry less the sump (estimate): 66 kg aluminium (case, heads) × 883 + 50 kg steel (crank, cam, barrels) × 490.
    engineJPerK: 66 * CP_ALUMINIUM + 50 * CP_STEEL,
    // Sump ~0.3 m² exposed (estimate) × 9.2 W/m²·K.
    oilLossWPerK: 0.3 * H_STILL_AIR,
    // ~0.85 m² effective through the cowling (estimate) × 9.2 W/m²·K.
    engineLossWPerK: 0.85 * H_STILL_AIR,
    // Sump bolted to the case, oil film on the walls (estimate).
    couplingWPerK: 12,
    coverFactor: DEFAULT_COVER_FACTOR,
    windCoefficient: DEFAULT_WIND_COEFFICIENT,
    // Sump pad 200 W (100–500 W) and four 50 W cylinder bands (25–50 W each) (docs/sources.md "Heaters").
    heaters: [
      { kind: 'oil-pad', powerW: 200, node: 'oil' },
      { kind: 'cylinder-bands', powerW: 200, node: 'engine' },
    ],
    shutdownOilC: 80, // estimate: normal cruise oil ~80–95 °C, a little lower after taxi
    shutdownEngineC: 85, // cylinders hotter than the oil, the case cooler; the lump a little above (estimate)
    readyC: 15, // common practice: keep oil at or above about 13–16 °C (55–60 °F)
    engineReadyC: 5, // estimate: crankcase and cylinders above freezing with margin
    readinessOil: 'oil',
    // Estimate (from memory, the usual figure of cold-weather guidance for air-cooled engines: preheat below about −6 °C / 20 °F).
    makerRule: { preheatBelowC: -6, soakHours: 2, minStartOilC: -6 },
    oilConsumptionLPerH: 0.1, // estimate
  },
  'ac-wetsump-6': {
    id: 'ac-wetsump-6',
    label: 'Air-cooled wet-sump six, ~11 L oil',
    oilL: 11,
    // Cast sump ~6 kg aluminium (estimate) × 883 J/kg·K.
    oilContainerJPerK: 6 * CP_ALUMINIUM,
    // ~190 kg dry less the sump (estimate): 104 kg aluminium × 883 + 80 kg steel × 490.
    engineJPerK: 104 * CP_ALUMINIUM + 80 * CP_STEEL,
    // Sump ~0.4 m² (estimate) × 9.2 W/m²·K.
    oilLossWPerK: 0.4 * H_STILL_AIR,
    // ~1.25 m² effective (estimate) × 9.2 W/m²·K.
    engineLossWPerK: 1.25 * H_STILL_AIR,
    couplingWPerK: 16, // estimate, as the four scaled by size
    coverFactor: DEFAULT_COVER_FACTOR,
    windCoefficient: DEFAULT_WIND_COEFFICIENT,
    // Sump pad 300 W and six 50 W cylinder bands (docs/sources.md "Heaters").
    heaters: [
      { kind: 'oil-pad', powerW: 300, node: 'oil' },
      { kind: 'cylinder-bands', powerW: 300, node: 'engine' },
    ],
    shutdownOilC: 80, // estimate, as the four
    shutdownEngineC: 85, // estimate, as the four
    readyC: 15, // common practice: 13–16 °C (55–60 °F)
    engineReadyC: 5, // estimate, as the four
    readinessOil: 'oil',
    makerRule: { preheatBelowC: -6, soakHours: 2, minStartOilC: -6 }, // estimate, as the four
    oilConsumptionLPerH: 0.15, // estimate
  },
};

export const ENGINE_CLASS_IDS = Object.keys(ENGINE_CLASSES) as EngineClassId[];

/**
 * The engine-mass threshold the planner uses for an engine class: the aircraft's own figure, else the
 * class's (estimate); for a class judged on engine-side oil (dry sump), never below the ready temperature.
 */
export function engineThresholdFor(engineClass: string, readyC: number, aircraftEngineReadyC: number | null | undefined): number | undefined {
  const p = ENGINE_CLASSES[engineClass as EngineClassId];
  const own = aircraftEngineReadyC ?? p?.engineReadyC;
  if (own === undefined) return undefined;
  return p?.readinessOil === 'engine' ? Math.max(own, readyC) : own;
}

/**
 * Heater set-ups that mislead: on a class judged on engine-side oil, a tank pad as the only heater
 * warms the tank while the engine-side oil stays cold. Pure; the board and the aircraft page show it.
 */
export function heaterWarnings(engineClass: string, heaters: readonly { kind: string }[]): { code: 'tank-pad-only'; text: string; suggestion: string }[] {
  const p = ENGINE_CLASSES[engineClass as EngineClassId];
  if (p?.readinessOil !== 'engine' || !heaters.length || !heaters.every((h) => h.kind === 'oil-pad')) return [];
  return [
    {
      code: 'tank-pad-only',
      text: 'Dry-sump engine with only an oil-tank pad: the tank warms, the oil on the engine side (crankcase, lines, the gauge) stays cold.',
      suggestion: 'Add heat on the engine (cylinder bands or engine-side pad, or warm air under a cover) and follow the engine manufacturer’s cold-weather instructions.',
    },
  ];
}

/** The engine part of a simulate request, from a class preset. */
export function engineFromPreset(
  id: EngineClassId,
  o: { nodes?: 1 | 2; oilL?: number; shutdownOilC?: number; shutdownEngineC?: number } = {},
): {
  nodes: { name: NodeName; heatCapacityJPerK: number; lossWPerK: number; initialTempC: number }[];
  couplingWPerK?: number;
  coverFactor: number;
  windCoefficient: number;
} {
  const p = ENGINE_CLASSES[id];
  const Co = oilHeatCapacity(o.oilL ?? p.oilL) + p.oilContainerJPerK;
  const To = o.shutdownOilC ?? p.shutdownOilC;
  const Te = o.shutdownEngineC ?? p.shutdownEngineC;
  const common = { coverFactor: p.coverFactor, windCoefficient: p.windCoefficient };
  if (o.nodes === 1) {
    const C = Co + p.engineJPerK;
    return {
      nodes: [{ name: 'oil', heatCapacityJPerK: C, lossWPerK: p.oilLossWPerK + p.engineLossWPerK, initialTempC: (Co * To + p.engineJPerK * Te) / C }],
      ...common,
    };
  }
  return {
    nodes: [
      { name: 'oil', heatCapacityJPerK: Co, lossWPerK: p.oilLossWPerK, initialTempC: To },
      { name: 'engine', heatCapacityJPerK: p.engineJPerK, lossWPerK: p.engineLossWPerK, initialTempC: Te },
    ],
    couplingWPerK: p.couplingWPerK,
    ...common,
  };
}

export type ShelterKind = 'heated-hangar' | 'unheated-hangar' | 't-hangar' | 'tie-down';

export interface ShelterPreset {
  kind: ShelterKind;
  label: string;
  /** Null for a tie-down (no shelter node). */
  hangar: null | {
    heatCapacityJPerK: number;
    lossWPerK: number;
    solarApertureM2: number;
    setpointC?: number;
    heatingPowerW?: number;
  };
}

// Air at ~1.2 kg/m³ × 1005 J/kg·K ≈ 1.2 kJ/m³·K; the effective heat capacity adds the share of
// floor slab and structure that swings with the air over a night (estimates).
export const SHELTER_KINDS: Record<ShelterKind, ShelterPreset> = {
  'heated-hangar': {
    kind: 'heated-hangar',
    label: 'Heated hangar',
    hangar: {
      heatCapacityJPerK: 30e6, // ~2000 m³ air (2.4 MJ/K) + insulated slab and structure (estimate)
      lossWPerK: 550, // insulated envelope ~1500 m² × 0.25 W/m²·K + 0.3 air changes/h (estimate)
      solarApertureM2: 2, // insulated roof passes little sun to the air (estimate)
      setpointC: 10, // estimate
      heatingPowerW: 25_000, // holds 10 °C down to about −35 °C outside (estimate)
    },
  },
  'unheated-hangar': {
    kind: 'unheated-hangar',
    label: 'Unheated hangar',
    hangar: {
      heatCapacityJPerK: 20e6, // air + uninsulated slab (estimate)
      lossWPerK: 1200, // bare metal cladding, leaky doors (estimate); τ ≈ 4.6 h
      solarApertureM2: 15, // dark metal roof (estimate)
    },
  },
  't-hangar': {
    kind: 't-hangar',
    label: 'T-hangar',
    hangar: {
      heatCapacityJPerK: 2.5e6, // ~250 m³ air (0.3 MJ/K) + its share of slab and sheet steel (estimate)
      lossWPerK: 350, // bare sheet steel, door gaps (estimate); τ ≈ 2 h
      solarApertureM2: 5, // estimate
    },
  },
  'tie-down': { kind: 'tie-down', label: 'Tie-down', hangar: null },
};

/** The shelter part of a simulate request, from a shelter kind. */
export function shelterFromPreset(kind: ShelterKind):
  | { kind: 'tie-down' }
  | { kind: 'hangar'; heatCapacityJPerK: number; lossWPerK: number; solarApertureM2: number; setpointC?: number; heatingPowerW?: number } {
  const p = SHELTER_KINDS[kind];
  return p.hangar ? { kind: 'hangar', ...p.hangar } : { kind: 'tie-down' };
}
