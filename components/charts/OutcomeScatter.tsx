'use client';
// Predicted against recorded oil at start: one dot per flown morning (filled: ready at start; hollow:
// below the ready temperature), the 1:1 line where a perfect prediction sits, and a light band of
// ±2 K around it. Points above the line: the oil was warmer than predicted.
import { useId, useMemo } from 'react';
import { tempLabel, toDisplayDelta, toDisplayTemp, type TempUnit } from '@/lib/units';
import { AXIS_TEXT, GRID, linearScale, num, useBoxWidth } from './chartKit';

export interface ScatterPoint {
  predictedC: number;
  recordedC: number;
  ready: boolean;
}

const PAD = { left: 40, right: 12, top: 22, bottom: 38 };
const BAND_K = 2;

export function OutcomeScatter({ points, unit, title = 'Predicted against recorded oil at start' }: { points: ScatterPoint[]; unit: TempUnit; title?: string }) {
  const id = useId();
  const [box, W] = useBoxWidth(560);
  const H = Math.round(Math.min(420, Math.max(260, W * 0.72)));
  const g = useMemo(() => {
    if (points.length < 2) return null;
    const t = (c: number) => toDisplayTemp(c, unit);
    const all = points.flatMap((p) => [t(p.predictedC), t(p.recordedC)]);
    const plotW = W - PAD.left - PAD.right;
    const plotH = H - PAD.top - PAD.bottom;
    const count = Math.max(4, Math.floor(Math.min(plotW, plotH) / 60));
    // One scale for both axes, so the 1:1 line is the diagonal.
    const base = linearScale(all, 0, 1, { count, minSpan: 10 });
    const x = linearScale([base.lo, base.hi], PAD.left, PAD.left + plotW, { count });
    const y = linearScale([base.lo, base.hi], H - PAD.bottom, PAD.top, { count });
    return { x, y, t, plotW, plotH };
  }, [points, unit, W, H]);
  if (!g) return <p className="text-sm text-slate-600 dark:text-slate-300">Two flown mornings with a prediction are needed for this chart.</p>;
  const bottom = H - PAD.bottom;
  const lo = Math.max(g.x.lo, g.y.lo);
  const hi = Math.min(g.x.hi, g.y.hi);
  const band = toDisplayDelta(BAND_K, unit);
  const above = points.filter((p) => p.recordedC > p.predictedC).length;
  const ready = points.filter((p) => p.ready).length;
  const desc = `${points.length} flown mornings; ${above} warmer than predicted, ${points.length - above} colder or equal; ${ready} ready at start.`;
  const bandPath = `M${g.x(lo)} ${g.y(lo + band)} L${g.x(hi - band)} ${g.y(hi)} L${g.x(hi)} ${g.y(hi)} L${g.x(hi)} ${g.y(hi - band)} L${g.x(lo + band)} ${g.y(lo)} L${g.x(lo)} ${g.y(lo)} Z`;
  return (
    <figure className="m-0">
      <div ref={box}>
        <svg viewBox={`0 0 ${W} ${H}`} className="block h-auto w-full" role="img" aria-labelledby={`${id}-t ${id}-d`}>
          <title id={`${id}-t`}>{title}</title>
          <desc id={`${id}-d`}>{desc}</desc>
          <defs>
            <clipPath id={`${id}-clip`}>
              <rect x={PAD.left} y={PAD.top} width={g.plotW} height={g.plotH} />
            </clipPath>
          </defs>
          {g.y.ticks.map((v) => (
            <g key={`y${v}`}>
              <line x1={PAD.left} x2={W - PAD.right} y1={g.y(v)} y2={g.y(v)} className={GRID} />
              <text x={PAD.left - 6} y={g.y(v)} dy="0.32em" textAnchor="end" className={AXIS_TEXT}>
                {num(v)}°
              </text>
            </g>
          ))}
          {g.x.ticks.map((v) => (
            <g key={`x${v}`}>
              <line x1={g.x(v)} x2={g.x(v)} y1={PAD.top} y2={bottom} className={GRID} />
              <text x={g.x(v)} y={bottom + 15} textAnchor="middle" className={AXIS_TEXT}>
                {num(v)}°
              </text>
            </g>
          ))}
          <g clipPath={`url(#${id}-clip)`}>
            <path d={bandPath} className="fill-ice-50 dark:fill-ice-950" />
            <line x1={g.x(lo)} y1={g.y(lo)} x2={g.x(hi)} y2={g.y(hi)} className="stroke-slate-500 dark:stroke-slate-400" strokeDasharray="5 4" strokeWidth={1.25} />
            {points.map((p, i) =>
              p.ready ? (
                <circle key={i} cx={g.x(g.t(p.predictedC))} cy={g.y(g.t(p.recordedC))} r={4} className="fill-ice-600 stroke-ice-800 dark:fill-ice-300 dark:stroke-ice-100" strokeWidth={1} fillOpacity={0.8} />
              ) : (
                <circle key={i} cx={g.x(g.t(p.predictedC))} cy={g.y(g.t(p.recordedC))} r={4} className="fill-white stroke-ember-600 dark:fill-slate-900 dark:stroke-ember-400" strokeWidth={1.75} />
              ),
            )}
          </g>
          <text x={W - PAD.right} y={bottom + 31} textAnchor="end" className={AXIS_TEXT}>
            predicted {tempLabel(unit)}
          </text>
          <text x={PAD.left - 6} y={PAD.top - 9} textAnchor="start" className={AXIS_TEXT}>
            recorded at start {tempLabel(unit)}
          </text>
          <rect x={PAD.left} y={PAD.top} width={g.plotW} height={g.plotH} fill="none" className="stroke-slate-300 dark:stroke-slate-700" />
        </svg>
      </div>
      <figcaption>
        <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-slate-700 dark:text-slate-300" aria-label="Legend">
          <li className="flex items-center gap-1.5">
            <svg width="10" height="10" aria-hidden="true">
              <circle cx="5" cy="5" r="4" className="fill-ice-600 stroke-ice-800 dark:fill-ice-300" />
            </svg>
            Ready at start
          </li>
          <li className="flex items-center gap-1.5">
            <svg width="10" height="10" aria-hidden="true">
              <circle cx="5" cy="5" r="3.5" className="fill-white stroke-ember-600 dark:fill-slate-900 dark:stroke-ember-400" strokeWidth={1.5} />
            </svg>
            Below the ready temperature
          </li>
          <li className="flex items-center gap-1.5">
            <svg width="20" height="10" aria-hidden="true">
              <line x1="0" y1="5" x2="20" y2="5" className="stroke-slate-500" strokeDasharray="5 4" strokeWidth={1.25} />
            </svg>
            As predicted (1:1)
          </li>
          <li className="flex items-center gap-1.5">
            <span className="inline-block h-3 w-5 rounded-sm bg-ice-50 ring-1 ring-ice-200 dark:bg-ice-950" aria-hidden="true" />
            Within ±{num(band)} {unit === 'F' ? '°F' : 'K'}
          </li>
        </ul>
        <p className="sr-only">{desc}</p>
      </figcaption>
    </figure>
  );
}
