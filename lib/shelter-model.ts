// A stored shelter as the soak model's shelter node: one mapping for every caller that runs the model
// on stored records (the forecast chart's shelter air; the heat plans' soak model should use it too).
// Pure: plain data in, plain data out.
import type { ShelterModel } from '@/lib/thermal';

export interface ShelterFields {
  kind: string;
  heatCapacityJPerK: number;
  lossWPerK: number;
  solarApertureM2: number;
  setpointC: number | null;
  heatingPowerW: number | null;
}

/**
 * An open tie-down (or no shelter, or one without an air node) has no air of its own: the engine sits
 * in the outside air. A heated hangar holds its set-point only with a set-point and a heating power.
 */
export function shelterModelOf(s: ShelterFields | null | undefined): ShelterModel {
  if (!s || s.kind === 'tie-down' || !(s.heatCapacityJPerK > 0) || !(s.lossWPerK > 0)) return { kind: 'tie-down' };
  const heated = s.kind === 'heated-hangar' && s.setpointC !== null && (s.heatingPowerW ?? 0) > 0;
  return {
    kind: 'hangar',
    heatCapacityJPerK: s.heatCapacityJPerK,
    lossWPerK: s.lossWPerK,
    solarApertureM2: s.solarApertureM2,
    ...(heated ? { setpointC: s.setpointC as number, heatingPowerW: s.heatingPowerW as number } : {}),
  };
}
