'use client';
// How often the stated chance held: for each bin of stated chance, the share of mornings that were
// ready at start (dot) with its 95 % Wilson interval (bar), against the mean chance stated in the bin.
// On the diagonal the chance meant what it said; below it the plans promised more than they kept.
import { useId } from 'react';
import type { ReliabilityRow } from '@/lib/outcomes/stats';
import { AXIS_TEXT, GRID, useBoxWidth } from './chartKit';

const PAD = { left: 40, right: 14, top: 20, bottom: 38 };

export function ReliabilityChart({ rows }: { rows: ReliabilityRow[] }) {
  const id = useId();
  const [box, W] = useBoxWidth(420);
  const H = Math.round(Math.min(320, Math.max(230, W * 0.62)));
  const used = rows.filter((r) => r.n > 0 && r.meanStated !== null);
  if (!used.length) return <p className="text-sm text-slate-600 dark:text-slate-300">No flown mornings with a stated chance yet.</p>;
  const plotW = W - PAD.left - PAD.right;
  const plotH = H - PAD.top - PAD.bottom;
  const x = (p: number) => PAD.left + p * plotW;
  const y = (p: number) => H - PAD.bottom - p * plotH;
  const ticks = [0, 0.25, 0.5, 0.75, 1];
  const pct = (p: number) => `${Math.round(p * 100)} %`;
  const desc = used.map((r) => `stated ${r.label}: ${r.ready} of ${r.n} ready (${pct(r.share!)}, 95 % interval ${pct(r.lo!)}–${pct(r.hi!)})`).join('; ') + '.';
  return (
    <figure className="m-0">
      <div ref={box}>
        <svg viewBox={`0 0 ${W} ${H}`} className="block h-auto w-full" role="img" aria-labelledby={`${id}-t ${id}-d`}>
          <title id={`${id}-t`}>Stated chance of being ready against the share that was ready</title>
          <desc id={`${id}-d`}>{desc}</desc>
          {ticks.map((t) => (
            <g key={t}>
              <line x1={PAD.left} x2={W - PAD.right} y1={y(t)} y2={y(t)} className={GRID} />
              <text x={PAD.left - 6} y={y(t)} dy="0.32em" textAnchor="end" className={AXIS_TEXT}>
                {Math.round(t * 100)}
              </text>
              <text x={x(t)} y={H - PAD.bottom + 15} textAnchor="middle" className={AXIS_TEXT}>
                {Math.round(t * 100)}
              </text>
            </g>
          ))}
          <line x1={x(0)} y1={y(0)} x2={x(1)} y2={y(1)} className="stroke-slate-500 dark:stroke-slate-400" strokeDasharray="5 4" strokeWidth={1.25} />
          {used.map((r) => (
            <g key={r.label}>
              <line x1={x(r.meanStated!)} x2={x(r.meanStated!)} y1={y(r.lo!)} y2={y(r.hi!)} className="stroke-ice-700 dark:stroke-ice-300" strokeWidth={2} />
              <line x1={x(r.meanStated!) - 5} x2={x(r.meanStated!) + 5} y1={y(r.lo!)} y2={y(r.lo!)} className="stroke-ice-700 dark:stroke-ice-300" strokeWidth={2} />
              <line x1={x(r.meanStated!) - 5} x2={x(r.meanStated!) + 5} y1={y(r.hi!)} y2={y(r.hi!)} className="stroke-ice-700 dark:stroke-ice-300" strokeWidth={2} />
              <circle cx={x(r.meanStated!)} cy={y(r.share!)} r={5} className="fill-ice-700 stroke-white dark:fill-ice-300 dark:stroke-slate-900" strokeWidth={1.5} />
            </g>
          ))}
          <text x={W - PAD.right} y={H - PAD.bottom + 31} textAnchor="end" className={AXIS_TEXT}>
            stated chance %
          </text>
          <text x={PAD.left - 6} y={PAD.top - 8} textAnchor="start" className={AXIS_TEXT}>
            ready at start %
          </text>
          <rect x={PAD.left} y={PAD.top} width={plotW} height={plotH} fill="none" className="stroke-slate-300 dark:stroke-slate-700" />
        </svg>
      </div>
      <figcaption className="mt-2 text-xs text-slate-700 dark:text-slate-300">
        Dots: the share ready in each band of stated chance, with its 95 % interval; dashed: the chance held exactly.
        <p className="sr-only">{desc}</p>
      </figcaption>
    </figure>
  );
}
