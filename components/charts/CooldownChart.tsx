'use client';
// A logged cool-down: the oil readings (dots, or a line for a whole log), the logged ambient, the fitted
// curves and, under them, the residuals of the chosen fit with its ±RMSE band. An optional shaded window
// marks the cool-down being fitted. Times are the airfield's local time; temperatures in the person's unit.
import { useId, useMemo } from 'react';
import { formatDayTime } from '@/lib/time';
import { tempLabel, toDisplayDelta, toDisplayTemp, type TempUnit } from '@/lib/units';
import { AXIS_TEXT, GRID, linePath, linearScale, num, timeTicks, useBoxWidth } from './chartKit';

export interface ModelCurve {
  id: string;
  label: string;
  /** °C at each time. */
  values: number[];
  /** The fit whose residuals are drawn below. */
  primary?: boolean;
}

export interface CooldownChartProps {
  tMs: number[];
  oilC: number[];
  ambientC: number[] | null;
  models?: ModelCurve[];
  window?: { startMs: number; endMs: number } | null;
  /** Dots for fitted points, a line for a whole log. */
  points?: 'dots' | 'line';
  unit: TempUnit;
  zone: string;
  /** The chart's accessible name. */
  label: string;
}

const PAD = { left: 44, right: 12, top: 22 };
const MAIN_H = 250;
const RES_H = 96;
const GAP = 24;
const AXIS_H = 30;

