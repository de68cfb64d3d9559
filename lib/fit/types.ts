// Shared types of Fit from log: a parsed logger series, parse problems, fit results.

/** A logged series, times strictly increasing. Temperatures °C; NaN where an optional value is missing. */
export interface LogSeries {
  /** Epoch ms (UTC instants). */
  t: Float64Array;
  oil: Float64Array;
  /** Outside or shelter air next to the engine; null when the file has no such column. */
  ambient: Float64Array | null;
  /** 1 where a heater column says the heater was on; null when the file has no heater column. */
  heater: Uint8Array | null;
}

/** A problem found while reading the file: the row is the file's line number (as a spreadsheet shows it). */
export interface ParseProblem {
  row?: number;
  column?: string;
  message: string;
}

import type { TempUnit } from '@/lib/units';

export type { TempUnit };
export type UnitChoice = 'auto' | TempUnit;
