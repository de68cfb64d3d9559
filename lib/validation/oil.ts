// The Oil log's inputs: cold oil checks and oil changes entered in the person's own units (°C or °F,
// litres or US quarts), converted to °C and litres by the route; the oil-change interval of an aircraft.
import { z } from 'zod';
import { clearableNumberIn, numberIn, optionalNumberIn } from './aircraft';
import type { DepartAtInput } from './departures';
import { fromDisplayTemp, fromDisplayVolume, tempLabel, toDisplayTemp, toDisplayVolume, volumeLabel, type TempUnit, type VolumeUnit } from '@/lib/units';
import { text, multilineText } from './text';

export interface DisplayUnits {
  tempUnit: TempUnit;
  volumeUnit: VolumeUnit;
}

const LOCAL_RE = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::\d{2})?$/;
const INSTANT_RE = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,3})?)?(Z|[+-]\d{2}:?\d{2})$/;

/** A time as sent: an instant with an offset, or the airfield's local wall time "YYYY-MM-DDTHH:MM". */
export const whenSchema = (what: string) =>
  text({ error: `Enter the ${what}.` })
    .trim()
    .min(1, `Enter the ${what}.`)
    .transform((s, ctx): DepartAtInput => {
      const m = LOCAL_RE.exec(s);
      if (m) {
        const [year, month, day, hour, minute] = m.slice(1).map(Number);
        const probe = new Date(Date.UTC(year, month - 1, day, hour, minute));
        if (probe.getUTCMonth() === month - 1 && probe.getUTCDate() === day && hour < 24 && minute < 60) return { kind: 'local', year, month, day, hour, minute };
      } else if (INSTANT_RE.test(s) && Number.isFinite(Date.parse(s))) return { kind: 'instant', ms: Date.parse(s) };
      ctx.addIssue({ code: 'custom', message: `Enter the ${what} as a date and time (the airfield’s local time).` });
      return z.NEVER;
    });

const notes = multilineText({ error: 'Notes are text.' }).trim().max(1000, 'Use at most 1,000 characters.').default('');
const round = (v: number, step = 1) => Math.round(v / step) * step;

/** An oil check in the person's units; `toStored` gives litres and °C. */
export function oilCheckSchema(u: DisplayUnits) {
  const t = (c: number) => round(toDisplayTemp(c, u.tempUnit));
  const v = (l: number) => round(toDisplayVolume(l, u.volumeUnit), 0.1);
  const tl = ` ${tempLabel(u.tempUnit)}`;
  const vl = ` ${volumeLabel(u.volumeUnit)}`;
  return z
    .object({
      checkedAt: whenSchema('time of the check'),
      level: numberIn('dipstick level', 0, v(40), vl),
      oilTemp: numberIn('oil temperature', t(-60), t(150), tl),
      outsideTemp: numberIn('outside temperature', t(-60), t(50), tl),
      bladesTurned: optionalNumberIn('number of blade turns', 0, 200).refine((n) => n === undefined || Number.isInteger(n), 'Count whole blade turns.'),
      engineHours: optionalNumberIn('engine hours', 0, 100_000, ' h'),
      added: optionalNumberIn('oil added', 0, v(20), vl),
      notes,
    })
    .transform((c) => ({
      checkedAt: c.checkedAt,
      levelL: fromDisplayVolume(c.level, u.volumeUnit),
      oilTempC: fromDisplayTemp(c.oilTemp, u.tempUnit),
      outsideTempC: fromDisplayTemp(c.outsideTemp, u.tempUnit),
      bladesTurned: c.bladesTurned ?? null,
      engineHours: c.engineHours ?? null,
      addedL: c.added !== undefined ? fromDisplayVolume(c.added, u.volumeUnit) : 0,
      notes: c.notes,
    }));
}
export type OilCheckInput = z.output<ReturnType<typeof oilCheckSchema>>;

export function oilChangeSchema(u: DisplayUnits) {
  const v = (l: number) => round(toDisplayVolume(l, u.volumeUnit), 0.1);
  const vl = ` ${volumeLabel(u.volumeUnit)}`;
  return z
    .object({
      changedAt: whenSchema('time of the oil change'),
      engineHours: numberIn('engine hours', 0, 100_000, ' h'),
      oilGrade: text({ error: 'Enter the oil grade.' })
        .trim()
        .min(1, 'Enter the oil grade (e.g. 15W-50).')
        .max(40, 'Use at most 40 characters.'),
      quantity: optionalNumberIn('quantity filled', 0, v(40), vl),
      notes,
    })
    .transform((c) => ({
      changedAt: c.changedAt,
      engineHours: c.engineHours,
      oilGrade: c.oilGrade,
      quantityL: c.quantity !== undefined ? fromDisplayVolume(c.quantity, u.volumeUnit) : null,
      notes: c.notes,
    }));
}
export type OilChangeInput = z.output<ReturnType<typeof oilChangeSchema>>;

export const oilSettingsSchema = z
  .object({
    oilChangeIntervalHours: clearableNumberIn('oil-change interval in engine hours', 1, 2000, ' h'),
    oilChangeIntervalMonths: clearableNumberIn('oil-change interval in months', 1, 60).refine((n) => n == null || Number.isInteger(n), 'Give whole months.'),
  })
  .refine((s) => s.oilChangeIntervalHours !== undefined || s.oilChangeIntervalMonths !== undefined, { message: 'Give an interval in hours or months (empty clears it).', path: ['oilChangeIntervalHours'] });
export type OilSettings = z.infer<typeof oilSettingsSchema>;
