// Morning outcomes → what they say about the model: per aircraft, the error of the predicted oil at
// start (recorded − predicted), a Bayesian estimate of its bias and spread, and how often the stated
// chance of being ready held. Pure: no I/O, no clock.
//
// Why a conjugate Bayesian update (and not a plain mean and standard deviation): an aircraft gathers
// only a few mornings a season, so its own numbers are too few to trust at first. A normal model with
// unknown mean (the bias) and variance (the model's error) under the conjugate Normal–scaled-inverse-χ²
// prior lets the class preset's model σ dominate at first and the aircraft's own mornings take over as
// they accumulate — in closed form, so the report and (later) the planner read it without sampling.
// The update is Gelman et al., Bayesian Data Analysis, 3rd ed. (2013), §3.3 (eqs. 3.6–3.8 and the
// posterior predictive below them).

/** The prior's scale for the model's error (K), by where the thermal parameters came from. Estimate. */
export const PRIOR_SIGMA_K: Record<'preset' | 'manual' | 'fitted', number> = {
  preset: 4, // estimate: a class preset's model error (losses, coupling, heater supply) is several kelvin
  manual: 4, // estimate: hand-entered parameters are treated like a preset
  fitted: 2.5, // estimate: parameters fitted from a cool-down log of this aircraft
};
/** The prior's weight on zero bias, in mornings (κ₀). Estimate. */
export const PRIOR_KAPPA = 2;
/** The prior's weight on its σ, in degrees of freedom (ν₀; above 2 so the prior's spread is finite). Estimate. */
export const PRIOR_NU = 4;

export interface NormalInvChi2 {
  /** Location of the bias (K). */
  mu: number;
  /** Weight of the location, in observations. */
  kappa: number;
  /** Degrees of freedom of the variance. */
  nu: number;
  /** Scale of the variance (K²). */
  sigma2: number;
}

export function priorFor(source: string | null | undefined): NormalInvChi2 {
  const s = PRIOR_SIGMA_K[(source ?? 'preset') as keyof typeof PRIOR_SIGMA_K] ?? PRIOR_SIGMA_K.preset;
  return { mu: 0, kappa: PRIOR_KAPPA, nu: PRIOR_NU, sigma2: s * s };
}

/**
 * The posterior after the errors `ys` (K), BDA3 §3.3:
 *   κₙ = κ₀ + n,  νₙ = ν₀ + n,  μₙ = (κ₀μ₀ + n·ȳ)/κₙ,
 *   νₙσₙ² = ν₀σ₀² + (n−1)s² + κ₀n(ȳ − μ₀)²/κₙ.
 */
export function updateNormalInvChi2(prior: NormalInvChi2, ys: readonly number[]): NormalInvChi2 {
  const n = ys.length;
  if (n === 0) return { ...prior };
  const mean = ys.reduce((a, b) => a + b, 0) / n;
  const ss = ys.reduce((a, y) => a + (y - mean) ** 2, 0); // (n−1)s²
  const kappa = prior.kappa + n;
  const nu = prior.nu + n;
  const mu = (prior.kappa * prior.mu + n * mean) / kappa;
  const sigma2 = (prior.nu * prior.sigma2 + ss + (prior.kappa * n * (mean - prior.mu) ** 2) / kappa) / nu;
  return { mu, kappa, nu, sigma2 };
}

export interface BiasEstimate {
  /** Mornings with a recorded and a predicted oil temperature. */
  n: number;
  /** Posterior mean of the bias (recorded − predicted), K: add it to a prediction. */
  biasK: number;
  /** Posterior standard deviation of the bias (marginal t with νₙ d.o.f., scale σₙ/√κₙ), K. */
  biasSdK: number;
  /** Posterior estimate of the model's error σ (σₙ), K. */
  sigmaK: number;
  /** Posterior predictive σ of the next morning's error: σₙ·√(1 + 1/κₙ)·√(νₙ/(νₙ−2)), K. */
  predictiveSigmaK: number;
  /** Degrees of freedom of the predictive t distribution (νₙ). */
  dof: number;
  /** The prior's σ the estimate started from, K. */
  priorSigmaK: number;
}

