'use client';
// A temperature-over-time line chart in plain SVG: local-time axis in the airfield's zone, night and
// twilight bands, a "now" line, the freezing line, a crosshair read-out by pointer or keyboard, and
// the same numbers as a table for screen readers and small screens.
import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { formatDay, formatDayTime, formatTime, localHourOf } from '@/lib/time';
import { formatTemp, toUnit, type TempUnit } from '@/components/airfields/format';

export interface ChartSeries {
  id: string;
  label: string;
  /** °C, one per time. */
  values: number[];
  color: string;
  width?: number;
  dash?: string;
}

export interface ChartBand {
  fromMs: number;
  toMs: number;
  kind: 'night' | 'twilight';
}

interface Props {
  atMs: number[];
  series: ChartSeries[];
  bands?: ChartBand[];
  nowMs?: number;
  timeZone: string;
  unit: TempUnit;
  /** Accessible name of the chart. */
  label: string;
  height?: number;
  /** Table rows every N points (default 6 = every 3 h at 30-min steps). */
  tableEvery?: number;
}

const HOUR = 3_600_000;
const M = { left: 46, right: 14, top: 14, bottom: 40 };

function niceStep(span: number, target: number): number {
  const raw = span / Math.max(1, target);
  const p = 10 ** Math.floor(Math.log10(raw));
  const f = raw / p;
  return (f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10) * p;
}

