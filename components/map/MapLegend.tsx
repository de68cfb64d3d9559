'use client';
import { useState } from 'react';
import { READINESS, READINESS_STYLE } from './marker';

const BANDS = [
  { label: 'above 0°', bg: '#f1f8fb', fg: '#132837' },
  { label: '0 to −10°', bg: '#dceef6', fg: '#132837' },
  { label: '−10 to −20°', bg: '#93cbe2', fg: '#132837' },
  { label: 'below −20°', bg: '#2b769b', fg: '#ffffff' },
];
const EDGE: Record<(typeof READINESS)[number], string> = { 'no-heat': '#0f766e', ready: '#0f766e', warming: '#e34608', short: '#b91c1c', unplanned: '#6d28d9' };

/**
 * The Site map's key: what a tag shows, the cold shades and (once plans exist) the readiness edges.
 * On a phone it starts folded to one "Key" button so it never covers a tag; on wider screens it is open.
 */
export function MapLegend({ showReadiness = false, window = '18:00–09:00' }: { showReadiness?: boolean; window?: string }) {
  const [open, setOpen] = useState(false);
  return (
    <div className="pointer-events-auto">
      <button
        type="button"
        aria-expanded={open}
        aria-controls="map-legend"
        onClick={() => setOpen((o) => !o)}
        className="mb-1 min-h-11 rounded-xl border border-slate-200 bg-white/95 px-3 text-xs font-semibold text-slate-800 shadow-md dark:border-slate-700 dark:bg-slate-900/90 dark:text-slate-100 sm:hidden"
      >
        {open ? 'Hide key' : 'Key'}
      </button>
      <div
        id="map-legend"
        className={`${open ? '' : 'hidden'} rounded-xl border border-slate-200 bg-white/95 px-3 py-2 text-[11px] leading-snug text-slate-700 shadow-md backdrop-blur dark:border-slate-700 dark:bg-slate-900/90 dark:text-slate-300 sm:block`}
      >
      <p className="font-semibold text-slate-900 dark:text-white">Tonight&rsquo;s forecast low</p>
      <p className="text-slate-500 dark:text-slate-400">{window} local · dashed: forecast out of date</p>
      <ul className="mt-1.5 flex flex-wrap gap-1" aria-label="Colder nights show deeper ice">
        {BANDS.map((b) => (
          <li key={b.label} className="rounded-md px-1.5 py-0.5 font-semibold" style={{ background: b.bg, color: b.fg }}>
            {b.label}
          </li>
        ))}
      </ul>
      {showReadiness ? (
        <ul className="mt-1.5 grid grid-cols-2 gap-x-3 gap-y-0.5" aria-label="Readiness">
          {READINESS.map((r) => (
            <li key={r} className="flex items-center gap-1.5">
              <span className="grid h-4 w-4 place-items-center rounded-full text-[9px] font-bold text-white" style={{ background: EDGE[r] }} aria-hidden="true">
                {READINESS_STYLE[r].glyph}
              </span>
              {READINESS_STYLE[r].label}
            </li>
          ))}
        </ul>
      ) : null}
      </div>
    </div>
  );
}
