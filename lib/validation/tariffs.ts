// Time-of-use tariffs per airfield: named periods with a price each, and which period applies in each
// hour as 12×24 month-by-hour matrices for weekdays and weekends (the structure of the OpenEI Utility
// Rate Database). A flat price is one period everywhere. Safe to import in client components.
import { z } from 'zod';
import { numberIn } from './aircraft';
import { text } from './text';

export const MAX_PERIODS = 8;
export const MONTHS = 12;
export const HOURS = 24;
export const MONTH_NAMES = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'] as const;

export interface TariffShape {
  currency: string;
  periods: { name: string; pricePerKWh: number }[];
  weekdaySchedule: number[][];
  weekendSchedule: number[][];
}

/** The price used where an airfield has no tariff stored: one flat period (a demo-level figure). */
export const DEFAULT_TARIFF: TariffShape = {
  currency: 'EUR',
  periods: [{ name: 'Flat (default)', pricePerKWh: 0.2 }],
  weekdaySchedule: uniformSchedule(Array(HOURS).fill(0)),
  weekendSchedule: uniformSchedule(Array(HOURS).fill(0)),
};

/** A 12×24 matrix with the same 24 hours in every month. */
export function uniformSchedule(hours: number[]): number[][] {
  return Array.from({ length: MONTHS }, () => [...hours]);
}

const periodSchema = z.object({
  name: text({ error: 'Name the period.' }).trim().min(1, 'Name the period (e.g. Night).').max(40, 'Use at most 40 characters.'),
  pricePerKWh: numberIn('price per kWh', 0, 10),
});

const scheduleSchema = (which: string) =>
  z
    .array(z.array(z.number({ error: 'Each hour holds a period number.' }).int('Each hour holds a period number.').min(0, 'Each hour holds a period number.')), {
      error: `Give the ${which} schedule as 12 months × 24 hours.`,
    })
    .refine((m) => m.length === MONTHS && m.every((row) => row.length === HOURS), `Give the ${which} schedule as 12 months × 24 hours.`);

export const tariffSchema = z
  .object({
    currency: text({ error: 'Enter the currency.' })
      .trim()
      .toUpperCase()
      .regex(/^[A-Z]{3}$/, 'Use a three-letter currency code (e.g. EUR).'),
    periods: z.array(periodSchema).min(1, 'Give at least one period.').max(MAX_PERIODS, `Use at most ${MAX_PERIODS} periods.`),
    weekdaySchedule: scheduleSchema('weekday'),
    weekendSchedule: scheduleSchema('weekend'),
  })
  .superRefine((t, ctx) => {
    const names = t.periods.map((p) => p.name.toLowerCase());
    names.forEach((n, i) => {
      if (names.indexOf(n) !== i) ctx.addIssue({ code: 'custom', path: ['periods', i, 'name'], message: 'Give each period its own name.' });
    });
    for (const key of ['weekdaySchedule', 'weekendSchedule'] as const) {
      t[key].forEach((row, m) =>
        row.forEach((p, h) => {
          if (p >= t.periods.length) ctx.addIssue({ code: 'custom', path: [key, m, h], message: `Hour ${h} of ${MONTH_NAMES[m]} names a period that does not exist.` });
        }),
      );
    }
    const used = new Set([...t.weekdaySchedule.flat(), ...t.weekendSchedule.flat()]);
    t.periods.forEach((_, i) => {
      if (!used.has(i)) ctx.addIssue({ code: 'custom', path: ['periods', i, 'name'], message: 'This period is not used in any hour; use it or remove it.' });
    });
  });
export type TariffInput = z.infer<typeof tariffSchema>;
