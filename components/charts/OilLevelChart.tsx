'use client';
// The dipstick level over engine hours: each reading corrected to 15 °C (filled, joined between oil
// changes) beside the level as read (hollow), oil changes as dashed verticals, top-ups as small ticks.
// Checks without engine hours are left out (they say so below the chart).
import { useId, useMemo } from 'react';
import { toDisplayVolume, volumeLabel, type VolumeUnit } from '@/lib/units';
import { AXIS_TEXT, GRID, linearScale, num, useBoxWidth } from './chartKit';

export interface LevelPoint {
  engineHours: number | null;
  levelL: number;
  correctedL: number;
  addedL: number;
  oilTempC: number;
}

interface Props {
  checks: LevelPoint[];
  changes: { engineHours: number }[];
  fullL: number;
  unit: VolumeUnit;
}

const PAD = { left: 44, right: 12, top: 24, bottom: 36 };
const H = 250;

export function OilLevelChart({ checks, changes, fullL, unit }: Props) {
  const id = useId();
  const [box, W] = useBoxWidth();
  const pts = useMemo(() => checks.filter((c): c is LevelPoint & { engineHours: number } => c.engineHours !== null).sort((a, b) => a.engineHours - b.engineHours), [checks]);
  const g = useMemo(() => {
    if (pts.length < 2) return null;
    const plotW = W - PAD.left - PAD.right;
    const hs = pts.map((p) => p.engineHours);
    const x = linearScale([...hs, ...changes.map((c) => c.engineHours).filter((h) => h >= hs[0] - 1)], PAD.left, PAD.left + plotW, { count: Math.max(3, Math.floor(plotW / 80)) });
    const v = (l: number) => toDisplayVolume(l, unit);
    const y = linearScale([...pts.flatMap((p) => [v(p.levelL), v(p.correctedL)]), v(fullL)], H - PAD.bottom, PAD.top, { count: 5, minSpan: 0.5 });
    // Join corrected points between oil changes.
    const cuts = changes.map((c) => c.engineHours).sort((a, b) => a - b);
    let d = '';
    let seg = -1;
    for (const p of pts) {
      const s = cuts.filter((c) => c <= p.engineHours).length;
      d += `${s === seg ? 'L' : 'M'}${x(p.engineHours).toFixed(1)} ${y(v(p.correctedL)).toFixed(1)}`;
      seg = s;
    }
    return { x, y, v, d, plotW };
  }, [pts, changes, fullL, unit, W]);

  const skipped = checks.length - pts.length;
  if (!g) return <p className="text-sm text-slate-600 dark:text-slate-300">Two checks with engine hours are needed for the level chart.</p>;
  const ul = volumeLabel(unit);
  const first = pts[0];
  const last = pts[pts.length - 1];
  const desc = `${pts.length} checks from ${num(first.engineHours, 1)} to ${num(last.engineHours, 1)} engine hours; level corrected to 15 °C from ${num(g.v(first.correctedL), 2)} to ${num(g.v(last.correctedL), 2)} ${ul}; ${changes.length} oil change${changes.length === 1 ? '' : 's'}.`;
  const bottom = H - PAD.bottom;
  return (
    <figure className="m-0">
      <div ref={box}>
        <svg viewBox={`0 0 ${W} ${H}`} className="block h-auto w-full" role="img" aria-labelledby={`${id}-t ${id}-d`}>
          <title id={`${id}-t`}>Dipstick level corrected to 15 °C over engine hours</title>
          <desc id={`${id}-d`}>{desc}</desc>
          {g.y.ticks.map((t) => (
            <g key={`y${t}`}>
              <line x1={PAD.left} x2={W - PAD.right} y1={g.y(t)} y2={g.y(t)} className={GRID} />
              <text x={PAD.left - 6} y={g.y(t)} dy="0.32em" textAnchor="end" className={AXIS_TEXT}>
                {num(t, 1)}
              </text>
            </g>
          ))}
          <text x={PAD.left - 6} y={PAD.top - 9} textAnchor="end" className={AXIS_TEXT}>
            {ul}
          </text>
          {g.x.ticks.map((t) => (
            <text key={`x${t}`} x={g.x(t)} y={bottom + 16} textAnchor="middle" className={AXIS_TEXT}>
              {num(t)}
            </text>
          ))}
          <text x={W - PAD.right} y={bottom + 31} textAnchor="end" className={AXIS_TEXT}>
            engine hours
          </text>
          <line x1={PAD.left} x2={W - PAD.right} y1={g.y(g.v(fullL))} y2={g.y(g.v(fullL))} className="stroke-slate-400" strokeDasharray="2 3" />
          <text x={W - PAD.right - 4} y={g.y(g.v(fullL)) - 4} textAnchor="end" className="fill-slate-600 text-[11px] dark:fill-slate-300">
            Full {num(g.v(fullL), 1)} {ul}
          </text>
          {changes
            .filter((c) => c.engineHours >= g.x.lo && c.engineHours <= g.x.hi)
            .map((c) => (
              <g key={`c${c.engineHours}`}>
                <line x1={g.x(c.engineHours)} x2={g.x(c.engineHours)} y1={PAD.top} y2={bottom} className="stroke-ice-500" strokeDasharray="5 4" strokeWidth={1.5} />
                <text x={g.x(c.engineHours) + 4} y={PAD.top + 10} className="fill-ice-700 text-[11px] font-medium dark:fill-ice-300">
                  Oil change
                </text>
              </g>
            ))}
          <g className="fill-none stroke-slate-400">
            {pts.map((p, i) => (
              <circle key={`r${i}`} cx={g.x(p.engineHours)} cy={g.y(g.v(p.levelL))} r={3} />
            ))}
          </g>
          <path d={g.d} fill="none" className="stroke-ice-700 dark:stroke-ice-300" strokeWidth={2} strokeLinejoin="round" />
          <g className="fill-ice-700 dark:fill-ice-300">
            {pts.map((p, i) => (
              <circle key={`p${i}`} cx={g.x(p.engineHours)} cy={g.y(g.v(p.correctedL))} r={3.2} />
            ))}
          </g>
          {pts
            .filter((p) => p.addedL > 0)
            .map((p, i) => (
              <path key={`a${i}`} d={`M${g.x(p.engineHours)} ${bottom - 2}l-4 -7h8z`} className="fill-ice-500" />
            ))}
          <rect x={PAD.left} y={PAD.top} width={g.plotW} height={bottom - PAD.top} fill="none" className="stroke-slate-300 dark:stroke-slate-700" />
        </svg>
      </div>
      <figcaption>
        <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-slate-700 dark:text-slate-300" aria-label="Legend">
          <li className="flex items-center gap-1.5"><span className="inline-block h-2.5 w-2.5 rounded-full bg-ice-700 dark:bg-ice-300" aria-hidden="true" />Corrected to 15 °C</li>
          <li className="flex items-center gap-1.5"><span className="inline-block h-2.5 w-2.5 rounded-full border border-slate-400" aria-hidden="true" />As read</li>
          <li className="flex items-center gap-1.5"><span className="inline-block h-0 w-0 border-x-4 border-b-[7px] border-x-transparent border-b-ice-500" aria-hidden="true" />Oil added</li>
        </ul>
        {skipped > 0 ? <p className="mt-1 text-xs text-slate-500 dark:text-slate-400">{skipped} check{skipped === 1 ? '' : 's'} without engine hours not drawn.</p> : null}
        <p className="sr-only">{desc}</p>
      </figcaption>
    </figure>
  );
}
