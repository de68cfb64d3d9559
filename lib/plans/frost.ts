// Frost on the airframe before a departure: for an aircraft that spends the night outside (an open
// tie-down, or no shelter), the hours between sunset and departure when the skin, cooled by radiation to
// a clear sky, sits at or below the frost point of the air. Pure: the forecast hours and the site come in.
// The skin model and the Magnus frost point are the soak model's own (lib/thermal/frost.ts).
import { getPosition, getTimes } from 'suncalc';
import { frostFlags } from '@/lib/thermal/frost';

export interface FrostInputHour {
  atMs: number;
  tempC: number;
  dewPointC: number;
  windMps: number;
  cloudFraction: number;
}

export interface FrostRisk {
  /** Frost can form on the airframe in at least one hour of the night before departure. */
  likely: boolean;
  /** Hours (whole forecast hours) with the skin at or below the frost point. */
  hours: number;
  /** First and last such hour (epoch ms), or null. */
  fromMs: number | null;
  toMs: number | null;
}

/** Shelter kinds that keep frost off the airframe (a roof over it). */
const ROOFED = new Set(['heated-hangar', 'unheated-hangar', 't-hangar']);

export function isOutside(shelterKind: string | null | undefined): boolean {
  return !shelterKind || !ROOFED.has(shelterKind);
}

/** The last sunset at or before `beforeMs` at the site (or 18 h before, in polar night / midnight sun). */
export function lastSunsetBefore(beforeMs: number, lat: number, lon: number): number {
  for (let d = 0; d <= 2; d++) {
    const t = getTimes(new Date(beforeMs - d * 86_400_000), lat, lon).sunset?.getTime();
    if (t !== undefined && Number.isFinite(t) && t <= beforeMs) return t;
  }
  return beforeMs - 18 * 3_600_000;
}

/**
 * Frost risk for a departure: only for an airframe outside; from the last sunset before departure to
 * the departure itself. Hours come from the airfield's forecast.
 */
export function frostRisk(o: { hours: readonly FrostInputHour[]; shelterKind: string | null | undefined; departAtMs: number; lat: number; lon: number }): FrostRisk | null {
  if (!isOutside(o.shelterKind)) return null;
  const from = lastSunsetBefore(o.departAtMs, o.lat, o.lon);
  const night = o.hours.filter((h) => h.atMs >= from && h.atMs <= o.departAtMs);
  if (!night.length) return { likely: false, hours: 0, fromMs: null, toMs: null };
  const flags = frostFlags(
    night.map((h) => ({
      atMs: h.atMs,
      airC: h.tempC,
      dewPointC: h.dewPointC,
      cloudFraction: h.cloudFraction,
      windMps: h.windMps,
      sunElevationDeg: (getPosition(new Date(h.atMs), o.lat, o.lon).altitude * 180) / Math.PI,
    })),
  ).filter((f) => f.frost);
  return { likely: flags.length > 0, hours: flags.length, fromMs: flags[0]?.atMs ?? null, toMs: flags.at(-1)?.atMs ?? null };
}

/** What to tell the pilot when frost is likely. */
export const FROST_CAUTION = 'Frost likely — check and remove before flight. No take-off with frost, ice or snow on wings, tail or propeller.';
