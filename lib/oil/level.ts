// Dipstick readings corrected to a reference temperature by the oil's thermal expansion
// (β = 0.00070 1/K, Engineering ToolBox "Volumetric (Cubic) Thermal Expansion"; lib/thermal/oil.ts).
import { correctedReading, OIL_BETA_PER_K } from '@/lib/thermal/oil';

/** The reference temperature levels are compared at, °C. */
export const REFERENCE_C = 15;
export { OIL_BETA_PER_K };

/** A dipstick level read with the oil at `oilTempC`, as it would read at 15 °C. */
export function correctedLevelL(levelL: number, oilTempC: number, refC = REFERENCE_C): number {
  return correctedReading(levelL, oilTempC, refC);
}

/** How much the reading changes by the correction, as a fraction (negative: the warm reading was high). */
export function correctionFraction(oilTempC: number, refC = REFERENCE_C): number {
  return correctedLevelL(1, oilTempC, refC) - 1;
}
