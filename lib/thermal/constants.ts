// Physical constants and model defaults shared by the model and the presets, each with its source.

/** Engine oil density near 15 °C, kg/L: 880–890 kg/m³ (Incropera Table A.5, from memory). */
export const OIL_DENSITY_KG_PER_L = 0.885;

/** Engine oil specific heat, J/kg·K: the linear fit cp ≈ 1.80 + 0.0042·T(°C) kJ/kg·K of the docs/sources.md tables. */
export function oilSpecificHeat(tempC: number): number {
  return 1800 + 4.2 * tempC;
}

/** Mean oil temperature over a soak, for the constant heat capacity of the linear model (estimate: 80 °C shutdown → ~0 °C night). */
export const SOAK_MEAN_OIL_C = 40;

/** Cast aluminium alloy, J/kg·K (Incropera Table A.1, cast alloy 195). */
export const CP_ALUMINIUM = 883;
/** Carbon steel, J/kg·K (Engineering ToolBox, "Metals — Specific Heats"). */
export const CP_STEEL = 490;
/** 50/50 ethylene-glycol coolant: ρ ≈ 1078 kg/m³, cp ≈ 3.3 kJ/kg·K (Modelica Standard Library "Glycol50"). */
export const COOLANT_DENSITY_KG_PER_L = 1.078;
export const CP_COOLANT = 3300;

/** Free convection in still air, W/m²·K: a low value in the 2–25 range (Incropera Table 1.1); estimate. */
export const H_FREE_CONVECTION = 5;
/** Linearised radiation 4·ε·σ·T³ at 0 °C, ε = 0.9, W/m²·K (computed from the Stefan–Boltzmann constant). */
export const H_RADIATION = 4.2;
/** Still-air surface conductance used for the presets' loss coefficients, W/m²·K. */
export const H_STILL_AIR = H_FREE_CONVECTION + H_RADIATION;

/**
 * Cover factor (estimate): a 25 mm fibreglass blanket (k ≈ 0.045 W/m·K, US DOE fact sheets) gives
 * 1.8 W/m²·K; in series with 9.2 W/m²·K still air that is U ≈ 1.5, 0.16 of the bare value. Covers
 * leave inlets and the cowl bottom partly open: taking 40 % of the loss as bypassing the blanket,
 * 0.4 + 0.6·0.16 ≈ 0.5.
 */
export const DEFAULT_COVER_FACTOR = 0.5;

/**
 * Wind on an open tie-down: G(v) = G0·(1 + k·√v), the √v growth of laminar forced convection;
 * k chosen so the still-air losses double at about 5 m/s — estimate: exposed surfaces would see forced
 * convection of 25–250 W/m²·K (Incropera Table 1.1), but most of the engine sits inside its cowling.
 */
export const DEFAULT_WIND_COEFFICIENT = 0.45;
