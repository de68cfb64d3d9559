// An honest chance of being ready: the oil at departure is uncertain for more reasons than the forecast.
// Sources, each as a σ of the oil at departure (K):
//   forecast  — the planner's own (lib/planner/probability.ts);
//   aircraft  — the model's heat losses: a class preset is known to about ±20 % (estimate), a profile
//               fitted from a log to its fit's spread; propagated by the delta method, ∂oil/∂ln G · σ_lnG,
//               the derivative by a central difference on the re-simulated model;
//   heater    — the power reaching the node (supply voltage, a settable tolerance: P ∝ V², so ±4 % volts
//               is ±8 % power, estimate), the same way;
//   outcomes  — what the mornings taught: a bias added to the prediction and a σ of its own;
//   cover     — an aircraft whose cover is "usually on" may spend the night without it: not a normal
//               error but a two-point mixture, P = (1−q)·Φ((µ−r)/σ) + q·Φ((µ−Δ−r)/σ) with Δ the drop
//               without the cover and q the chance it is off (estimate 10 %).
// The normal sources add in quadrature (independent). Plans aim at a chance: the planner is given the
// margin above the ready temperature that makes P reach the target, found by bisection, re-planned
// until the plan's own breakdown agrees (the heater term grows with the heat). Pure, no I/O.
import { stateAt, type NodeName, type SoakModel } from '@/lib/thermal';
import { planDeparture } from './hold';
import { withHeater } from './model';
import { normalCdf } from './probability';
import type { Interval, PlanRequest, PlanResult } from './types';

/** A class preset's heat losses are known to about this relative σ (estimate). */
export const PRESET_LOSS_REL_SIGMA = 0.2;
/** A profile fitted from a log, before its own covariance is used (estimate). */
export const FITTED_LOSS_REL_SIGMA = 0.07;
/** Relative σ of a heater's delivered power (supply voltage ±4 % → power ±8 %; estimate). */
export const HEATER_POWER_REL_SIGMA = 0.08;
/** Chance that a cover the profile has "usually on" is off for the night (estimate). */
export const COVER_OFF_PROBABILITY = 0.1;
/** The organization's default: plans aim to be ready with this chance. */
export const DEFAULT_TARGET_CHANCE = 0.9;

export interface ErrorModel {
  lossRelSigma: number;
  powerRelSigma: number;
  /** Only with a cover in the model. */
  coverOffProbability: number;
  /** Learned from morning outcomes: added to the prediction (K), and its own σ (K). */
  biasK?: number;
  outcomeSigmaK?: number;
}

export const PRESET_ERRORS: ErrorModel = { lossRelSigma: PRESET_LOSS_REL_SIGMA, powerRelSigma: HEATER_POWER_REL_SIGMA, coverOffProbability: COVER_OFF_PROBABILITY };

export interface ChanceBreakdown {
  forecastK: number;
  aircraftK: number;
  heaterK: number;
  outcomesK: number;
  /** Combined σ of the normal sources, K. */
  sigmaK: number;
  /** The prediction the chance is reckoned on (oil at departure + learned bias). */
  expectedOilC: number;
  /** Drop of the oil at departure if the cover is off, K (0 without a cover). */
  coverDropK: number;
  coverOffProbability: number;
  probabilityReady: number;
}

const H = 0.05;

function scaleLosses(m: SoakModel, f: number): SoakModel {
  return {
    ...m,
    oil: { ...m.oil, lossWPerK: m.oil.lossWPerK * f },
    engine: m.engine ? { ...m.engine, lossWPerK: m.engine.lossWPerK * f } : undefined,
    shelter: m.shelter.kind === 'hangar' ? { ...m.shelter } : m.shelter,
  };
}

const oilAt = (m: SoakModel, t: number) => stateAt(m, t).oilC;

/** P(oil ≥ ready) for the mixture of "cover as usual" and "cover off". */
export function mixtureChance(expectedOilC: number, readyC: number, sigmaK: number, coverDropK: number, q: number): number {
  const p = (mu: number) => (sigmaK > 0 ? normalCdf((mu - readyC) / sigmaK) : mu >= readyC ? 1 : 0);
  return (1 - q) * p(expectedOilC) + (q > 0 ? q * p(expectedOilC - coverDropK) : 0);
}