export function TemperatureChart({ atMs, series, bands = [], nowMs, timeZone, unit, label, height = 280, tableEvery = 6 }: Props) {
  const wrap = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(720);
  const [cursor, setCursor] = useState<number | null>(null);
  const id = useId();

  useEffect(() => {
    const el = wrap.current;
    if (!el) return;
    const ro = new ResizeObserver(([e]) => setWidth(Math.max(280, Math.round(e.contentRect.width))));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  const geo = useMemo(() => {
    const t0 = atMs[0];
    const t1 = atMs[atMs.length - 1];
    const all = series.flatMap((s) => s.values.map((v) => toUnit(v, unit)));
    let lo = Math.min(...all);
    let hi = Math.max(...all);
    if (!Number.isFinite(lo) || !Number.isFinite(hi)) {
      lo = 0;
      hi = 1;
    }
    const pad = Math.max(1, (hi - lo) * 0.08);
    lo -= pad;
    hi += pad;
    const step = niceStep(hi - lo, height < 240 ? 4 : 6);
    lo = Math.floor(lo / step) * step;
    hi = Math.ceil(hi / step) * step;
    const iw = width - M.left - M.right;
    const ih = height - M.top - M.bottom;
    const x = (t: number) => M.left + ((t - t0) / Math.max(1, t1 - t0)) * iw;
    const y = (v: number) => M.top + (1 - (v - lo) / (hi - lo)) * ih;
    const yTicks: number[] = [];
    for (let v = lo; v <= hi + step / 2; v += step) yTicks.push(Math.round(v * 1000) / 1000);
    const every = iw < 420 ? 12 : 6;
    const xTicks: { t: number; midnight: boolean }[] = [];
    for (let t = Math.ceil(t0 / HOUR) * HOUR; t <= t1; t += HOUR) {
      const h = Math.round(localHourOf(timeZone, t));
      if (h % every === 0) xTicks.push({ t, midnight: h % 24 === 0 });
    }
    return { t0, t1, lo, hi, x, y, yTicks, xTicks, iw, ih };
  }, [atMs, series, unit, width, height, timeZone]);

  const paths = series.map((s) => ({
    ...s,
    d: s.values.map((v, i) => `${i ? 'L' : 'M'}${geo.x(atMs[i]).toFixed(1)},${geo.y(toUnit(v, unit)).toFixed(1)}`).join(''),
  }));

  const pick = (clientX: number) => {
    const el = wrap.current;
    if (!el) return;
    const px = clientX - el.getBoundingClientRect().left;
    const t = geo.t0 + ((px - M.left) / geo.iw) * (geo.t1 - geo.t0);
    let best = 0;
    for (let i = 1; i < atMs.length; i++) if (Math.abs(atMs[i] - t) < Math.abs(atMs[best] - t)) best = i;
    setCursor(best);
  };

  const onKey = (e: React.KeyboardEvent) => {
    const n = atMs.length;
    const step = e.shiftKey ? 12 : 1;
    if (e.key === 'ArrowRight') setCursor((c) => Math.min(n - 1, (c ?? -1) + step));
    else if (e.key === 'ArrowLeft') setCursor((c) => Math.max(0, (c ?? n) - step));
    else if (e.key === 'Home') setCursor(0);
    else if (e.key === 'End') setCursor(n - 1);
    else if (e.key === 'Escape') setCursor(null);
    else return;
    e.preventDefault();
  };

  const freezing = toUnit(0, unit);
  const showFreezing = freezing > geo.lo && freezing < geo.hi;
  const cx = cursor === null ? null : geo.x(atMs[cursor]);
  const summary = useMemo(() => {
    const first = series[0];
    if (!first || first.values.length === 0) return label;
    let i = 0;
    first.values.forEach((v, k) => (v < first.values[i] ? (i = k) : null));
    return `${label}. ${first.label} lowest ${formatTemp(first.values[i], unit)} at ${formatDayTime(atMs[i], timeZone)}.`;
  }, [series, label, unit, atMs, timeZone]);

  return (
    <figure className="m-0 text-slate-800 dark:text-slate-100">
      <ul className="mb-3 flex flex-wrap gap-x-4 gap-y-1.5 text-xs text-slate-700 dark:text-slate-300" aria-label="Legend">
        {series.map((s) => (
          <li key={s.id} className="flex items-center gap-1.5">
            <svg width="22" height="8" aria-hidden="true">
              <line x1="1" y1="4" x2="21" y2="4" stroke={s.color} strokeWidth={s.width ?? 2} strokeDasharray={s.dash} strokeLinecap="round" />
            </svg>
            {s.label}
          </li>
        ))}
        <li className="flex items-center gap-1.5">
          <span className="inline-block h-3 w-4 rounded-sm bg-slate-200 dark:bg-slate-700" aria-hidden="true" />
          Night
        </li>
        <li className="flex items-center gap-1.5">
          <span className="inline-block h-3 w-4 rounded-sm bg-slate-100 ring-1 ring-inset ring-slate-200 dark:bg-slate-800/50 dark:ring-slate-700" aria-hidden="true" />
          Twilight
        </li>
      </ul>
      <div
        ref={wrap}
        className="relative touch-pan-y select-none rounded-lg outline-offset-4"
        tabIndex={0}
        role="group"
        aria-label={`${label}: use the arrow keys to read values`}
        aria-describedby={`${id}-readout`}
        onPointerMove={(e) => pick(e.clientX)}
        onPointerDown={(e) => pick(e.clientX)}
        onPointerLeave={(e) => (e.pointerType === 'mouse' ? setCursor(null) : null)}
        onKeyDown={onKey}
        onBlur={() => setCursor(null)}
      >
        <svg width={width} height={height} role="img" aria-label={summary} className="block max-w-full overflow-visible">
          {bands.map((b, i) => {
            const a = Math.max(geo.t0, b.fromMs);
            const z = Math.min(geo.t1, b.toMs);
            if (z <= a) return null;
            return (
              <rect
                key={i}
                x={geo.x(a)}
                y={M.top}
                width={geo.x(z) - geo.x(a)}
                height={geo.ih}
                className={b.kind === 'night' ? 'fill-slate-200/80 dark:fill-slate-800' : 'fill-slate-100 dark:fill-slate-800/50'}
              />
            );
          })}
          {geo.yTicks.map((v) => (
            <g key={v}>
              <line x1={M.left} x2={width - M.right} y1={geo.y(v)} y2={geo.y(v)} className="stroke-slate-200 dark:stroke-slate-700" strokeWidth={1} />
              <text x={M.left - 8} y={geo.y(v)} dy="0.32em" textAnchor="end" className="fill-slate-500 text-[11px] dark:fill-slate-400">
                {`${String(v).replace('-', '\u2212')}°`}
              </text>
            </g>
          ))}
          {showFreezing ? (
            <g>
              <line x1={M.left} x2={width - M.right} y1={geo.y(freezing)} y2={geo.y(freezing)} className="stroke-ice-500" strokeWidth={1.2} strokeDasharray="5 4" />
              <text x={width - M.right} y={geo.y(freezing) - 4} textAnchor="end" className="fill-ice-700 text-[10px] font-medium dark:fill-ice-300">
                freezing
              </text>
            </g>
          ) : null}
          {geo.xTicks.map(({ t, midnight }) => (
            <g key={t}>
              <line x1={geo.x(t)} x2={geo.x(t)} y1={M.top + geo.ih} y2={M.top + geo.ih + 5} className="stroke-slate-400" />
              {midnight ? <line x1={geo.x(t)} x2={geo.x(t)} y1={M.top} y2={M.top + geo.ih} className="stroke-slate-300 dark:stroke-slate-600" strokeDasharray="2 3" /> : null}
              <text
                x={geo.x(t)}
                y={M.top + geo.ih + 18}
                textAnchor="middle"
                className={midnight ? 'fill-slate-800 text-[11px] font-semibold dark:fill-slate-200' : 'fill-slate-500 text-[11px] dark:fill-slate-400'}
              >
                {midnight ? formatDay(t, timeZone).split(' ').slice(0, 2).join(' ') : formatTime(t, timeZone)}
              </text>
            </g>
          ))}
          {nowMs !== undefined && nowMs >= geo.t0 && nowMs <= geo.t1 ? (
            <g>
              <line x1={geo.x(nowMs)} x2={geo.x(nowMs)} y1={M.top} y2={M.top + geo.ih} className="stroke-ember-500" strokeWidth={1.5} />
              <text x={geo.x(nowMs) + 4} y={M.top + 10} className="fill-ember-700 text-[10px] font-semibold dark:fill-ember-300">
                now
              </text>
            </g>
          ) : null}
          {paths.map((p) => (
            <path key={p.id} d={p.d} fill="none" stroke={p.color} strokeWidth={p.width ?? 2} strokeDasharray={p.dash} strokeLinejoin="round" strokeLinecap="round" />
          ))}
          {cx !== null && cursor !== null ? (
            <g aria-hidden="true">
              <line x1={cx} x2={cx} y1={M.top} y2={M.top + geo.ih} className="stroke-slate-500" strokeWidth={1} />
              {series.map((s) => (
                <circle key={s.id} cx={cx} cy={geo.y(toUnit(s.values[cursor], unit))} r={4} fill="white" stroke={s.color} strokeWidth={2} />
              ))}
            </g>
          ) : null}
          <rect x={M.left} y={M.top} width={geo.iw} height={geo.ih} fill="none" className="stroke-slate-300 dark:stroke-slate-700" />
        </svg>
        {cx !== null && cursor !== null ? (
          <div
            className="pointer-events-none absolute top-3 z-10 min-w-40 rounded-lg border border-slate-200 bg-white/95 px-3 py-2 text-xs shadow-lg dark:border-slate-700 dark:bg-slate-900/95"
            style={cx > width / 2 ? { right: width - cx + 10 } : { left: cx + 10 }}
          >
            <p className="mb-1 font-semibold text-slate-900 dark:text-white">{formatDayTime(atMs[cursor], timeZone)}</p>
            {series.map((s) => (
              <p key={s.id} className="flex items-center justify-between gap-3 tabular-nums">
                <span className="flex items-center gap-1.5 text-slate-600 dark:text-slate-300">
                  <span className="inline-block h-2 w-2 rounded-full" style={{ background: s.color }} />
                  {s.label}
                </span>
                <span className="font-medium text-slate-900 dark:text-white">{formatTemp(s.values[cursor], unit)}</span>
              </p>
            ))}
          </div>
        ) : null}
        <p id={`${id}-readout`} className="sr-only" aria-live="polite">
          {cursor === null ? '' : `${formatDayTime(atMs[cursor], timeZone)}: ${series.map((s) => `${s.label} ${formatTemp(s.values[cursor], unit)}`).join(', ')}`}
        </p>
      </div>
      <details className="mt-3 text-sm">
        <summary className="cursor-pointer select-none text-ice-700 hover:underline dark:text-ice-300">Show the values as a table</summary>
        <div className="relative mt-2 max-h-72 overflow-auto rounded-lg border border-slate-200 dark:border-slate-800">
          <table className="w-full text-left text-xs tabular-nums">
            <caption className="sr-only">{label}</caption>
            <thead className="sticky top-0 bg-slate-50 dark:bg-slate-800">
              <tr>
                <th scope="col" className="px-3 py-2">Local time</th>
                {series.map((s) => (
                  <th key={s.id} scope="col" className="px-3 py-2">{s.label}</th>
                ))}
              </tr>
            </thead>
            <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
              {atMs.map((t, i) =>
                i % tableEvery === 0 ? (
                  <tr key={t}>
                    <th scope="row" className="px-3 py-1.5 font-normal">{formatDayTime(t, timeZone)}</th>
                    {series.map((s) => (
                      <td key={s.id} className="px-3 py-1.5">{formatTemp(s.values[i], unit)}</td>
                    ))}
                  </tr>
                ) : null,
              )}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
