'use client';
import { useState } from 'react';
import { PlanDetail } from './PlanDetail';

/** "Soak forecast" behind a disclosure: the plan detail is fetched only when opened. */
export function PlanDisclosure({ departureId, units, canConfirm }: { departureId: number; units: 'C' | 'F'; canConfirm: boolean }) {
  const [open, setOpen] = useState(false);
  return (
    <details className="group" onToggle={(e) => setOpen((e.currentTarget as HTMLDetailsElement).open)}>
      <summary className="inline-flex min-h-10 cursor-pointer items-center text-xs font-semibold text-ice-700 underline-offset-2 hover:underline dark:text-ice-300">Soak forecast and heat plan</summary>
      {open ? (
        <div className="mt-2 rounded-xl bg-slate-50 p-3 dark:bg-slate-900/60">
          <PlanDetail departureId={departureId} units={units} canConfirm={canConfirm} />
        </div>
      ) : null}
    </details>
  );
}
