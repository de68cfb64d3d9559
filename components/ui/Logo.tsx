/** Thawline's mark: a droplet of oil over a thawing line. */
export function Logo({ className = 'h-8 w-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect width="32" height="32" rx="8" className="fill-ice-800 dark:fill-ice-700" />
      <path d="M16 5c3.6 4.6 6 8.1 6 11.2A6 6 0 0 1 10 16.2C10 13.1 12.4 9.6 16 5z" className="fill-ember-400" />
      <path d="M6 24.5c2.5-1.6 4.5-1.6 7 0s4.5 1.6 7 0 4.5-1.6 6 0" fill="none" strokeWidth="2.2" strokeLinecap="round" className="stroke-ice-200" />
    </svg>
  );
}

export function Wordmark() {
  return (
    <span className="flex items-center gap-2">
      <Logo />
      <span className="text-lg font-semibold tracking-tight text-slate-900 dark:text-white">Thawline</span>
    </span>
  );
}
