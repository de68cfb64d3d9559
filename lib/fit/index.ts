// Fit from log: reading a logger CSV, suggesting the cool-down, fitting one or two nodes. Pure apart from
// node:zlib in pack.ts (used by the server only).
export * from './types';
export { readLog, chunksOf, LogRefused, MAX_LOG_BYTES, MAX_LISTED_PROBLEMS, sniffDelimiter, type ReadResult, type LogLayout, type ReadOptions } from './csv';
export { suggestWindow, noiseEstimate, type SuggestedWindow } from './window';
export { fitCooldown, fitOneNode, windowData, twoNodeTimeConstants, FitRefused, type FitReport, type FitWindow, type FitOptions, type OneNodeFit, type TwoNodeFit, type Estimate } from './cooldown';
export { oneNodeCurve } from './oneNode';
export { packSeries, unpackSeries } from './pack';
