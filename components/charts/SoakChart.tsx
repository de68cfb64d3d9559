'use client';
// The Soak forecast chart: outside air, shelter air, oil (and engine mass) over the night, the
// ready temperature as a dashed line, an optional overnight floor, and the heat plan's heater
// bands in the warm accent. Plain SVG whose viewBox follows the width it is given (measured, 640
// before the first measure), so it fills a phone in a cold hangar or a desk screen with text at its
// true size; times on the axis are local to the airfield's zone.
import { useEffect, useId, useMemo, useRef, useState, type RefObject } from 'react';
import { formatDay, formatDayTime, formatTime, localHourOf } from '@/lib/time';
import { formatTemp, tempLabel, toDisplayTemp, type TempUnit } from '@/lib/units';

export interface SoakChartPoint {
  at: string;
  outsideC: number;
  shelterC: number;
  oilC: number;
  engineC: number | null;
}

export interface SoakChartProps {
  series: SoakChartPoint[];
  readyC?: number;
  floorC?: number;
  heaterBands?: { from: string; to: string }[];
  /** The departure (a vertical line) and the end of its start window (the window is bracketed). */
  departAt?: string;
  holdUntil?: string;
  timeZone: string;
  units: TempUnit;
  /** Height in CSS pixels (default 300; the width is the container's). */
  height?: number;
}

const PAD = { left: 40, right: 10, top: 14, bottom: 34 };
const HOUR = 3_600_000;

/** Lines drawn, in drawing order (the oil last, on top). */
const LINES = [
  { key: 'outsideC', label: 'Outside', className: 'stroke-slate-400', width: 1.5, dash: '4 3' },
  { key: 'shelterC', label: 'Shelter', className: 'stroke-ice-400', width: 2, dash: undefined },
  { key: 'engineC', label: 'Engine', className: 'stroke-slate-500', width: 1.75, dash: undefined },
  { key: 'oilC', label: 'Oil', className: 'stroke-ice-800 dark:stroke-ice-200', width: 3, dash: undefined },
] as const;

/** Round step for about `count` intervals over `span`: 1, 2 or 5 × 10ⁿ. */
function tickStep(span: number, count: number): number {
  const rough = span / count;
  const mag = Math.pow(10, Math.floor(Math.log10(rough)));
  for (const m of [1, 2, 5]) if (m * mag >= rough) return m * mag;
  return 10 * mag;
}

/** Hours between time labels so that a label is at least ~80 viewBox units from the next. */
function hourStep(spanMs: number, plotWidth: number): number {
  const fit = (plotWidth / 80) | 0;
  for (const h of [1, 2, 3, 6, 12, 24]) if (spanMs / (h * HOUR) <= fit) return h;
  return 48;
}

