'use client';
// Leaflet needs the browser: the map loads on the client only (next/dynamic with ssr:false must sit in a client component).
import dynamic from 'next/dynamic';

export function MapSkeleton({ className = 'h-[60dvh] min-h-80 lg:h-[34rem]' }: { className?: string }) {
  return (
    <div className={`grid place-items-center rounded-2xl bg-ice-100/70 dark:bg-slate-800 ${className}`} aria-busy="true">
      <p className="text-sm text-slate-600 dark:text-slate-400">Loading the map…</p>
    </div>
  );
}

export const SiteMapLazy = dynamic(() => import('./SiteMap').then((m) => m.SiteMap), { ssr: false, loading: () => <MapSkeleton /> });

export const LocationPickerLazy = dynamic(() => import('./LocationPicker').then((m) => m.LocationPicker), {
  ssr: false,
  loading: () => <MapSkeleton className="h-64" />,
});
