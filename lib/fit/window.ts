// Suggesting the cool-down window of a log: the longest-falling stretch after a peak (the last shutdown),
// smoothed against the logger's noise, ending where the oil starts to rise again or a heater comes on.
import type { LogSeries } from './types';

export interface SuggestedWindow {
  startMs: number;
  endMs: number;
  startIndex: number;
  endIndex: number;
  /** Oil at the start and end of the window (smoothed), °C. */
  fromC: number;
  toC: number;
  /** Why the window ends where it does. */
  endReason: 'end-of-log' | 'rise' | 'heater';
}

/** A robust estimate of the sample noise (K): the median absolute successive difference, scaled. */
export function noiseEstimate(y: ArrayLike<number>): number {
  const n = y.length;
  if (n < 3) return 0;
  const d: number[] = [];
  const step = Math.max(1, Math.floor(n / 20000));
  for (let i = step; i < n; i += step) d.push(Math.abs(y[i] - y[i - step]));
  d.sort((a, b) => a - b);
  return (1.4826 * d[Math.floor(d.length / 2)]) / Math.SQRT2;
}

/** A centred moving mean over 2k + 1 points (prefix sums: O(n)). */
export function movingMean(y: ArrayLike<number>, k: number): Float64Array {
  const n = y.length;
  const pre = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) pre[i + 1] = pre[i] + y[i];
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const a = Math.max(0, i - k);
    const b = Math.min(n - 1, i + k);
    out[i] = (pre[b + 1] - pre[a]) / (b - a + 1);
  }
  return out;
}

/** The cool-down to fit, or null when the log holds none (no fall of at least 3 K over 10 rows). */
export function suggestWindow(s: LogSeries): SuggestedWindow | null {
  const n = s.t.length;
  if (n < 10) return null;
  const k = Math.max(1, Math.min(60, Math.floor(n / 150)));
  const sm = movingMean(s.oil, k);
  const tol = Math.max(0.3, 4 * noiseEstimate(s.oil) / Math.sqrt(2 * k + 1));
  const heaterOn = (i: number) => (s.heater ? s.heater[i] === 1 : false);

  let best: { a: number; b: number; drop: number; reason: SuggestedWindow['endReason'] } | null = null;
  const close = (a: number, b: number, reason: SuggestedWindow['endReason']) => {
    if (a < 0 || b - a < 10) return;
    const drop = sm[a] - sm[b];
    if (drop < 3) return;
    if (!best || drop > best.drop) best = { a, b, drop, reason };
  };
  let a = -1;
  let b = -1;
  for (let i = 0; i < n; i++) {
    if (heaterOn(i)) {
      close(a, b, 'heater');
      a = b = -1;
      continue;
    }
    if (a < 0) {
      a = b = i;
      continue;
    }
    if (sm[i] >= sm[a] && sm[a] - sm[b] < tol) {
      a = b = i; // still climbing to the peak
    } else if (sm[i] < sm[b]) {
      b = i;
    } else if (sm[i] > sm[b] + tol) {
      close(a, b, 'rise');
      a = b = i;
    }
  }
  close(a, b, 'end-of-log');
  if (!best) return null;
  const w = best as { a: number; b: number; drop: number; reason: SuggestedWindow['endReason'] };
  // The wide mean rounds the corner at shutdown: start instead at the end of the plateau around the
  // peak, read on a light 5-point mean.
  const fine = movingMean(s.oil, 2);
  const fineTol = Math.max(0.2, (2 * noiseEstimate(s.oil)) / Math.sqrt(5));
  let peak = -Infinity;
  for (let i = Math.max(0, w.a - k); i <= Math.min(w.b, w.a + k); i++) if (!heaterOn(i)) peak = Math.max(peak, fine[i]);
  let start = Math.max(0, w.a - k);
  while (start < w.b && (heaterOn(start) || fine[start] < peak - fineTol) && start < w.a + k) start++;
  while (start + 1 < w.b && fine[start + 1] >= peak - fineTol) start++;
  // The stretch ends at the smoothed minimum; a window that ran to the end of the log takes the last row.
  const end = w.reason === 'end-of-log' ? n - 1 : w.b;
  return { startMs: s.t[start], endMs: s.t[end], startIndex: start, endIndex: end, fromC: fine[start], toC: sm[end], endReason: w.reason };
}
