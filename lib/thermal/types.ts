// Plain-data description of one soak-model run. Times are epoch milliseconds (UTC instants);
// temperatures °C; heat capacities J/K; conductances W/K; powers W. No Date objects, no clock.

/** The lumped nodes an engine may have: one node ("oil", oil and engine together) or "oil" + "engine". */
export type NodeName = 'oil' | 'engine';

/** One lumped thermal mass. */
export interface ThermalNode {
  /** C, J/K. */
  heatCapacityJPerK: number;
  /** G to the shelter air (uncovered, still air), W/K. */
  lossWPerK: number;
  /** Temperature at the start of the run (the last shutdown), °C. */
  initialTempC: number;
}

/** A heater fitted to a node, on with constant power over [fromMs, toMs). */
export interface HeaterInterval {
  node: NodeName;
  powerW: number;
  fromMs: number;
  toMs: number;
}

/** An open tie-down: no shelter node, shelter air = outside air, wind raises the engine losses. */
export interface TieDownShelter {
  kind: 'tie-down';
}

/**
 * A hangar or T-hangar: one air node `Cs·dTs/dt = −Gs·(Ts − Tout) + a·A·I_sun + P_space`.
 * With `setpointC` and `heatingPowerW` it is a heated hangar: its heating holds the set-point while
 * the power needed stays within [0, heatingPowerW]; beyond that it runs flat out (or off) and the
 * air temperature floats.
 */
export interface HangarShelter {
  kind: 'hangar';
  heatCapacityJPerK: number;
  lossWPerK: number;
  /** Default: the set-point for a heated hangar, otherwise the outside temperature at the start. */
  initialTempC?: number;
  setpointC?: number;
  heatingPowerW?: number;
  /** a·A: effective absorbing roof area, m²; solar gain W = a·A × global horizontal irradiance W/m². */
  solarApertureM2?: number;
}

export type ShelterModel = TieDownShelter | HangarShelter;

/** Everything one run needs. Arrays of points must be sorted by time, strictly increasing. */
export interface SoakModel {
  startMs: number;
  endMs: number;
  /** Outside air, linear between points and flat beyond the ends; at least one point. */
  outside: readonly { atMs: number; tempC: number }[];
  shelter: ShelterModel;
  oil: ThermalNode;
  /** The second node (engine mass); absent for the one-node form. */
  engine?: ThermalNode;
  /** G between oil and engine nodes, W/K (default 0). */
  couplingWPerK?: number;
  /** A cover (blanket, cowl cover) is fitted: the nodes' loss coefficients are multiplied by coverFactor. */
  cover?: boolean;
  /** Multiplier on the loss coefficients with a cover, 0..1 (default DEFAULT_COVER_FACTOR). */
  coverFactor?: number;
  /** k in G(v) = G0·(1 + k·√v) on a tie-down, per √(m/s) (default DEFAULT_WIND_COEFFICIENT). */
  windCoefficient?: number;
  /** Wind speed on a tie-down, piecewise constant: each value holds from its time to the next. */
  wind?: readonly { atMs: number; mps: number }[];
  /** Cloud cover fraction 0..1, piecewise constant like wind; scales the solar gain. */
  cloud?: readonly { atMs: number; fraction: number }[];
  /** Site location: needed for the sun. */
  site?: { lat: number; lon: number };
  heaters?: readonly HeaterInterval[];
}

/** Result of `simulate`: typed arrays, one entry per output time. */
export interface SoakSeries {
  /** Output times, epoch ms: start, start + Δ, …, end (end always included). */
  atMs: Float64Array;
  outsideC: Float64Array;
  shelterC: Float64Array;
  oilC: Float64Array;
  /** Null for the one-node form. */
  engineC: Float64Array | null;
  /** Energy delivered by the engine heaters within [start, end], Wh. */
  heaterEnergyWh: number;
  /** Energy used by a heated hangar's space heating within [start, end], Wh (0 otherwise). */
  shelterHeatingWh: number;
}
