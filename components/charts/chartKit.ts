'use client';
// Small helpers shared by the Fit from log and Oil log charts: linear scales with round ticks, SVG paths
// that break at gaps, local-time ticks in the airfield's zone, and the measured width of the chart's box
// (so the SVG's text stays at its true size on a phone and on a desk screen).
import { useEffect, useRef, useState, type RefObject } from 'react';
import { formatDay, formatTime, localHourOf } from '@/lib/time';

export interface Scale {
  (v: number): number;
  lo: number;
  hi: number;
  ticks: number[];
}

/** 1, 2 or 5 × 10ⁿ so that about `count` steps cover `span` (tick labels stay exact when rounded). */
export function niceStep(span: number, count: number): number {
  const rough = Math.max(span, 1e-9) / Math.max(count, 1);
  const mag = Math.pow(10, Math.floor(Math.log10(rough)));
  for (const m of [1, 2, 5]) if (m * mag >= rough) return m * mag;
  return 10 * mag;
}

/** A linear scale from data [min, max] (widened to round ticks) onto pixels [r0, r1]. */
export function linearScale(values: number[], r0: number, r1: number, o: { count?: number; minSpan?: number; include?: number[] } = {}): Scale {
  const vs = [...values, ...(o.include ?? [])].filter((v) => Number.isFinite(v));
  let lo = vs.length ? Math.min(...vs) : 0;
  let hi = vs.length ? Math.max(...vs) : 1;
  const minSpan = o.minSpan ?? 1;
  if (hi - lo < minSpan) {
    const mid = (hi + lo) / 2;
    lo = mid - minSpan / 2;
    hi = mid + minSpan / 2;
  }
  const step = niceStep(hi - lo, o.count ?? 5);
  lo = Math.floor(lo / step + 1e-9) * step;
  hi = Math.ceil(hi / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let v = lo; v <= hi + step / 2; v += step) ticks.push(Math.round(v * 1e6) / 1e6);
  const f = ((v: number) => r0 + ((v - lo) / (hi - lo)) * (r1 - r0)) as Scale;
  f.lo = lo;
  f.hi = hi;
  f.ticks = ticks;
  return f;
}

/** An SVG path through the points; NaN values lift the pen. */
export function linePath(xs: ArrayLike<number>, ys: ArrayLike<number>, x: (v: number) => number, y: (v: number) => number): string {
  let d = '';
  let pen = false;
  for (let i = 0; i < xs.length; i++) {
    const v = ys[i];
    if (!Number.isFinite(v)) {
      pen = false;
      continue;
    }
    d += `${pen ? 'L' : 'M'}${x(xs[i]).toFixed(1)} ${y(v).toFixed(1)}`;
    pen = true;
  }
  return d;
}

/** Local whole-hour ticks in the zone, every 1, 2, 3, 6, 12 or 24 h so labels stay ~70 px apart; midnights named by day. */
export function timeTicks(t0: number, t1: number, plotWidth: number, zone: string): { ms: number; label: string; midnight: boolean }[] {
  const H = 3_600_000;
  const fit = Math.max(1, Math.floor(plotWidth / 70));
  const every = [1, 2, 3, 6, 12, 24].find((h) => (t1 - t0) / (h * H) <= fit) ?? 48;
  const out: { ms: number; label: string; midnight: boolean }[] = [];
  for (let ms = Math.ceil(t0 / (H / 4)) * (H / 4); ms <= t1; ms += H / 4) {
    const h = localHourOf(zone, ms);
    if (Math.abs(h - Math.round(h)) > 1e-6) continue;
    const hh = Math.round(h) % 24;
    if (hh % Math.min(every, 24) !== 0) continue;
    const midnight = hh === 0;
    out.push({ ms, midnight, label: midnight ? formatDay(ms, zone).split(' ').slice(0, 2).join(' ') : formatTime(ms, zone) });
  }
  return out;
}

/** Numbers for axes and tables: a typographic minus, no "-0". */
export function num(v: number, digits = 0): string {
  const s = (Math.abs(v) < 0.5 * Math.pow(10, -digits) ? 0 : v).toFixed(digits);
  return s.replace('-', '\u2212');
}

/** The width the chart's box is given (CSS px; `initial` until measured, e.g. on the server). */
export function useBoxWidth(initial = 640): [RefObject<HTMLDivElement | null>, number] {
  const ref = useRef<HTMLDivElement>(null);
  const [w, setW] = useState(initial);
  useEffect(() => {
    const el = ref.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    const ro = new ResizeObserver(([e]) => setW(Math.max(280, Math.round(e.contentRect.width))));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  return [ref, w];
}

export const AXIS_TEXT = 'fill-slate-500 text-[11px] tabular-nums dark:fill-slate-400';
export const GRID = 'stroke-slate-200 dark:stroke-slate-700';
