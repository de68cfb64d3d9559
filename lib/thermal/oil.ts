// Oil volume against temperature, for the Oil log's dipstick corrections.

/** Volumetric expansion coefficient of oil, 1/K (Engineering ToolBox, "Volumetric (Cubic) Thermal Expansion"). */
export const OIL_BETA_PER_K = 0.0007;

/**
 * Volume of a quantity of oil at `toC`, given its volume at `fromC`. Integrates β = (1/V)·dV/dT at
 * constant β: V₂ = V₁·e^{β(T₂−T₁)}, so a reading corrected there and back returns unchanged; over
 * 100 K it differs from the linear V₁·(1 + βΔT) by under 0.3 %.
 */
export function oilVolumeAt(volume: number, fromC: number, toC: number, betaPerK = OIL_BETA_PER_K): number {
  return volume * Math.exp(betaPerK * (toC - fromC));
}

/** A dipstick reading taken at `readC` expressed at the reference temperature `refC` (default 15 °C). */
export function correctedReading(reading: number, readC: number, refC = 15, betaPerK = OIL_BETA_PER_K): number {
  return oilVolumeAt(reading, readC, refC, betaPerK);
}
