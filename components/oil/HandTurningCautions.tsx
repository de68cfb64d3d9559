/** The cautions for the morning oil check and turning the engine through by hand (docs/product.md, Safety). */
export function HandTurningCautions() {
  return (
    <div role="note" aria-labelledby="hand-turning-h" className="rounded-xl border border-amber-300 bg-amber-50 px-4 py-3 text-sm text-amber-950 dark:border-amber-700 dark:bg-amber-950 dark:text-amber-100">
      <p id="hand-turning-h" className="font-semibold">Before turning the propeller by hand</p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5">
        <li>Magnetos / ignition off — and treat the propeller as live all the same.</li>
        <li>Chocks in. Turn only in the direction the engine manufacturer allows.</li>
        <li>Thawline gives estimates: the engine and aircraft manufacturer&apos;s instructions, your operator&apos;s procedures and local rules come first.</li>
      </ul>
    </div>
  );
}
