'use client';
import { useEffect, useState } from 'react';

const SEEN_KEY = 'thawline:cautions-seen';

const ITEMS = [
  'Follow the engine and aircraft manufacturer’s cold-weather instructions, your operator’s procedures and local rules; they override anything Thawline shows.',
  'Preheaters can start fires: no open flame, never leave a combustion heater unattended, keep heaters and cords away from fuel and fabric. Combustion heaters bring carbon-monoxide risk.',
  'Remove covers and plugs before start. No take-off with frost, ice or snow on wings, tail or propeller.',
];

/**
 * The cautions shown beside heat plans and warnings (docs/product.md, Safety). On pages the block is open
 * the first time it is seen on this device and folded after that, one tap away; on a plan (`always`) it is
 * always open. E-mails carry their own copy.
 */
export function HeatCautions({ compact = false, always = false }: { compact?: boolean; always?: boolean }) {
  const [open, setOpen] = useState(true);
  useEffect(() => {
    if (always) return;
    try {
      if (window.localStorage.getItem(SEEN_KEY)) setOpen(false);
      else window.localStorage.setItem(SEEN_KEY, '1');
    } catch {
      // Storage refused (private mode): keep it open.
    }
  }, [always]);
  const title = 'Estimates only — the manufacturer’s instructions come first';
  const box = 'rounded-xl border border-amber-300 bg-amber-50 px-4 py-3 text-xs text-amber-950 dark:border-amber-700 dark:bg-amber-950 dark:text-amber-100';
  const list = (
    <ul className="mt-1 list-disc space-y-0.5 pl-4">
      {ITEMS.map((t) => (
        <li key={t}>{t}</li>
      ))}
    </ul>
  );
  if (always || compact) {
    return (
      <div role="note" className={box}>
        <p className="font-semibold">{title}</p>
        {compact ? null : list}
      </div>
    );
  }
  return (
    <details role="note" className={box} open={open} onToggle={(e) => setOpen((e.target as HTMLDetailsElement).open)}>
      <summary className="cursor-pointer font-semibold">{title}</summary>
      {list}
    </details>
  );
}
