// The chance of being ready. The oil at departure is affine in the outside forecast (the model is
// linear), so a normal error on the forecast gives a normal error on the oil:
//   uniform:  oil error = s·e, e ~ N(0, σ(lead at departure)²), s = ∂oil/∂(uniform shift);
//   per-hour: oil error = Σ s_i·e_i, e_i ~ N(0, σ(lead_i)²), corr(e_i, e_j) = exp(−|t_i − t_j| / L).
// σ(lead) is the 2 m temperature forecast error of lib/weather (docs/sources.md "Forecast data", from
// memory). P(oil ≥ ready) = Φ((oil − ready) / σ_oil), Φ from mathjs erf. The heater schedule does
// not change the sensitivities (superposition), so they are taken from the free run.
import { erf } from 'mathjs';
import { forecastSigmaK } from '@/lib/weather/derive';
import type { OilResponseAt } from '@/lib/thermal/planner-support';
import type { SoakModel } from '@/lib/thermal';
import type { Uncertainty } from './types';

const HOUR_MS = 3_600_000;

/** Standard normal CDF. */
export function normalCdf(z: number): number {
  if (z === Infinity) return 1;
  if (z === -Infinity) return 0;
  return 0.5 * (1 + erf(z / Math.SQRT2));
}

/** Standard normal quantile: bisection on normalCdf (monotone), to ~1e-12. */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) return p <= 0 ? -Infinity : Infinity;
  let lo = -40;
  let hi = 40;
  for (let i = 0; i < 80 && hi - lo > 1e-12; i++) {
    const mid = 0.5 * (lo + hi);
    if (normalCdf(mid) < p) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** σ of the oil at departure from the forecast's error, and how it was reckoned. */
export function oilUncertainty(
  model: SoakModel,
  atT: OilResponseAt,
  o: { departureMs: number; issuedAtMs: number; correlationHours?: number },
): Uncertainty {
  const leadHours = (o.departureMs - o.issuedAtMs) / HOUR_MS;
  const s = atT.uniformShiftKPerK;
  if (o.correlationHours === undefined) {
    const sigmaOutsideK = forecastSigmaK(leadHours);
    return { method: 'uniform', leadHours, sigmaOutsideK, sensitivityKPerK: s, sigmaOilK: Math.abs(s) * sigmaOutsideK };
  }
  const L = o.correlationHours * HOUR_MS;
  const pts = model.outside;
  const w: number[] = [];
  const t: number[] = [];
  atT.perOutsideK.forEach((si, i) => {
    if (si !== 0) {
      w.push(si * forecastSigmaK((pts[i].atMs - o.issuedAtMs) / HOUR_MS));
      t.push(pts[i].atMs);
    }
  });
  let v = 0;
  for (let i = 0; i < w.length; i++) {
    for (let j = 0; j < w.length; j++) v += w[i] * w[j] * (L > 0 ? Math.exp(-Math.abs(t[i] - t[j]) / L) : i === j ? 1 : 0);
  }
  const sigmaOilK = Math.sqrt(Math.max(0, v));
  return {
    method: 'per-hour',
    leadHours,
    sigmaOutsideK: s !== 0 ? sigmaOilK / Math.abs(s) : forecastSigmaK(leadHours),
    sensitivityKPerK: s,
    sigmaOilK,
    correlationHours: o.correlationHours,
  };
}

/** P(oil ≥ ready) for a predicted oil temperature and its σ. */
export function probabilityReady(oilC: number, readyC: number, sigmaOilK: number): number {
  if (!(sigmaOilK > 0)) return oilC >= readyC ? 1 : 0;
  return normalCdf((oilC - readyC) / sigmaOilK);
}
