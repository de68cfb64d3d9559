// Display helpers for airfield and forecast views (client and server). Temperatures are stored in °C;
// people may read them in °F (their preference).
import { formatTemp as formatTempIn, toDisplayTemp, withMinus, type TempUnit } from '@/lib/units';

export type { TempUnit };

/** °C to the reader's unit (the one conversion, in lib/units). */
export const toUnit = toDisplayTemp;

/** "−14.2 °C" (one decimal by default), or "6 °F": lib/units' formatter with this view's default. */
export function formatTemp(c: number | null | undefined, unit: TempUnit = 'C', digits = 1): string {
  return formatTempIn(c, unit, digits);
}

/** "−14°" — short, for map markers. */
export function formatTempShort(c: number | null | undefined, unit: TempUnit = 'C'): string {
  if (c === null || c === undefined || !Number.isFinite(c)) return '—';
  const s = toUnit(c, unit).toFixed(0);
  return `${withMinus(s === '-0' ? '0' : s)}°`;
}

/** "61.520° N, 23.960° E". */
export function formatLatLon(lat: number, lon: number): string {
  const f = (v: number, pos: string, neg: string) => `${Math.abs(v).toFixed(3)}° ${v >= 0 ? pos : neg}`;
  return `${f(lat, 'N', 'S')}, ${f(lon, 'E', 'W')}`;
}

/** "1.2 MJ/K" style numbers for the thermal parameters. */
export function formatNumber(v: number | null | undefined, digits = 1): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  return withMinus(v.toLocaleString('en-GB', { maximumFractionDigits: digits }));
}
