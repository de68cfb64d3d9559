// Sun on a shelter roof: sun elevation from suncalc, a clear-sky irradiance model, a cloud factor.
import { getPosition } from 'suncalc';

const HOUR_MS = 3_600_000;

/** Sun elevation above the horizon, degrees (suncalc 2: degrees, refraction-corrected). */
export function sunElevationDeg(atMs: number, lat: number, lon: number): number {
  return getPosition(new Date(atMs), lat, lon).altitude;
}

/**
 * Clear-sky global horizontal irradiance, W/m², from the sun elevation: Haurwitz's model
 * GHI = 1098·cos z·exp(−0.057 / cos z) (from memory; good to ~10 % for a plain estimate).
 */
export function clearSkyGhi(elevationDeg: number): number {
  if (elevationDeg <= 0) return 0;
  const cz = Math.sin((elevationDeg * Math.PI) / 180);
  return 1098 * cz * Math.exp(-0.057 / cz);
}

/** Cloud reduction of global irradiance, Kasten & Czeplak: 1 − 0.75·N^3.4, N cloud fraction 0..1 (from memory). */
export function cloudFactor(fraction: number): number {
  const n = Math.min(1, Math.max(0, fraction));
  return n === 0 ? 1 : 1 - 0.75 * Math.pow(n, 3.4);
}

const meanCache = new Map<string, Map<number, { t1: number; mean: number }>>();
let meanCount = 0;
const MEAN_CACHE_LIMIT = 50_000;

/**
 * Mean clear-sky GHI over [t0, t1] (W/m²), Simpson's rule on suncalc elevations at ≤ 5-minute spacing.
 * Cached per site: aircraft at one airfield share their sun.
 */
export function meanClearSkyGhi(t0: number, t1: number, lat: number, lon: number): number {
  return meanForSite(siteCache(lat, lon), t0, t1, lat, lon);
}

function siteCache(lat: number, lon: number): Map<number, { t1: number; mean: number }> {
  const key = `${lat},${lon}`;
  let m = meanCache.get(key);
  if (!m) meanCache.set(key, (m = new Map()));
  return m;
}

function meanForSite(bySite: Map<number, { t1: number; mean: number }>, t0: number, t1: number, lat: number, lon: number): number {
  const hit = bySite.get(t0);
  if (hit && hit.t1 === t1) return hit.mean;
  let m = Math.max(2, Math.ceil((t1 - t0) / 300_000));
  if (m % 2) m++;
  const dt = (t1 - t0) / m;
  let sum = 0;
  for (let i = 0; i <= m; i++) {
    const w = i === 0 || i === m ? 1 : i % 2 ? 4 : 2;
    sum += w * clearSkyGhi(sunElevationDeg(t0 + i * dt, lat, lon));
  }
  const mean = sum / (3 * m);
  if (meanCount >= MEAN_CACHE_LIMIT) {
    for (const v of meanCache.values()) v.clear();
    meanCount = 0;
  }
  bySite.set(t0, { t1, mean });
  meanCount++;
  return mean;
}

/**
 * The solar-gain pieces over [startMs, endMs]: whole clock hours (UTC), split at cloud-cover changes.
 * Each piece's gain is the mean over the whole piece (not clipped to the run), so the gain at an
 * instant depends only on the clock and the weather, never on the run's start or output grid.
 */
export function solarPieces(
  startMs: number,
  endMs: number,
  site: { lat: number; lon: number },
  apertureM2: number,
  cloud: readonly { atMs: number; fraction: number }[],
): { fromMs: number; toMs: number; gainW: number }[] {
  const out: { fromMs: number; toMs: number; gainW: number }[] = [];
  const bySite = siteCache(site.lat, site.lon);
  let h0 = Math.floor(startMs / HOUR_MS) * HOUR_MS;
  let ci = 0; // cloud[ci] is the last cloud point at or before the piece start (or the first one)
  while (h0 < endMs) {
    const h1 = h0 + HOUR_MS;
    let a = h0;
    while (a < h1) {
      while (ci + 1 < cloud.length && cloud[ci + 1].atMs <= a) ci++;
      const next = ci + 1 < cloud.length ? cloud[ci + 1].atMs : Infinity;
      const b = next < h1 ? next : h1;
      if (b > startMs && a < endMs) {
        const n = cloud.length ? cloud[ci].fraction : 0;
        out.push({ fromMs: a, toMs: b, gainW: apertureM2 * meanForSite(bySite, a, b, site.lat, site.lon) * cloudFactor(n) });
      }
      a = b;
    }
    h0 = h1;
  }
  return out;
}