/** The breakdown of the oil's uncertainty at departure for a model with the plan's heat on it. */
export function chanceBreakdown(o: {
  model: SoakModel;
  heater: { node: NodeName; powerW: number } | null;
  heaterOn: readonly Interval[];
  departureMs: number;
  readyC: number;
  forecastSigmaK: number;
  errors: ErrorModel;
}): ChanceBreakdown {
  const T = o.departureMs;
  const on = o.heater && o.heaterOn.length ? o.heaterOn : [];
  const planned = (m: SoakModel, power = o.heater?.powerW ?? 0) => (o.heater && on.length ? withHeater(m, { node: o.heater.node, powerW: power }, on) : m);
  const base = planned(o.model);
  const oil0 = oilAt(base, T);
  const dLoss = (oilAt(planned(scaleLosses(o.model, Math.exp(H))), T) - oilAt(planned(scaleLosses(o.model, Math.exp(-H))), T)) / (2 * H);
  const dPower = o.heater && on.length ? (oilAt(planned(o.model, o.heater.powerW * Math.exp(H)), T) - oilAt(planned(o.model, o.heater.powerW * Math.exp(-H)), T)) / (2 * H) : 0;
  const aircraftK = Math.abs(dLoss) * o.errors.lossRelSigma;
  const heaterK = Math.abs(dPower) * o.errors.powerRelSigma;
  const outcomesK = o.errors.outcomeSigmaK ?? 0;
  const sigmaK = Math.sqrt(o.forecastSigmaK ** 2 + aircraftK ** 2 + heaterK ** 2 + outcomesK ** 2);
  const q = o.model.cover ? o.errors.coverOffProbability : 0;
  const coverDropK = q > 0 ? Math.max(0, oil0 - oilAt({ ...base, cover: false }, T)) : 0;
  const expectedOilC = oil0 + (o.errors.biasK ?? 0);
  return {
    forecastK: o.forecastSigmaK,
    aircraftK,
    heaterK,
    outcomesK,
    sigmaK,
    expectedOilC,
    coverDropK,
    coverOffProbability: q,
    probabilityReady: mixtureChance(expectedOilC, o.readyC, sigmaK, coverDropK, q),
  };
}

/** The expected oil that gives `target` chance, by bisection on the (monotone) mixture. */
export function oilForChance(target: number, readyC: number, sigmaK: number, coverDropK: number, q: number): number {
  let lo = readyC - 50;
  let hi = readyC + 200;
  if (mixtureChance(hi, readyC, sigmaK, coverDropK, q) < target) return Infinity;
  for (let i = 0; i < 80; i++) {
    const mid = (lo + hi) / 2;
    if (mixtureChance(mid, readyC, sigmaK, coverDropK, q) >= target) hi = mid;
    else lo = mid;
  }
  return hi;
}

export interface ChancePlan {
  result: PlanResult;
  breakdown: ChanceBreakdown;
  targetChance: number;
  /** The plan's chance reaches the target. */
  meetsTarget: boolean;
}

/**
 * Plans to be ready with `targetChance` counting every error source: plan, reckon the breakdown on the
 * plan, give the planner the margin the target needs, re-plan (at most a few rounds; the margin only grows).
 */
export function planForChance(req: PlanRequest, targetChance: number, errors: ErrorModel): ChancePlan {
  let margin = 0;
  let result = planDeparture({ ...req, targetProbability: undefined, targetMarginK: 0 });
  let breakdown = breakdownOf(req, result, errors);
  for (let round = 0; round < 4; round++) {
    if (breakdown.probabilityReady >= targetChance - 1e-3 || result.status === 'short') break;
    const mu = oilForChance(targetChance, req.readyC, breakdown.sigmaK, breakdown.coverDropK, breakdown.coverOffProbability);
    if (!Number.isFinite(mu)) break;
    // The margin above the ready temperature the prediction (before the learned bias) must reach.
    const next = mu - (errors.biasK ?? 0) - req.readyC;
    if (next <= margin + 1e-3) break;
    margin = next;
    const r = planDeparture({ ...req, targetProbability: undefined, targetMarginK: margin });
    if (r.status === 'short') {
      // The margin cannot be reached in time: keep the plan that meets the ready temperature, with its honest chance.
      break;
    }
    result = r;
    breakdown = breakdownOf(req, result, errors);
  }
  return { result: { ...result, probabilityReady: breakdown.probabilityReady }, breakdown, targetChance, meetsTarget: breakdown.probabilityReady >= targetChance - 1e-3 };
}

function breakdownOf(req: PlanRequest, r: PlanResult, errors: ErrorModel): ChanceBreakdown {
  return chanceBreakdown({ model: req.model, heater: req.heater, heaterOn: r.heaterOn, departureMs: req.departureMs, readyC: req.readyC, forecastSigmaK: r.uncertainty.sigmaOilK, errors });
}
