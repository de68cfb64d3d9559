// Unit conversions at the edge: everything is stored and computed in °C, litres, W.
export type TempUnit = 'C' | 'F';
export type VolumeUnit = 'L' | 'qt';

export const LITRES_PER_US_QUART = 0.946352946; // exact by definition of the US liquid quart

export function toDisplayTemp(c: number, unit: TempUnit): number {
  return unit === 'F' ? (c * 9) / 5 + 32 : c;
}
export function fromDisplayTemp(v: number, unit: TempUnit): number {
  return unit === 'F' ? ((v - 32) * 5) / 9 : v;
}
/** A temperature difference (K) in the display unit. */
export function toDisplayDelta(k: number, unit: TempUnit): number {
  return unit === 'F' ? (k * 9) / 5 : k;
}
export function tempLabel(unit: TempUnit): string {
  return unit === 'F' ? '°F' : '°C';
}

export function toDisplayVolume(l: number, unit: VolumeUnit): number {
  return unit === 'qt' ? l / LITRES_PER_US_QUART : l;
}
export function fromDisplayVolume(v: number, unit: VolumeUnit): number {
  return unit === 'qt' ? v * LITRES_PER_US_QUART : v;
}
export function volumeLabel(unit: VolumeUnit): string {
  return unit === 'qt' ? 'US qt' : 'L';
}

/** The typographic minus sign (U+2212) that every displayed negative number uses. */
export const MINUS = '\u2212';

/** A formatted number with the typographic minus sign ("-3.5" → "−3.5"). */
export function withMinus(s: string): string {
  return s.replace('-', MINUS);
}

/** "−14 °C" (`digits` decimals, never "−0"), or "—" without a value. The one temperature formatter. */
export function formatTemp(c: number | null | undefined, unit: TempUnit, digits = 0): string {
  if (c === null || c === undefined || !Number.isFinite(c)) return '—';
  let s = toDisplayTemp(c, unit).toFixed(digits);
  if (Number(s) === 0) s = (0).toFixed(digits);
  return `${withMinus(s)} ${tempLabel(unit)}`;
}
