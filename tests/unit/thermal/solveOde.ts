// mathjs ships solveODE without a type declaration; this gives it one for the tests and the bench.
import * as math from 'mathjs';

export interface OdeSolution {
  t: number[];
  y: number[][];
}

export interface OdeOptions {
  method?: 'RK23' | 'RK45';
  tol?: number;
  firstStep?: number;
  minStep?: number;
  maxStep?: number;
  maxIter?: number;
}

type SolveOde = (f: (t: number, y: number[]) => number[], tspan: [number, number], y0: number[], options?: OdeOptions) => OdeSolution;

export const solveODE = (math as unknown as { solveODE: SolveOde }).solveODE;
