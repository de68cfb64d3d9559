'use client';
// The Site map itself (client only: Leaflet needs the browser). Load it through SiteMapLazy.
import 'leaflet/dist/leaflet.css';
import './map.css';
import L from 'leaflet';
import Link from 'next/link';
import { useEffect, useMemo, type ReactNode } from 'react';
import { GeoJSON, MapContainer, Marker, Pane, Popup, ScaleControl, TileLayer, useMap } from 'react-leaflet';
import { formatTemp, type TempUnit } from '@/components/airfields/format';
import { SHELTER_KIND_LABEL, type ShelterKind } from '@/lib/validation/airfields';
import { formatAge, formatDayTime } from '@/lib/time';
import { outlineBasemap } from './basemap';
import { markerHtml, markerTitle, type Readiness } from './marker';

export interface MapAirfield {
  id: number;
  name: string;
  ident: string;
  latitude: number;
  longitude: number;
  timeZone: string;
  /** Tonight's forecast low, °C. */
  lowC: number | null;
  lowAt: string | null;
  forecastStatus: 'fresh' | 'stale' | 'missing';
  ageMinutes: number | null;
  /** Worst readiness of the field's aircraft for the morning (later issues); neutral when absent. */
  readiness?: Readiness;
  shelters: { id: number; name: string; kind: ShelterKind; aircraftCount: number }[];
}

export interface SiteMapProps {
  airfields: MapAirfield[];
  unit: TempUnit;
  /** XYZ tile URL template; empty: the outline basemap alone. */
  tileUrl?: string;
  tileAttribution?: string;
  /** Shown over the map's lower left corner (the legend). */
  legend?: ReactNode;
  className?: string;
}

/** A 1×1 transparent GIF for tiles that fail to load, so the outline below shows through. */
const NO_TILE = 'data:image/gif;base64,R0lGODlhAQABAIAAAAAAAP///yH5BAEAAAAALAAAAAABAAEAAAIBRAA7';
const BASEMAP_PANE = 'tl-basemap';

function FitToAirfields({ airfields }: { airfields: MapAirfield[] }) {
  const map = useMap();
  const key = airfields.map((a) => `${a.id}:${a.latitude}:${a.longitude}`).join('|');
  useEffect(() => {
    if (airfields.length === 0) {
      map.setView([50, 10], 3);
      return;
    }
    const bounds = L.latLngBounds(airfields.map((a) => [a.latitude, a.longitude] as [number, number]));
    map.fitBounds(bounds, { padding: [80, 80], maxZoom: 7 });
    // Only when the set of places changes, not on every forecast update.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key, map]);
  return null;
}

function AirfieldMarker({ a, unit }: { a: MapAirfield; unit: TempUnit }) {
  const content = { ident: a.ident, name: a.name, lowC: a.lowC, unit, readiness: a.readiness, stale: a.forecastStatus !== 'fresh' };
  const html = markerHtml(content);
  const icon = useMemo(() => L.divIcon({ className: 'tl-mk-icon', html, iconSize: [24, 24], iconAnchor: [12, 12], popupAnchor: [0, -44] }), [html]);
  const title = markerTitle(a.name, content);
  return (
    <Marker position={[a.latitude, a.longitude]} icon={icon} title={title} alt={title} keyboard riseOnHover>
      <Popup>
        <div className="space-y-2">
          <div>
            <p className="text-base font-semibold text-slate-900 dark:text-white">{a.name}</p>
            <p className="text-xs font-medium uppercase tracking-wider text-slate-500">{a.ident}</p>
          </div>
          <p className="text-sm">
            {a.lowC === null ? (
              <span className="text-slate-600 dark:text-slate-400">No forecast for tonight yet.</span>
            ) : (
              <>
                Tonight&rsquo;s low <strong className="tabular-nums">{formatTemp(a.lowC, unit)}</strong>
                {a.lowAt ? <span className="text-slate-600 dark:text-slate-400"> · {formatDayTime(Date.parse(a.lowAt), a.timeZone)}</span> : null}
              </>
            )}
          </p>
          {a.forecastStatus === 'stale' && a.ageMinutes !== null ? (
            <p className="text-xs font-medium text-amber-800 dark:text-amber-300">Forecast {formatAge(a.ageMinutes)} old</p>
          ) : null}
          {a.shelters.length ? (
            <ul className="space-y-0.5 border-t border-slate-200 pt-2 text-sm dark:border-slate-700" aria-label={`Shelters at ${a.name}`}>
              {a.shelters.map((s) => (
                <li key={s.id} className="flex justify-between gap-3">
                  <span>{s.name}</span>
                  <span className="whitespace-nowrap text-xs text-slate-500">
                    {SHELTER_KIND_LABEL[s.kind]}
                    {s.aircraftCount ? ` · ${s.aircraftCount} ac` : ''}
                  </span>
                </li>
              ))}
            </ul>
          ) : (
            <p className="border-t border-slate-200 pt-2 text-sm text-slate-500 dark:border-slate-700">No shelters yet.</p>
          )}
          <Link href={`/airfields/${a.id}`} className="inline-flex min-h-10 items-center font-semibold text-ice-700 hover:underline dark:text-ice-300">
            Open {a.name} →
          </Link>
        </div>
      </Popup>
    </Marker>
  );
}

/** The outline basemap (land and borders), in its own pane under the tiles. */
export function OutlineBasemap() {
  const { land, borders, grid } = outlineBasemap();
  return (
    <Pane name={BASEMAP_PANE} style={{ zIndex: 150 }}>
      <GeoJSON
        data={land}
        interactive={false}
        attribution="Outline: Natural Earth"
        style={{ className: 'tl-basemap-land', weight: 0.8, color: '#8ea3b5', fillColor: '#f6f8fa', fillOpacity: 1 }}
      />
      <GeoJSON data={grid} interactive={false} style={{ className: 'tl-basemap-grid', weight: 0.6, color: '#b9cad6', opacity: 0.8, fill: false }} />
      <GeoJSON data={borders} interactive={false} style={{ className: 'tl-basemap-border', weight: 0.7, color: '#9fb1c1', dashArray: '3 3', fill: false }} />
    </Pane>
  );
}

export function SiteMap({ airfields, unit, tileUrl, tileAttribution, legend, className = 'h-[60dvh] min-h-80 lg:h-[34rem]' }: SiteMapProps) {
  return (
    <div className={`relative ${className}`}>
      <MapContainer center={[50, 10]} zoom={3} minZoom={2} worldCopyJump className="tl-map h-full w-full" aria-label="Map of your airfields">
        <OutlineBasemap />
        {tileUrl ? <TileLayer url={tileUrl} attribution={tileAttribution || undefined} errorTileUrl={NO_TILE} /> : null}
        {airfields.map((a) => (
          <AirfieldMarker key={a.id} a={a} unit={unit} />
        ))}
        <FitToAirfields airfields={airfields} />
        <ScaleControl position="bottomright" imperial={false} />
      </MapContainer>
      {legend ? <div className="pointer-events-none absolute bottom-3 left-3 z-[500] max-w-[calc(100%-7rem)]">{legend}</div> : null}
    </div>
  );
}

export default SiteMap;
