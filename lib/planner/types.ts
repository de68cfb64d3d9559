// Plain data in and out of the heat planner. Times are epoch milliseconds (UTC instants);
// temperatures °C; powers W; energy kWh; money in the tariff's currency. No Date objects, no clock.
import type { NodeName, SoakModel } from '@/lib/thermal';

export type PlanMode = 'least-cost' | 'single-start';

/**
 * ready: no heat needed; warming: the plan meets the ready temperature (and the floor); short: it
 * cannot, even with the heater on throughout. (The lead's records add 'unplanned' for aircraft with
 * no heater.)
 */
export type PlanStatus = 'ready' | 'warming' | 'short';

export interface PlannedHeater {
  node: NodeName;
  powerW: number;
  parts?: readonly { node: NodeName; powerW: number }[];
}

/** One period of a time-of-use tariff: the price holds over [fromMs, toMs). */
export interface TariffPeriod {
  fromMs: number;
  toMs: number;
  pricePerKWh: number;
}

export interface PlanRequest {
  /** The free run from the last shutdown: no planned heaters (any heaters in it are kept as a fixed part of the run). */
  model: SoakModel;
  departureMs: number;
  readyC: number;
  /** The overnight floor: the oil must not fall below it from the earliest switch-on to departure. */
  floorC?: number;
  /**
   * The heater the plan switches. Several heaters on one control are one schedule: give `parts`
   * (each on its own node; their powers add) and `powerW` = their sum, `node` = the first part's.
   */
  heater: PlannedHeater;
  /** Time-of-use periods covering [earliest switch-on, departure]; without them the price is flat. */
  tariff?: readonly TariffPeriod[];
  /** A flat price, used when no tariff is given (cost is then reported); without either, cost is not reported. */
  flatPricePerKWh?: number;
  /** The heater control's granularity, minutes (default 5). Slots end at departure and step back from there. */
  slotMinutes?: number;
  /**
   * The step a switch-on time may be set to inside a slot, minutes (default 1; equal to slotMinutes
   * for a pure slot grid). Least-cost plans without a floor use it for their one marginal slot;
   * single-start plans for the timer's switch-on.
   */
  switchOnStepMinutes?: number;
  /** Default: the later of the model start (the shutdown) and `nowMs`. */
  earliestSwitchOnMs?: number;
  mode: PlanMode;
  /** The caller's "now" (the planner never reads a clock). */
  nowMs?: number;
  /** When the forecast was issued, for its error's lead time (default `nowMs`, else the model start). */
  forecastIssuedAtMs?: number;
  /** The "on N hours before departure" rules to compare against (default 1, 2, 3, 4). */
  baselineHours?: readonly number[];
  /**
   * Forecast error model. Default: one uniform shift of the whole outside forecast with σ at the
   * departure's lead time. With `correlationHours`: per-point sensitivities, σ at each point's lead
   * time, errors correlated as exp(−|Δt| / correlationHours).
   */
  uncertainty?: { correlationHours?: number };
  /** Plan for this chance of being ready instead of the forecast's best guess (raises the target by z·σ). */
  targetProbability?: number;
  /**
   * Aim at least this far above the ready temperature, K (lib/planner/chance.ts sets it from every error
   * source, not the forecast alone). The larger of this and the targetProbability margin is used.
   */
  targetMarginK?: number;
  /** Branch-and-bound node limit for the slot choice (default 200 000). */
  maxNodes?: number;
  /**
   * The start window, minutes (default 0: judged at the departure instant only). The oil (and the
   * engine mass, with engineReadyC) must stay at or above ready from departure through the hold, and
   * the heater stays on through it: nobody starts at the booked minute (walk-round, oil check).
   */
  holdMinutes?: number;
  /** The engine-mass threshold (two-node models only): readiness needs it too, over the whole window. */
  engineReadyC?: number;
}

/** The start window as planned: lowest temperatures over [departure, until], re-simulated. */
export interface HoldReport {
  untilMs: number;
  minOilC: number;
  minEngineC?: number;
  /** Both thresholds held at every instant of the window. */
  met: boolean;
  /** The heater is kept on from departure to untilMs (false when no heat is needed at all). */
  heaterOn: boolean;
}

