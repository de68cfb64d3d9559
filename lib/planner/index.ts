// Thawline's heat planner: the least-cost heater schedule (or the single switch-on time of a plain
// timer) that meets the ready temperature at departure and the overnight floor, beside the usual
// rules, with the chance of being ready. Pure: no database, network or clock — "now" is passed in.
export { planDeparture, windowMinimum, DEFAULT_HOLD_MINUTES } from './hold';
export { planJointly, oneControl, type ControlGroup } from './joint';
export { planAtDeparture, DEFAULT_SLOT_MINUTES, DEFAULT_BASELINE_HOURS, MAX_SLOTS, CHECK_TOL_K } from './plan';
export { coverExact, coverRelaxation, type CoverLp, type CoverSolution } from './cover';
export { solveCoverWithLpSolver, roundCover, meetsRows, type CoverRow, type LpSolution } from './lp';
export { normalCdf, normalQuantile, probabilityReady, oilUncertainty } from './probability';
export { slotGrid, pricingOf, kWhOf, mergeIntervals, type Pricing } from './slots';
export { withHeater, restartAt, oilMinimumBetween, oilAt, partsOf } from './model';
export * from './types';
export { runPlan, toPlanRequest, toPlanJson, type PlanJson, type BaselineJson } from './contract';