export function CooldownChart({ tMs, oilC, ambientC, models = [], window, points = 'dots', unit, zone, label }: CooldownChartProps) {
  const id = useId();
  const [box, W] = useBoxWidth();
  const primary = models.find((m) => m.primary) ?? models[0];
  const withRes = Boolean(primary);
  const H = PAD.top + MAIN_H + (withRes ? GAP + RES_H : 0) + AXIS_H;
  const g = useMemo(() => {
    if (tMs.length < 2) return null;
    const t0 = tMs[0];
    const t1 = tMs[tMs.length - 1];
    const plotW = W - PAD.left - PAD.right;
    const x = (ms: number) => PAD.left + ((ms - t0) / (t1 - t0)) * plotW;
    const shown = [...oilC, ...(ambientC ?? []), ...models.flatMap((m) => m.values)].map((c) => toDisplayTemp(c, unit));
    const y = linearScale(shown, PAD.top + MAIN_H, PAD.top, { count: 6, minSpan: 4 });
    const yC = (c: number) => y(toDisplayTemp(c, unit));
    const res = primary ? oilC.map((o, i) => toDisplayDelta(o - primary.values[i], unit)) : [];
    const rmse = res.length ? Math.sqrt(res.reduce((s, r) => s + r * r, 0) / res.length) : 0;
    const resTop = PAD.top + MAIN_H + GAP;
    const maxAbs = Math.max(...res.map(Math.abs), rmse * 2, 0.2);
    const ry = linearScale([-maxAbs, maxAbs], resTop + RES_H, resTop, { count: 2, minSpan: 0.4 });
    return {
      t0,
      t1,
      plotW,
      x,
      y,
      yC,
      res,
      rmse,
      ry,
      resTop,
      ticks: timeTicks(t0, t1, plotW, zone),
      oilPath: points === 'line' ? linePath(tMs, oilC, x, yC) : '',
      ambPath: ambientC ? linePath(tMs, ambientC, x, yC) : '',
      curves: models.map((m) => ({ ...m, d: linePath(tMs, m.values, x, yC), cls: m === primary ? 'stroke-ice-700 dark:stroke-ice-300' : 'stroke-slate-500 dark:stroke-slate-400' })),
    };
  }, [tMs, oilC, ambientC, models, primary, points, unit, zone, W]);

  if (!g) return <p className="text-sm text-slate-600 dark:text-slate-300">Not enough rows to draw.</p>;
  const bottom = H - AXIS_H;
  const u = tempLabel(unit);
  const desc =
    `${tMs.length} readings from ${formatDayTime(g.t0, zone)} to ${formatDayTime(g.t1, zone)}; oil from ${num(toDisplayTemp(oilC[0], unit), 1)} to ${num(toDisplayTemp(oilC[oilC.length - 1], unit), 1)} ${u}` +
    (window ? `; cool-down window ${formatDayTime(window.startMs, zone)} to ${formatDayTime(window.endMs, zone)}` : '') +
    (primary ? `; ${primary.label.toLowerCase()} fit, residuals within ±${num(g.rmse, 2)} ${unit === 'F' ? '°F' : 'K'} RMS` : '') +
    '.';

  return (
    <figure className="m-0" aria-labelledby={`${id}-cap`}>
      <div ref={box}>
        <svg viewBox={`0 0 ${W} ${H}`} className="block h-auto w-full" role="img" aria-labelledby={`${id}-t ${id}-d`}>
          <title id={`${id}-t`}>{label}</title>
          <desc id={`${id}-d`}>{desc}</desc>
          {window ? (
            <rect
              x={g.x(Math.max(window.startMs, g.t0))}
              y={PAD.top}
              width={Math.max(0, g.x(Math.min(window.endMs, g.t1)) - g.x(Math.max(window.startMs, g.t0)))}
              height={bottom - PAD.top}
              className="fill-ice-100/70 dark:fill-ice-900/40"
            />
          ) : null}
          {g.y.ticks.map((v) => (
            <g key={`y${v}`}>
              <line x1={PAD.left} x2={W - PAD.right} y1={g.y(v)} y2={g.y(v)} className={GRID} />
              <text x={PAD.left - 6} y={g.y(v)} dy="0.32em" textAnchor="end" className={AXIS_TEXT}>
                {num(v)}°
              </text>
            </g>
          ))}
          <text x={PAD.left - 6} y={PAD.top - 9} textAnchor="end" className={AXIS_TEXT}>
            {u}
          </text>
          {g.ticks.map((t) => (
            <g key={t.ms}>
              <line x1={g.x(t.ms)} x2={g.x(t.ms)} y1={t.midnight ? PAD.top : bottom} y2={bottom + 4} className="stroke-slate-300 dark:stroke-slate-600" strokeDasharray={t.midnight ? '2 3' : undefined} />
              <text x={g.x(t.ms)} y={bottom + 17} textAnchor="middle" className={t.midnight ? 'fill-slate-800 text-[11px] font-semibold dark:fill-slate-100' : AXIS_TEXT}>
                {t.label}
              </text>
            </g>
          ))}
          {g.ambPath ? <path d={g.ambPath} fill="none" className="stroke-slate-400" strokeWidth={1.5} strokeDasharray="4 3" /> : null}
          {points === 'line' ? (
            <path d={g.oilPath} fill="none" className="stroke-ice-800 dark:stroke-ice-200" strokeWidth={2} strokeLinejoin="round" />
          ) : (
            <g className="fill-slate-500/70 dark:fill-slate-400/70">
              {tMs.map((t, i) => (
                <circle key={t} cx={g.x(t)} cy={g.yC(oilC[i])} r={1.8} />
              ))}
            </g>
          )}
          {g.curves.map((c) => (
            <path key={c.id} d={c.d} fill="none" className={c.cls} strokeWidth={c.cls.includes('slate') ? 1.75 : 2.5} strokeDasharray={c.cls.includes('slate') ? '6 4' : undefined} strokeLinejoin="round" />
          ))}
          <rect x={PAD.left} y={PAD.top} width={g.plotW} height={MAIN_H} fill="none" className="stroke-slate-300 dark:stroke-slate-700" />
          {withRes ? (
            <g>
              <rect x={PAD.left} y={g.ry(g.rmse)} width={g.plotW} height={Math.max(0, g.ry(-g.rmse) - g.ry(g.rmse))} className="fill-ice-100 dark:fill-ice-950" />
              {g.ry.ticks.map((v) => (
                <g key={`r${v}`}>
                  <line x1={PAD.left} x2={W - PAD.right} y1={g.ry(v)} y2={g.ry(v)} className={v === 0 ? 'stroke-slate-500' : GRID} />
                  <text x={PAD.left - 6} y={g.ry(v)} dy="0.32em" textAnchor="end" className={AXIS_TEXT}>
                    {num(v, Math.abs(g.ry.hi) < 2 ? 1 : 0)}
                  </text>
                </g>
              ))}
              <text x={PAD.left + 4} y={g.resTop - 5} className="fill-slate-600 text-[11px] font-medium dark:fill-slate-300">
                Residuals of the {primary!.label.toLowerCase()} fit ({unit === 'F' ? '°F' : 'K'}); band ±RMSE
              </text>
              <g className="fill-ice-800 dark:fill-ice-200">
                {tMs.map((t, i) => (
                  <circle key={t} cx={g.x(t)} cy={g.ry(g.res[i])} r={1.6} />
                ))}
              </g>
              <rect x={PAD.left} y={g.resTop} width={g.plotW} height={RES_H} fill="none" className="stroke-slate-300 dark:stroke-slate-700" />
            </g>
          ) : null}
        </svg>
      </div>
      <figcaption id={`${id}-cap`}>
        <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-slate-700 dark:text-slate-300" aria-label="Legend">
          <li className="flex items-center gap-1.5">
            <svg width="22" height="8" aria-hidden="true">
              {points === 'line' ? <line x1="1" y1="4" x2="21" y2="4" className="stroke-ice-800 dark:stroke-ice-200" strokeWidth={2} /> : <circle cx="11" cy="4" r="2.5" className="fill-slate-500" />}
            </svg>
            Oil (logged)
          </li>
          {ambientC ? (
            <li className="flex items-center gap-1.5">
              <svg width="22" height="8" aria-hidden="true">
                <line x1="1" y1="4" x2="21" y2="4" className="stroke-slate-400" strokeWidth={1.5} strokeDasharray="4 3" />
              </svg>
              Ambient (logged)
            </li>
          ) : null}
          {g.curves.map((c) => (
            <li key={c.id} className="flex items-center gap-1.5">
              <svg width="22" height="8" aria-hidden="true">
                <line x1="1" y1="4" x2="21" y2="4" className={c.cls} strokeWidth={2.5} strokeDasharray={c.cls.includes('slate') ? '6 4' : undefined} />
              </svg>
              {c.label} fit
            </li>
          ))}
          {window ? (
            <li className="flex items-center gap-1.5">
              <span className="inline-block h-3 w-5 rounded-sm bg-ice-100 ring-1 ring-ice-200 dark:bg-ice-900/60" aria-hidden="true" />
              Cool-down window
            </li>
          ) : null}
        </ul>
        <p className="sr-only">{desc}</p>
      </figcaption>
    </figure>
  );
}