export interface Interval {
  fromMs: number;
  toMs: number;
}

export interface Baseline {
  rule: 'all-night' | 'hours-before';
  /** For 'hours-before'. */
  hours?: number;
  fromMs: number;
  toMs: number;
  /** The rule wanted an earlier start than the earliest switch-on: it starts there instead. */
  clipped: boolean;
  energyKWh: number;
  cost?: number;
  /** Re-simulated through lib/thermal. */
  oilAtDepartureC: number;
  meetsReady: boolean;
  meetsFloor?: boolean;
  /** What the plan saves against this rule (negative: the rule is cheaper, usually because it falls short). */
  saved: { energyKWh: number; cost?: number };
}

export interface FloorReport {
  floorC: number;
  /** The floor is enforced from here: the earliest switch-on, or when full heat from there restores it. */
  enforcedFromMs: number;
  /** The free curve is below the floor before heat can act. */
  breachBeforeHeat?: { fromMs: number; oilAtSwitchOnC: number };
  /** The plan's lowest oil over [enforcedFrom, departure], re-simulated (continuous). */
  minOilC: number;
  minAtMs: number;
  met: boolean;
  /** Times between slot ends where the re-simulated curve dipped below the floor and became constraints of their own. */
  dipRows: number;
}

export interface Uncertainty {
  method: 'uniform' | 'per-hour';
  leadHours: number;
  /** σ of the 2 m outside temperature (uniform: at the departure's lead time), K. */
  sigmaOutsideK: number;
  /** ∂oil(departure)/∂(uniform shift of the outside forecast), K/K. */
  sensitivityKPerK: number;
  /** σ of the oil at departure, K. */
  sigmaOilK: number;
  correlationHours?: number;
}

export interface Optimality {
  /** How the on/off-per-slot plan was found. */
  method: 'branch-and-bound' | 'label-dp' | 'lp-rounding';
  /** 'finer-step': one slot's switch-on was then moved inside the slot at switchOnStepMinutes, re-simulated. */
  switchOn?: 'finer-step';
  /**
   * A lower bound from the continuous relaxation (slots may be fractionally on), in the
   * objective's units (cost, or kWh when no price is given): with no floor it is the relaxation's
   * optimum; with a floor, the departure-only relaxation (the floor can only add cost).
   */
  lpBound: number;
  /** (plan − lpBound) / lpBound: what the granularity costs (a finer switch-on can take it slightly below 0). */
  gapToLpBound: number;
  /** Proven bound on (on/off plan − best on/off-per-slot plan) / on/off plan. */
  certifiedGap: number;
  nodes?: number;
}

export interface PlanResult {
  mode: PlanMode;
  status: PlanStatus;
  departureMs: number;
  readyC: number;
  /** The temperature the plan aims for at departure: readyC, raised for targetProbability. */
  targetC: number;
  earliestSwitchOnMs: number;
  slotMinutes: number;
  heaterOn: Interval[];
  switchOnAtMs?: number;
  /** single-start: the exact latest switch-on for the ready temperature (continuous, not on the slot grid). */
  latestSwitchOnAtMs?: number;
  /** The plan re-simulated through lib/thermal. */
  oilAtDepartureC: number;
  /** The affine prediction the optimiser used (agrees with the re-simulation to rounding). */
  predictedOilAtDepartureC: number;
  /** With no heat. */
  freeOilAtDepartureC: number;
  energyKWh: number;
  cost?: number;
  floor?: FloorReport;
  fix?: {
    /** Heater on from the earliest switch-on and kept on: the first time the oil reaches ready (null: not within 48 h). */
    readyAtMs: number | null;
    /** The heater power that would meet the ready temperature (and floor) at departure with the heater on throughout. */
    powerNeededW: number | null;
  };
  baselines: { allNight: Baseline; hoursBefore: Baseline[] };
  probabilityReady: number;
  uncertainty: Uncertainty;
  optimality?: Optimality;
  /** With a start window (holdMinutes > 0) or an engine-mass threshold. */
  hold?: HoldReport;
}

/** A request the planner cannot work with; `field` names the request field (dotted path). */
export class PlanInputError extends Error {
  constructor(
    public field: string,
    message: string,
  ) {
    super(message);
  }
}
