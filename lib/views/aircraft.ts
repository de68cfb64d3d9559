// Aircraft types shared by the models, the data layer and client components. Type-only: no I/O.

/** Thermal parameters of the engine: one node (oil and engine together) or two (oil; engine mass). */
export interface ThermalParams {
  nodes: { name: 'oil' | 'engine'; heatCapacityJPerK: number; lossWPerK: number }[];
  couplingWPerK?: number;
  /** Loss coefficients are multiplied by this when the cover is on (0 < f ≤ 1). */
  coverFactor: number;
  /** k in G(v) = G0·(1 + k·√v) on an open tie-down. */
  windCoefficient?: number;
  source: 'preset' | 'manual' | 'fitted';
}
