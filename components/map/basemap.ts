// The offline outline basemap: land and national borders from Natural Earth 1:110m (world-atlas),
// converted from TopoJSON with topojson-client. Drawn under any tile layer, so the map is never blank
// when tiles cannot be loaded.
import { feature, mesh } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import countries110m from 'world-atlas/countries-110m.json';

type World = Topology<{ countries: GeometryCollection; land: GeometryCollection }>;
type Position = number[];

/**
 * Rings that cross the antimeridian jump from +180° to −180°; drawn as they are, their fill runs
 * across the whole map. Unwrap such a ring's longitudes so it continues past ±180° instead — when
 * it closes again that way (rings that circle the pole, like Antarctica's, are left as they are).
 */
export function unwrapRing(ring: Position[], closed: boolean): Position[] {
  if (ring.length < 2) return ring;
  const out: Position[] = [[ring[0][0], ring[0][1]]];
  let offset = 0;
  let jumped = false;
  for (let i = 1; i < ring.length; i++) {
    const prev = out[i - 1][0];
    let lon = ring[i][0] + offset;
    while (lon - prev > 180) {
      offset -= 360;
      lon -= 360;
      jumped = true;
    }
    while (prev - lon > 180) {
      offset += 360;
      lon += 360;
      jumped = true;
    }
    out.push([lon, ring[i][1]]);
  }
  if (!jumped) return ring;
  if (closed && Math.abs(out[out.length - 1][0] - out[0][0]) > 1e-6) return ring;
  return out;
}

function unwrapGeometry(g: GeoJSON.Geometry): GeoJSON.Geometry {
  switch (g.type) {
    case 'Polygon':
      return { ...g, coordinates: g.coordinates.map((r) => unwrapRing(r, true)) };
    case 'MultiPolygon':
      return { ...g, coordinates: g.coordinates.map((p) => p.map((r) => unwrapRing(r, true))) };
    case 'LineString':
      return { ...g, coordinates: unwrapRing(g.coordinates, false) };
    case 'MultiLineString':
      return { ...g, coordinates: g.coordinates.map((l) => unwrapRing(l, false)) };
    case 'GeometryCollection':
      return { ...g, geometries: g.geometries.map(unwrapGeometry) };
    default:
      return g;
  }
}

function unwrap(o: GeoJSON.Feature | GeoJSON.FeatureCollection | GeoJSON.Geometry): GeoJSON.GeoJsonObject {
  if (o.type === 'FeatureCollection') return { ...o, features: o.features.map((f) => ({ ...f, geometry: unwrapGeometry(f.geometry) })) } as GeoJSON.FeatureCollection;
  if (o.type === 'Feature') return { ...o, geometry: unwrapGeometry(o.geometry) } as GeoJSON.Feature;
  return unwrapGeometry(o);
}

/** Parallels and meridians every `step` degrees, as one multi-line (a chart's grid, for orientation offline). */
export function graticule(step = 2): GeoJSON.MultiLineString {
  const lines: Position[][] = [];
  for (let lat = -80; lat <= 80; lat += step) {
    const line: Position[] = [];
    for (let lon = -180; lon <= 180; lon += step) line.push([lon, lat]);
    lines.push(line);
  }
  for (let lon = -180; lon < 180; lon += step) lines.push([[lon, -80], [lon, 80]]);
  return { type: 'MultiLineString', coordinates: lines };
}

let cached: { land: GeoJSON.GeoJsonObject; borders: GeoJSON.GeoJsonObject; grid: GeoJSON.GeoJsonObject } | null = null;

export function outlineBasemap() {
  if (!cached) {
    const world = countries110m as unknown as World;
    cached = {
      land: unwrap(feature(world, world.objects.land) as unknown as GeoJSON.FeatureCollection),
      // Borders between two countries only (the coast is the land's own edge).
      borders: unwrap(mesh(world, world.objects.countries, (a, b) => a !== b) as unknown as GeoJSON.Geometry),
      grid: graticule(2),
    };
  }
  return cached;
}
