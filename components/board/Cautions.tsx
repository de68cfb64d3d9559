/** The cautions shown beside every heat plan and warning (docs/product.md, Safety). */
export function HeatCautions({ compact = false }: { compact?: boolean }) {
  return (
    <div role="note" className="rounded-xl border border-amber-300 bg-amber-50 px-4 py-3 text-xs text-amber-950 dark:border-amber-700 dark:bg-amber-950 dark:text-amber-100">
      <p className="font-semibold">Estimates only — the manufacturer&apos;s instructions come first</p>
      {compact ? null : (
        <ul className="mt-1 list-disc space-y-0.5 pl-4">
          <li>Follow the engine and aircraft manufacturer&apos;s cold-weather instructions, your operator&apos;s procedures and local rules; they override anything Thawline shows.</li>
          <li>Preheaters can start fires: no open flame, never leave a combustion heater unattended, keep heaters and cords away from fuel and fabric. Combustion heaters bring carbon-monoxide risk.</li>
          <li>Remove covers and plugs before start. No take-off with frost, ice or snow on wings, tail or propeller.</li>
        </ul>
      )}
    </div>
  );
}
