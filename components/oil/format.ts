// Display helpers for the Oil log.
import { toDisplayVolume, volumeLabel, type VolumeUnit } from '@/lib/units';

export function fmtLevel(l: number, unit: VolumeUnit, digits = 2): string {
  return `${toDisplayVolume(l, unit).toFixed(digits)} ${volumeLabel(unit)}`;
}

/** Oil used per engine hour: "0.085 L/h". */
export function fmtRate(lPerH: number, unit: VolumeUnit): string {
  return `${toDisplayVolume(lPerH, unit).toFixed(3).replace('-', '\u2212')} ${volumeLabel(unit)}/h`;
}

export function fmtHours(h: number | null | undefined): string {
  return h === null || h === undefined ? '—' : `${h.toLocaleString('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 })} h`;
}

export function fmtPercent(f: number): string {
  return `${f > 0 ? '+' : f < 0 ? '\u2212' : ''}${Math.abs(100 * f).toFixed(1)} %`;
}
