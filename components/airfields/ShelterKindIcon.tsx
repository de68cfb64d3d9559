import type { ShelterKind } from '@/lib/validation/airfields';

// Small line drawings of the four shelter kinds.
const PATHS: Record<ShelterKind, string[]> = {
  'heated-hangar': ['M3 20V10l9-6 9 6v10', 'M3 20h18', 'M12 19c-2 0-3-1.4-3-3 0-2 2-3 2-5 1.5 1 4 2.8 4 5 0 1.6-1.2 3-3 3z'],
  'unheated-hangar': ['M3 20V10l9-6 9 6v10', 'M3 20h18', 'M7 20v-6h10v6'],
  't-hangar': ['M2 9h20', 'M9 9v11h6V9', 'M4 9l2-4h12l2 4', 'M2 20h20'],
  'tie-down': ['M12 4v9', 'M8 8h8', 'M5 13a7 7 0 0 0 14 0', 'M5 13l-1.5 1.5M19 13l1.5 1.5', 'M3 21h18'],
};

export function ShelterKindIcon({ kind, className = 'h-5 w-5' }: { kind: ShelterKind; className?: string }) {
  return (
    <svg viewBox="0 0 24 24" className={`${className} ${kind === 'heated-hangar' ? 'text-ember-600 dark:text-ember-400' : 'text-ice-700 dark:text-ice-300'}`} fill="none" stroke="currentColor" strokeWidth={1.7} strokeLinecap="round" strokeLinejoin="round" aria-hidden="true">
      {PATHS[kind].map((d) => (
        <path key={d} d={d} />
      ))}
    </svg>
  );
}
