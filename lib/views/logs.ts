// Fit from log: what the data layer returns and client components show. Type-only: no I/O.
import type { ReadResult } from '@/lib/fit/csv';
import type { FitReport } from '@/lib/fit/cooldown';
import type { SuggestedWindow } from '@/lib/fit/window';
import type { ThermalParams } from './aircraft';

export const REVISION_KINDS = ['initial', 'fitted', 'revert', 'manual'] as const;
export type RevisionKind = (typeof REVISION_KINDS)[number];

/** How the uploaded file was read: which columns, which unit, which time format, in which zone. */
export interface TempLogLayout {
  columns: { time: string; oil: string; ambient: string | null; heater: string | null };
  unit: 'C' | 'F';
  unitSource: 'header' | 'cells' | 'form' | 'default';
  timeFormat: string;
  timeZone: string;
  delimiter: string;
  headerRow: number | null;
}

export interface SeriesForChart {
  tMs: number[];
  oilC: number[];
  ambientC: number[] | null;
}

export interface LogPreview {
  fileName: string;
  sizeBytes: number;
  rowCount: number;
  ok: boolean;
  layout: ReadResult['layout'];
  problems: ReadResult['problems'];
  problemCount: number;
  warnings: string[];
  sample: string[][];
  span: { startMs: number; endMs: number } | null;
  suggestion: SuggestedWindow | null;
  series: SeriesForChart;
}

export interface LogRecord {
  id: number;
  aircraftId: number;
  fileName: string;
  sizeBytes: number;
  rowCount: number;
  startAt: string;
  endAt: string;
  hasAmbient: boolean;
  layout: TempLogLayout;
  warnings: string[];
  uploadedBy: { id: number; name: string } | null;
  uploadedAt: string;
  window: { startMs: number; endMs: number } | null;
  coverOn: boolean;
  fitted: boolean;
}

export interface RevisionRecord {
  id: number;
  kind: RevisionKind;
  thermal: ThermalParams;
  tempLogId: number | null;
  restoredFromId: number | null;
  summary: Record<string, unknown> | null;
  note: string;
  author: { id: number; name: string } | null;
  createdAt: string;
  current: boolean;
}

export interface StoredFit extends FitReport {
  coverOn: boolean;
  coverFactor: number;
}
