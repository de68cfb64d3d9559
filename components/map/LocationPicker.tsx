'use client';
// A small map to pick an airfield's position: click or tap to place the crosshair, drag it to adjust.
import 'leaflet/dist/leaflet.css';
import './map.css';
import L from 'leaflet';
import { useEffect, useMemo } from 'react';
import { CircleMarker, MapContainer, Marker, TileLayer, Tooltip, useMap, useMapEvents } from 'react-leaflet';
import { OutlineBasemap } from './SiteMap';

interface Props {
  latitude: number | null;
  longitude: number | null;
  onPick: (latitude: number, longitude: number) => void;
  tileUrl?: string;
  tileAttribution?: string;
  /** Where to look when no position is set yet (e.g. the organization's other airfields). */
  fallbackCenter?: [number, number];
  /** The organization's airfields, drawn with their names for orientation. */
  landmarks?: Landmark[];
}

export interface Landmark {
  id: number;
  name: string;
  ident: string;
  latitude: number;
  longitude: number;
}

const round = (v: number) => Math.round(v * 1e4) / 1e4;
const wrapLon = (lon: number) => ((((lon + 180) % 360) + 360) % 360) - 180;

function ClickToPick({ onPick }: { onPick: Props['onPick'] }) {
  useMapEvents({ click: (e) => onPick(round(e.latlng.lat), round(wrapLon(e.latlng.lng))) });
  return null;
}

function FollowPosition({ pos }: { pos: [number, number] | null }) {
  const map = useMap();
  useEffect(() => {
    if (pos && !map.getBounds().pad(-0.1).contains(pos)) map.setView(pos, Math.max(map.getZoom(), 7));
  }, [pos, map]);
  return null;
}

export function LocationPicker({ latitude, longitude, onPick, tileUrl, tileAttribution, fallbackCenter = [55, 15], landmarks = [] }: Props) {
  const pos: [number, number] | null =
    latitude !== null && longitude !== null && Math.abs(latitude) <= 90 && Math.abs(longitude) <= 180 ? [latitude, longitude] : null;
  const icon = useMemo(() => L.divIcon({ className: 'tl-mk-icon', html: '<div class="tl-pick"><span></span></div>', iconSize: [32, 32], iconAnchor: [16, 16] }), []);
  return (
    <MapContainer center={pos ?? fallbackCenter} zoom={pos ? 7 : 4} minZoom={2} className="tl-map h-64 w-full" aria-label="Pick the airfield's position on the map">
      <OutlineBasemap />
      {tileUrl ? <TileLayer url={tileUrl} attribution={tileAttribution || undefined} /> : null}
      <ClickToPick onPick={onPick} />
      <FollowPosition pos={pos} />
      {landmarks.map((l) => (
        <CircleMarker key={l.id} center={[l.latitude, l.longitude]} radius={5} pathOptions={{ color: '#1e4e6b', weight: 2, fillColor: '#fff', fillOpacity: 1 }} interactive={false}>
          <Tooltip permanent direction="right" offset={[6, 0]} className="tl-landmark">
            {l.name} ({l.ident})
          </Tooltip>
        </CircleMarker>
      ))}
      {pos ? (
        <Marker
          position={pos}
          icon={icon}
          draggable
          title="Airfield position (drag to adjust)"
          eventHandlers={{ dragend: (e) => { const p = (e.target as L.Marker).getLatLng(); onPick(round(p.lat), round(wrapLon(p.lng))); } }}
        />
      ) : null}
    </MapContainer>
  );
}