/** The width the chart is given, in CSS pixels (640 until measured, e.g. on the server). */
function useWidth(): [RefObject<HTMLElement | null>, number] {
  const ref = useRef<HTMLElement>(null);
  const [width, setWidth] = useState(640);
  useEffect(() => {
    const el = ref.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    const ro = new ResizeObserver(([e]) => setWidth(Math.max(260, Math.round(e.contentRect.width))));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  return [ref, width];
}


export function SoakChart({ series, readyC, floorC, heaterBands = [], departAt, holdUntil, timeZone, units, height = 300 }: SoakChartProps) {
  const id = useId();
  const [wrap, W] = useWidth();
  const geo = useMemo(() => {
    const t = series.map((p) => Date.parse(p.at));
    if (t.length < 2) return null;
    const t0 = t[0];
    const t1 = t[t.length - 1];
    const hasEngine = series.some((p) => p.engineC !== null);
    const values: number[] = [];
    for (const p of series) {
      values.push(p.outsideC, p.shelterC, p.oilC);
      if (p.engineC !== null) values.push(p.engineC);
    }
    if (readyC !== undefined) values.push(readyC);
    if (floorC !== undefined) values.push(floorC);
    const shown = values.map((v) => toDisplayTemp(v, units));
    let lo = Math.min(...shown);
    let hi = Math.max(...shown);
    if (hi - lo < 4) [lo, hi] = [lo - 2, hi + 2];
    const step = tickStep(hi - lo, height < 240 ? 4 : 6);
    lo = Math.floor(lo / step) * step;
    hi = Math.ceil(hi / step) * step;
    const plotW = W - PAD.left - PAD.right;
    const plotH = height - PAD.top - PAD.bottom;
    const x = (ms: number) => PAD.left + ((ms - t0) / (t1 - t0)) * plotW;
    const y = (c: number) => PAD.top + ((hi - toDisplayTemp(c, units)) / (hi - lo)) * plotH;
    const yTicks: number[] = [];
    for (let v = lo; v <= hi + step / 2; v += step) yTicks.push(Math.round(v * 100) / 100);
    const every = hourStep(t1 - t0, plotW);
    const xTicks: { ms: number; midnight: boolean }[] = [];
    for (let ms = Math.ceil(t0 / (HOUR / 4)) * (HOUR / 4); ms <= t1; ms += HOUR / 4) {
      const h = localHourOf(timeZone, ms);
      if (Math.abs(h - Math.round(h)) > 1e-6) continue; // local whole hours only (zones off the hour too)
      const hh = Math.round(h) % 24;
      if (hh % every === 0) xTicks.push({ ms, midnight: hh === 0 });
    }
    const path = (key: (typeof LINES)[number]['key']) => {
      let d = '';
      let pen = false;
      series.forEach((p, i) => {
        const v = p[key];
        if (v === null) {
          pen = false;
          return;
        }
        d += `${pen ? 'L' : 'M'}${x(t[i]).toFixed(1)} ${y(v).toFixed(1)}`;
        pen = true;
      });
      return d;
    };
    const lines = LINES.filter((l) => l.key !== 'engineC' || hasEngine).map((l) => ({ ...l, d: path(l.key) }));
    const bands = heaterBands
      .map((b) => ({ a: Math.max(t0, Date.parse(b.from)), z: Math.min(t1, Date.parse(b.to)), from: b.from, to: b.to }))
      .filter((b) => b.z > b.a);
    let iMin = 0;
    series.forEach((p, i) => (p.oilC < series[iMin].oilC ? (iMin = i) : null));
    return { t, t0, t1, lo, hi, x, y, yTicks, xTicks, lines, bands, iMin, plotW, plotH };
  }, [series, readyC, floorC, heaterBands, timeZone, units, height, W]);

  if (!geo) {
    return <p className="text-sm text-slate-600 dark:text-slate-300">No Soak forecast to show.</p>;
  }

  const last = series[series.length - 1];
  const desc =
    `From ${formatDayTime(geo.t0, timeZone)} to ${formatDayTime(geo.t1, timeZone)}: oil ${formatTemp(series[0].oilC, units)} at the start, ` +
    `lowest ${formatTemp(series[geo.iMin].oilC, units)} at ${formatDayTime(geo.t[geo.iMin], timeZone)}, ${formatTemp(last.oilC, units)} at the end` +
    (readyC !== undefined ? `; ready temperature ${formatTemp(readyC, units)}` : '') +
    (geo.bands.length ? `; heater on ${geo.bands.map((b) => `${formatTime(b.a, timeZone)}–${formatTime(b.z, timeZone)}`).join(', ')}` : '') +
    (departAt ? `; departure ${formatTime(Date.parse(departAt), timeZone)}` : '') +
    (departAt && holdUntil && Date.parse(holdUntil) > Date.parse(departAt) ? `; start window to ${formatTime(Date.parse(holdUntil), timeZone)}, heater on until just before start` : '') +
    '.';
  const depMs = departAt ? Date.parse(departAt) : NaN;
  const holdMs = holdUntil ? Date.parse(holdUntil) : NaN;
  const showDep = Number.isFinite(depMs) && depMs >= geo.t0 && depMs <= geo.t1;
  const showHold = showDep && Number.isFinite(holdMs) && holdMs > depMs;
  const bottom = PAD.top + geo.plotH;
  const hLine = (c: number, className: string, dash: string, label: string) => (
    <g>
      <line x1={PAD.left} x2={W - PAD.right} y1={geo.y(c)} y2={geo.y(c)} className={className} strokeWidth={1.5} strokeDasharray={dash} />
      <text x={PAD.left + 4} y={geo.y(c) - 4} className="fill-slate-700 text-[11px] font-medium dark:fill-slate-200">
        {label} {formatTemp(c, units).replace('-', '\u2212')}
      </text>
    </g>
  );

  return (
    <figure className="m-0" ref={wrap}>
      <svg viewBox={`0 0 ${W} ${height}`} className="block h-auto w-full" role="img" aria-labelledby={`${id}-t ${id}-d`}>
        <title id={`${id}-t`}>Soak forecast</title>
        <desc id={`${id}-d`}>{desc}</desc>
        {geo.bands.map((b) => (
          <g key={`${b.from}-${b.to}`}>
            <rect x={geo.x(b.a)} y={PAD.top} width={geo.x(b.z) - geo.x(b.a)} height={geo.plotH} className="fill-ember-500/15" />
            <rect x={geo.x(b.a)} y={bottom - 4} width={geo.x(b.z) - geo.x(b.a)} height={4} className="fill-ember-500" />
          </g>
        ))}
        {geo.yTicks.map((v) => {
          const yy = PAD.top + ((geo.hi - v) / (geo.hi - geo.lo)) * geo.plotH;
          return (
            <g key={v}>
              <line x1={PAD.left} x2={W - PAD.right} y1={yy} y2={yy} className="stroke-slate-200 dark:stroke-slate-700" strokeWidth={1} />
              <text x={PAD.left - 6} y={yy} dy="0.32em" textAnchor="end" className="fill-slate-500 text-[11px] tabular-nums dark:fill-slate-400">
                {`${String(v).replace('-', '\u2212')}°`}
              </text>
            </g>
          );
        })}
        <text x={4} y={bottom + 17} className="fill-slate-500 text-[11px] dark:fill-slate-400">
          {tempLabel(units)}
        </text>
        {geo.xTicks.map(({ ms, midnight }) => (
          <g key={ms}>
            <line x1={geo.x(ms)} x2={geo.x(ms)} y1={midnight ? PAD.top : bottom} y2={bottom + 4} className="stroke-slate-300 dark:stroke-slate-600" strokeDasharray={midnight ? '2 3' : undefined} />
            <text x={geo.x(ms)} y={bottom + 17} textAnchor="middle" className={midnight ? 'fill-slate-800 text-[11px] font-semibold dark:fill-slate-100' : 'fill-slate-500 text-[11px] dark:fill-slate-400'}>
              {midnight ? formatDay(ms, timeZone).split(' ').slice(0, 2).join(' ') : formatTime(ms, timeZone)}
            </text>
          </g>
        ))}
        {floorC !== undefined ? hLine(floorC, 'stroke-ice-500', '2 3', 'Floor') : null}
        {readyC !== undefined ? hLine(readyC, 'stroke-slate-800 dark:stroke-slate-100', '6 4', 'Ready') : null}
        {geo.lines.map((l) => (
          <path key={l.key} d={l.d} fill="none" className={l.className} strokeWidth={l.width} strokeDasharray={l.dash} strokeLinejoin="round" strokeLinecap="round" />
        ))}
        {showHold ? (
          <g data-testid="start-window">
            <rect x={geo.x(depMs)} y={PAD.top} width={geo.x(Math.min(holdMs, geo.t1)) - geo.x(depMs)} height={10} className="fill-ember-700/70" />
            <text x={geo.x(depMs) + 3} y={PAD.top + 8} className="fill-white text-[9px] font-semibold">Start window</text>
          </g>
        ) : null}
        {showDep ? (
          <g>
            <line x1={geo.x(depMs)} x2={geo.x(depMs)} y1={PAD.top} y2={bottom} className="stroke-slate-800 dark:stroke-slate-100" strokeWidth={1.5} />
            <text x={geo.x(depMs) - 3} y={bottom - 8} textAnchor="end" className="fill-slate-800 text-[11px] font-medium dark:fill-slate-100">Departure</text>
          </g>
        ) : null}
        <rect x={PAD.left} y={PAD.top} width={geo.plotW} height={geo.plotH} fill="none" className="stroke-slate-300 dark:stroke-slate-700" />
      </svg>
      <figcaption>
        <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-slate-700 dark:text-slate-300" aria-label="Legend">
          {geo.lines.map((l) => (
            <li key={l.key} className="flex items-center gap-1.5">
              <svg width="22" height="8" aria-hidden="true">
                <line x1="1" y1="4" x2="21" y2="4" className={l.className} strokeWidth={l.width} strokeDasharray={l.dash} strokeLinecap="round" />
              </svg>
              {l.label}
            </li>
          ))}
          {readyC !== undefined ? (
            <li className="flex items-center gap-1.5">
              <svg width="22" height="8" aria-hidden="true">
                <line x1="1" y1="4" x2="21" y2="4" className="stroke-slate-800 dark:stroke-slate-100" strokeWidth={1.5} strokeDasharray="6 4" />
              </svg>
              Ready temperature
            </li>
          ) : null}
          {geo.bands.length ? (
            <li className="flex items-center gap-1.5">
              <span className="inline-block h-3 w-4 rounded-sm bg-ember-500/30 ring-1 ring-ember-500" aria-hidden="true" />
              Heater on
            </li>
          ) : null}
          {showHold ? (
            <li className="flex items-center gap-1.5">
              <span className="inline-block h-2 w-4 rounded-sm bg-ember-700/70" aria-hidden="true" />
              Start window: heater on until just before start; unplug before start
            </li>
          ) : null}
        </ul>
      </figcaption>
    </figure>
  );
}

export default SoakChart;
