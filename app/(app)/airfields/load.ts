import 'server-only';
import { notFound } from 'next/navigation';
import { AppError } from '@/lib/api/errors';
import { idParam } from '@/lib/api/route';
import { getAirfield, listAirfields, type AirfieldRow } from '@/lib/data/airfields';
import { timeZoneNames } from '@/lib/time';
import { env } from '@/lib/env';

// Loaders shared by the airfield pages: a record of another organization (or none) is the 404 page.

export async function airfieldOr404(orgId: number, id: string, includeArchived = false): Promise<AirfieldRow> {
  try {
    return await getAirfield({ orgId, airfieldId: idParam({ id }), includeArchived });
  } catch (e) {
    if (e instanceof AppError && e.status === 404) notFound();
    throw e;
  }
}

/** What the airfield form needs besides the record: zones, a default zone, the map tiles and where to look first. */
export async function formContext(orgId: number) {
  const others = await listAirfields({ orgId });
  const zones = new Map<string, number>();
  for (const a of others) zones.set(a.timeZone, (zones.get(a.timeZone) ?? 0) + 1);
  const defaultTimeZone = [...zones.entries()].sort((a, b) => b[1] - a[1])[0]?.[0] ?? 'UTC';
  const center: [number, number] | undefined = others.length
    ? [others.reduce((s, a) => s + a.latitude, 0) / others.length, others.reduce((s, a) => s + a.longitude, 0) / others.length]
    : undefined;
  const e = env();
  // The organization's own airfields, named on the picker so a position can be placed by them.
  const landmarks = others.map((a) => ({ id: a.id, name: a.name, ident: a.ident, latitude: a.latitude, longitude: a.longitude }));
  return { timeZones: timeZoneNames(), defaultTimeZone, fallbackCenter: center, landmarks, tileUrl: e.MAP_TILE_URL, tileAttribution: e.MAP_TILE_ATTRIBUTION };
}
