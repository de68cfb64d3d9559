import { Wordmark } from '@/components/ui/Logo';

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="relative flex min-h-dvh flex-col items-center justify-center overflow-hidden bg-gradient-to-b from-ice-100 via-slate-50 to-white px-4 py-10 dark:from-ice-950 dark:via-slate-950 dark:to-slate-950">
      <svg aria-hidden="true" viewBox="0 0 1200 200" preserveAspectRatio="none" className="pointer-events-none absolute inset-x-0 bottom-0 h-40 w-full text-ice-200/70 dark:text-ice-900/50">
        <path d="M0 120 C 150 80 300 160 450 120 S 750 80 900 120 S 1100 150 1200 110 V200 H0z" fill="currentColor" />
      </svg>
      <div className="relative w-full max-w-sm">
        <div className="mb-6 flex justify-center">
          <Wordmark />
        </div>
        {children}
        <p className="mt-6 text-center text-xs text-slate-500 dark:text-slate-400">
          Oil-temperature forecasts and heat plans for a cold morning's first flight.
        </p>
      </div>
    </div>
  );
}
