// Nonlinear least squares for the cool-down fits: Levenberg–Marquardt from ml-levenberg-marquardt over a
// model that returns the whole curve for a parameter vector, then the statistics a fit is judged by:
// RMSE, R² and the parameters' standard errors from the Jacobian, covariance = s²·(JᵀJ)⁻¹ with
// s² = SSE/(n − p).
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { inv } from 'mathjs';

export type CurveModel = (p: readonly number[]) => Float64Array;

export interface LeastSquaresResult {
  p: number[];
  /** Standard error of each parameter (NaN when the covariance cannot be formed). */
  sigma: number[];
  cov: number[][] | null;
  sse: number;
  rmse: number;
  r2: number;
  n: number;
  iterations: number;
  /** The relative change of SSE over the last round of iterations fell below 1e-10. */
  converged: boolean;
  /** AIC for Gaussian errors: n·ln(SSE/n) + 2p. */
  aic: number;
  fitted: Float64Array;
}

interface Options {
  min: number[];
  max: number[];
  /** Relative step of the central-difference Jacobian (default 1e-5 of max(|p|, 1)). */
  relStep?: number;
  maxIterations?: number;
}

/** Memoises the last curve so the package's repeated calls with the same parameters cost nothing. */
function memo(model: CurveModel): CurveModel {
  let key = '';
  let last: Float64Array | null = null;
  return (p) => {
    const k = p.join(',');
    if (k !== key || !last) {
      last = model(p);
      key = k;
    }
    return last;
  };
}

export function jacobian(model: CurveModel, p: readonly number[], relStep = 1e-5): Float64Array[] {
  return p.map((pj, j) => {
    const h = relStep * Math.max(Math.abs(pj), 1);
    const up = p.slice();
    const dn = p.slice();
    up[j] = pj + h;
    dn[j] = pj - h;
    const a = model(up);
    const b = model(dn);
    const col = new Float64Array(a.length);
    for (let i = 0; i < a.length; i++) col[i] = (a[i] - b[i]) / (2 * h);
    return col;
  });
}

function sumSq(y: ArrayLike<number>, f: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < y.length; i++) s += (y[i] - f[i]) ** 2;
  return s;
}

export function fitCurve(model: CurveModel, y: Float64Array, p0: number[], opts: Options): LeastSquaresResult {
  const f = memo(model);
  const n = y.length;
  const x = Array.from({ length: n }, (_, i) => i);
  const relStep = opts.relStep ?? 1e-5;
  const maxIterations = opts.maxIterations ?? 300;
  let p = p0.map((v, j) => Math.min(Math.max(v, opts.min[j]), opts.max[j]));
  let sse = sumSq(y, f(p));
  let iterations = 0;
  let converged = false;
  // The package stops only at a fixed count or an absolute SSE; run it in rounds and stop when a round
  // no longer improves the sum of squares.
  while (iterations < maxIterations) {
    const round = Math.min(15, maxIterations - iterations);
    const res = levenbergMarquardt({ x, y }, (q) => {
      const c = f(q);
      return (i: number) => c[i];
    }, {
      initialValues: p,
      minValues: opts.min,
      maxValues: opts.max,
      maxIterations: round,
      errorTolerance: 0,
      damping: 1e-3,
      jacobianFunction: (q) => {
        const J = jacobian(f, q, relStep);
        return (i: number) => J.map((col) => col[i]);
      },
    });
    iterations += res.iterations;
    const next = res.parameterValues;
    const nextSse = sumSq(y, f(next));
    const improved = nextSse < sse;
    if (improved) p = next;
    const rel = (sse - Math.min(sse, nextSse)) / Math.max(sse, 1e-300);
    if (improved) sse = nextSse;
    if (rel < 1e-10) {
      converged = true;
      break;
    }
  }
  const fitted = Float64Array.from(f(p));
  let mean = 0;
  for (let i = 0; i < n; i++) mean += y[i];
  mean /= n;
  let sst = 0;
  for (let i = 0; i < n; i++) sst += (y[i] - mean) ** 2;
  const k = p.length;
  const s2 = n > k ? sse / (n - k) : NaN;
  const J = jacobian(f, p, relStep);
  let cov: number[][] | null = null;
  let sigma = p.map(() => NaN);
  try {
    const jtj = J.map((a) => J.map((b) => {
      let s = 0;
      for (let i = 0; i < n; i++) s += a[i] * b[i];
      return s;
    }));
    const invJtJ = inv(jtj) as number[][];
    cov = invJtJ.map((row) => row.map((v) => v * s2));
    sigma = cov.map((row, j) => Math.sqrt(Math.max(row[j], 0)));
  } catch {
    cov = null;
  }
  return {
    p,
    sigma,
    cov,
    sse,
    rmse: Math.sqrt(sse / n),
    r2: sst > 0 ? 1 - sse / sst : NaN,
    n,
    iterations,
    converged,
    aic: n * Math.log(Math.max(sse, 1e-300) / n) + 2 * k,
    fitted,
  };
}