/** The bias and model-error estimate from an aircraft's errors (K), shrunk towards the class prior. */
export function estimateBias(errors: readonly number[], source?: string | null): BiasEstimate {
  const prior = priorFor(source);
  const post = updateNormalInvChi2(prior, errors);
  const tVar = post.nu > 2 ? post.nu / (post.nu - 2) : Infinity;
  return {
    n: errors.length,
    biasK: post.mu,
    biasSdK: Math.sqrt((post.sigma2 / post.kappa) * tVar),
    sigmaK: Math.sqrt(post.sigma2),
    predictiveSigmaK: Math.sqrt(post.sigma2 * (1 + 1 / post.kappa) * tVar),
    dof: post.nu,
    priorSigmaK: Math.sqrt(prior.sigma2),
  };
}

export interface ErrorSummary {
  n: number;
  /** Mean of recorded − predicted, K (null without data). */
  meanK: number | null;
  /** Sample standard deviation, K (null below two). */
  sdK: number | null;
  /** Mean absolute error, K. */
  maeK: number | null;
}

export function summarizeErrors(errors: readonly number[]): ErrorSummary {
  const n = errors.length;
  if (!n) return { n, meanK: null, sdK: null, maeK: null };
  const mean = errors.reduce((a, b) => a + b, 0) / n;
  const sd = n > 1 ? Math.sqrt(errors.reduce((a, e) => a + (e - mean) ** 2, 0) / (n - 1)) : null;
  return { n, meanK: mean, sdK: sd, maeK: errors.reduce((a, e) => a + Math.abs(e), 0) / n };
}

/**
 * Wilson's score interval for a binomial share (Wilson 1927, JASA 22:209–212):
 *   centre = (p̂ + z²/2n)/(1 + z²/n),  half-width = z/(1 + z²/n)·√(p̂(1−p̂)/n + z²/4n²).
 */
export function wilsonInterval(successes: number, n: number, z = 1.959963984540054): { lo: number; hi: number } {
  if (n <= 0) return { lo: 0, hi: 1 };
  const p = successes / n;
  const z2 = z * z;
  const d = 1 + z2 / n;
  const centre = (p + z2 / (2 * n)) / d;
  const half = (z / d) * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n));
  return { lo: Math.max(0, centre - half), hi: Math.min(1, centre + half) };
}

/** Bins of the stated chance of being ready; a chance belongs to the bin with from ≤ p < to (the last includes 1). */
export const CHANCE_BINS = [
  { from: 0, to: 0.5, label: 'under 50 %' },
  { from: 0.5, to: 0.7, label: '50–70 %' },
  { from: 0.7, to: 0.9, label: '70–90 %' },
  { from: 0.9, to: 1, label: '90–100 %' },
] as const;

export interface ReliabilityRow {
  label: string;
  from: number;
  to: number;
  /** Mornings flown with a stated chance in this bin. */
  n: number;
  /** Of those, ready at start (recorded ≥ ready temperature). */
  ready: number;
  /** Mean stated chance in the bin (null when empty). */
  meanStated: number | null;
  /** Share ready (null when empty) and its 95 % Wilson interval. */
  share: number | null;
  lo: number | null;
  hi: number | null;
}

export interface ChanceOutcome {
  /** The chance of being ready the plan stated (0–1). */
  probabilityReady: number;
  recordedC: number;
  readyC: number;
}

/** How often the stated chance held, by bin (empty bins included, so tables keep their shape). */
export function reliability(outcomes: readonly ChanceOutcome[]): ReliabilityRow[] {
  return CHANCE_BINS.map((b, i) => {
    const last = i === CHANCE_BINS.length - 1;
    const inBin = outcomes.filter((o) => Number.isFinite(o.probabilityReady) && o.probabilityReady >= b.from && (last ? o.probabilityReady <= b.to : o.probabilityReady < b.to));
    const n = inBin.length;
    const ready = inBin.filter((o) => o.recordedC >= o.readyC).length;
    const w = n ? wilsonInterval(ready, n) : null;
    return {
      label: b.label,
      from: b.from,
      to: b.to,
      n,
      ready,
      meanStated: n ? inBin.reduce((a, o) => a + o.probabilityReady, 0) / n : null,
      share: n ? ready / n : null,
      lo: w?.lo ?? null,
      hi: w?.hi ?? null,
    };
  });
}
