// The one mapping from a stored shelter to the soak model's shelter node (lib/shelter-model.ts).
import { describe, expect, it } from 'vitest';
import { shelterModelOf } from '@/lib/shelter-model';

// Parameter values are estimates for the test only (the mapping copies them; no physics is checked here).
const hangar = { kind: 'unheated-hangar', heatCapacityJPerK: 20e6, lossWPerK: 400, solarApertureM2: 5, setpointC: null, heatingPowerW: null };

describe('shelterModelOf', () => {
  it('has no air node for a tie-down, no shelter, or a shelter without heat capacity or loss', () => {
    expect(shelterModelOf(null)).toEqual({ kind: 'tie-down' });
    expect(shelterModelOf(undefined)).toEqual({ kind: 'tie-down' });
    expect(shelterModelOf({ ...hangar, kind: 'tie-down' })).toEqual({ kind: 'tie-down' });
    expect(shelterModelOf({ ...hangar, heatCapacityJPerK: 0 })).toEqual({ kind: 'tie-down' });
    expect(shelterModelOf({ ...hangar, lossWPerK: 0 })).toEqual({ kind: 'tie-down' });
  });

  it('copies a hangar and leaves the heating out unless set-point and power are both given', () => {
    expect(shelterModelOf(hangar)).toEqual({ kind: 'hangar', heatCapacityJPerK: 20e6, lossWPerK: 400, solarApertureM2: 5 });
    expect(shelterModelOf({ ...hangar, kind: 'heated-hangar', setpointC: 10, heatingPowerW: null })).not.toHaveProperty('setpointC');
    expect(shelterModelOf({ ...hangar, kind: 'heated-hangar', setpointC: 10, heatingPowerW: 0 })).not.toHaveProperty('setpointC');
    expect(shelterModelOf({ ...hangar, kind: 'heated-hangar', setpointC: 10, heatingPowerW: 25_000 })).toMatchObject({ kind: 'hangar', setpointC: 10, heatingPowerW: 25_000 });
    // A set-point on an unheated kind is not heating.
    expect(shelterModelOf({ ...hangar, setpointC: 10, heatingPowerW: 25_000 })).not.toHaveProperty('setpointC');
  });
});
