import type { NavItem } from './nav';

const paths: Record<NavItem['icon'] | 'more' | 'signout', string> = {
  board: 'M4 5h16M4 12h16M4 19h10',
  map: 'M9 4 3 6v14l6-2 6 2 6-2V4l-6 2-6-2zM9 4v14M15 6v14',
  airfield: 'M3 20h18M5 20V10l7-5 7 5v10M9 20v-5h6v5',
  aircraft: 'M2 13l9-2V5.5a1.5 1.5 0 0 1 3 0V11l8 2v2l-8-1v4l2.5 2v1L12 20l-3.5 1v-1L11 18v-4l-9 1z',
  departure: 'M7 3v3M17 3v3M4 8h16M5 5h14a1 1 0 0 1 1 1v13a1 1 0 0 1-1 1H5a1 1 0 0 1-1-1V6a1 1 0 0 1 1-1zM9 14l2 2 4-4',
  oil: 'M12 3c3.2 4.2 5.5 7.3 5.5 10a5.5 5.5 0 0 1-11 0C6.5 10.3 8.8 7.2 12 3z',
  alert: 'M12 4a6 6 0 0 0-6 6v4l-2 3h16l-2-3v-4a6 6 0 0 0-6-6zM10 20a2 2 0 0 0 4 0',
  curve: 'M3 4v16h18M6 8c3 0 4 7 7 7s3-4 5-4',
  report: 'M3 4v16h18M7 17 19 5M8 11h.01M11 14h.01M13 8h.01M16 12h.01',
  settings: 'M12 15a3 3 0 1 0 0-6 3 3 0 0 0 0 6zM19 12l2-1-1-3-2 .5-1.5-1.5.5-2-3-1-1 2h-2l-1-2-3 1 .5 2L5.5 8.5 3.5 8l-1 3 2 1v0l-2 1 1 3 2-.5 1.5 1.5-.5 2 3 1 1-2h2l1 2 3-1-.5-2 1.5-1.5 2 .5 1-3z',
  users: 'M9 11a4 4 0 1 0 0-8 4 4 0 0 0 0 8zM2 21a7 7 0 0 1 14 0M17 11a3 3 0 1 0 0-6M22 20a5 5 0 0 0-4-5',
  mail: 'M3 6h18v12H3zM3 7l9 6 9-6',
  more: 'M5 12h.01M12 12h.01M19 12h.01',
  signout: 'M15 4h4v16h-4M10 8l-4 4 4 4M6 12h10',
};

export function Icon({ name, className = 'h-5 w-5' }: { name: keyof typeof paths; className?: string }) {
  return (
    <svg viewBox="0 0 24 24" className={className} fill="none" stroke="currentColor" strokeWidth={name === 'more' ? 3 : 1.8} strokeLinecap="round" strokeLinejoin="round" aria-hidden="true">
      <path d={paths[name]} />
    </svg>
  );
}
