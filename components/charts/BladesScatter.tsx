'use client';
// Blade turns until the oil returned, against the outside temperature, shaded by the oil's age (engine
// hours since the last change). The usual 2–10 turns of a healthy dry-sump installation (common practice)
// sit in a light band.
import { useId, useMemo } from 'react';
import { tempLabel, toDisplayTemp, type TempUnit } from '@/lib/units';
import { AXIS_TEXT, GRID, linearScale, num, useBoxWidth } from './chartKit';

export interface BladesPoint {
  outsideTempC: number;
  bladesTurned: number;
  oilAgeHours: number | null;
}

interface Props {
  points: BladesPoint[];
  unit: TempUnit;
}

const PAD = { left: 36, right: 12, top: 24, bottom: 36 };
const H = 230;
const AGE = [
  { max: 20, label: 'Oil under 20 h', cls: 'fill-ice-300 stroke-ice-500' },
  { max: 50, label: '20–50 h', cls: 'fill-ice-500 stroke-ice-700' },
  { max: Infinity, label: 'Over 50 h', cls: 'fill-ice-900 stroke-ice-950 dark:fill-ice-100 dark:stroke-ice-50' },
];
const ageClass = (h: number | null) => (h === null ? 'fill-slate-300 stroke-slate-500' : AGE.find((a) => h < a.max)!.cls);

export function BladesScatter({ points, unit }: Props) {
  const id = useId();
  const [box, W] = useBoxWidth();
  const g = useMemo(() => {
    if (points.length < 2) return null;
    const plotW = W - PAD.left - PAD.right;
    const xs = points.map((p) => toDisplayTemp(p.outsideTempC, unit));
    const x = linearScale(xs, PAD.left, PAD.left + plotW, { count: Math.max(3, Math.floor(plotW / 70)), minSpan: 5 });
    const y = linearScale(points.map((p) => p.bladesTurned), H - PAD.bottom, PAD.top, { count: 4, include: [0, 10] });
    return { x, y, xs, plotW };
  }, [points, unit, W]);
  if (!g) return <p className="text-sm text-slate-600 dark:text-slate-300">Two checks with blade turns are needed for this chart.</p>;
  const bottom = H - PAD.bottom;
  const cold = points.filter((p) => p.outsideTempC < -10).map((p) => p.bladesTurned);
  const mild = points.filter((p) => p.outsideTempC >= 0).map((p) => p.bladesTurned);
  const median = (a: number[]) => (a.length ? [...a].sort((p, q) => p - q)[Math.floor(a.length / 2)] : null);
  const mc = median(cold);
  const mm = median(mild);
  const desc =
    `${points.length} checks: blade turns from ${Math.min(...points.map((p) => p.bladesTurned))} to ${Math.max(...points.map((p) => p.bladesTurned))}` +
    (mc !== null ? `; typically ${mc} below ${num(toDisplayTemp(-10, unit))} ${tempLabel(unit)}` : '') +
    (mm !== null ? `; typically ${mm} above freezing` : '') +
    '.';
  return (
    <figure className="m-0">
      <div ref={box}>
        <svg viewBox={`0 0 ${W} ${H}`} className="block h-auto w-full" role="img" aria-labelledby={`${id}-t ${id}-d`}>
          <title id={`${id}-t`}>Blade turns until the oil returned, against outside temperature</title>
          <desc id={`${id}-d`}>{desc}</desc>
          <rect x={PAD.left} y={g.y(Math.min(10, g.y.hi))} width={g.plotW} height={Math.max(0, g.y(2) - g.y(Math.min(10, g.y.hi)))} className="fill-ice-50 dark:fill-ice-950" />
          {g.y.ticks.map((t) => (
            <g key={`y${t}`}>
              <line x1={PAD.left} x2={W - PAD.right} y1={g.y(t)} y2={g.y(t)} className={GRID} />
              <text x={PAD.left - 6} y={g.y(t)} dy="0.32em" textAnchor="end" className={AXIS_TEXT}>
                {num(t)}
              </text>
            </g>
          ))}
          {g.x.ticks.map((t) => (
            <text key={`x${t}`} x={g.x(t)} y={bottom + 16} textAnchor="middle" className={AXIS_TEXT}>
              {num(t)}°
            </text>
          ))}
          <text x={W - PAD.right} y={bottom + 31} textAnchor="end" className={AXIS_TEXT}>
            outside {tempLabel(unit)}
          </text>
          <text x={PAD.left - 6} y={PAD.top - 9} textAnchor="end" className={AXIS_TEXT}>
            turns
          </text>
          {points.map((p, i) => (
            <circle key={i} cx={g.x(g.xs[i])} cy={g.y(p.bladesTurned)} r={4} className={ageClass(p.oilAgeHours)} strokeWidth={1} fillOpacity={0.85} />
          ))}
          <rect x={PAD.left} y={PAD.top} width={g.plotW} height={bottom - PAD.top} fill="none" className="stroke-slate-300 dark:stroke-slate-700" />
        </svg>
      </div>
      <figcaption>
        <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-slate-700 dark:text-slate-300" aria-label="Legend: oil age">
          {AGE.map((a) => (
            <li key={a.label} className="flex items-center gap-1.5">
              <svg width="10" height="10" aria-hidden="true">
                <circle cx="5" cy="5" r="4" className={a.cls} />
              </svg>
              {a.label}
            </li>
          ))}
          <li className="flex items-center gap-1.5">
            <span className="inline-block h-3 w-5 rounded-sm bg-ice-50 ring-1 ring-ice-200 dark:bg-ice-950" aria-hidden="true" />
            Usual 2–10 turns
          </li>
        </ul>
        <p className="sr-only">{desc}</p>
      </figcaption>
    </figure>
  );
}
