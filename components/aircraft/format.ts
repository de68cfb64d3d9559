// Display helpers for aircraft and their heaters (client and server).
import { formatDayTime, zoneLabel } from '@/lib/time';
import { tempLabel, toDisplayTemp, toDisplayVolume, volumeLabel, type TempUnit, type VolumeUnit } from '@/lib/units';
import type { AircraftRecord, HeaterRecord } from '@/lib/views/aircraft';
import { HEATER_CONTROL_LABEL } from '@/lib/validation/aircraft';

const MINUS = '\u2212';

export function fmtTemp(c: number | null | undefined, unit: TempUnit, digits = 0): string {
  if (c === null || c === undefined || !Number.isFinite(c)) return '—';
  let s = toDisplayTemp(c, unit).toFixed(digits);
  if (Number(s) === 0) s = (0).toFixed(digits);
  return `${s.replace('-', MINUS)} ${tempLabel(unit)}`;
}

export function fmtVolume(l: number, unit: VolumeUnit): string {
  const v = toDisplayVolume(l, unit);
  return `${v.toLocaleString('en-GB', { maximumFractionDigits: 1 })} ${volumeLabel(unit)}`;
}

export function fmtPower(w: number): string {
  return w >= 1000 ? `${(w / 1000).toLocaleString('en-GB', { maximumFractionDigits: 2 })} kW` : `${Math.round(w)} W`;
}

export function totalPowerW(heaters: HeaterRecord[]): number {
  return heaters.reduce((s, h) => s + h.powerW, 0);
}

/** "Oil sump/tank pad 200 W · switched relay". */
export function heaterLine(h: Pick<HeaterRecord, 'kindLabel' | 'powerW' | 'control' | 'node'>): string {
  return `${h.kindLabel} ${fmtPower(h.powerW)} on the ${h.node} · ${HEATER_CONTROL_LABEL[h.control].toLowerCase()}`;
}

/** "Tue 17:20 EET" at the aircraft's airfield (UTC when it has none). */
export function fmtAt(iso: string | null, zone: string | undefined): string {
  if (!iso) return '—';
  const ms = Date.parse(iso);
  const z = zone ?? 'UTC';
  return `${formatDayTime(ms, z)} ${zoneLabel(z, ms)}`;
}

/** Where the aircraft lives: "T-hangar row A · Kettle Lake". */
export function homeLine(a: Pick<AircraftRecord, 'shelter' | 'airfield'>): string {
  if (!a.shelter) return 'No home shelter';
  return a.airfield ? `${a.shelter.name} · ${a.airfield.name}` : a.shelter.name;
}
