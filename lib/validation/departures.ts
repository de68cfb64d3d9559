// Departures: the first flight of a day for an aircraft, with the oil temperature it must have.
// One set of schemas for the booking form, the route handlers and any CLI. Temperatures in °C.
import { z } from 'zod';
import { clearableNumberIn, idSchema, optionalNumberIn, toNumberInput } from './aircraft';
import { text, multilineText } from './text';

/** Departures further ahead than this are refused: forecasts and plans do not reach that far. */
export const MAX_DAYS_AHEAD = 60;
/** Two departures of one aircraft closer than this are refused (besides the one-a-day rule). */
export const MIN_HOURS_BETWEEN = 12;

/** A departure time as sent: an instant (with offset or Z), or a local wall time at the aircraft's airfield. */
export type DepartAtInput =
  | { kind: 'instant'; ms: number }
  | { kind: 'local'; year: number; month: number; day: number; hour: number; minute: number };

const LOCAL_RE = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::00)?$/;
const INSTANT_RE = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,3})?)?(Z|[+-]\d{2}:?\d{2})$/;

export const departAtSchema = text({ error: 'Enter the departure date and time.' })
  .trim()
  .min(1, 'Enter the departure date and time.')
  .transform((s, ctx): DepartAtInput => {
    const local = LOCAL_RE.exec(s);
    if (local) {
      const [year, month, day, hour, minute] = local.slice(1).map(Number);
      const probe = new Date(Date.UTC(year, month - 1, day, hour, minute));
      if (probe.getUTCMonth() === month - 1 && probe.getUTCDate() === day && hour < 24 && minute < 60) {
        return { kind: 'local', year, month, day, hour, minute };
      }
    } else if (INSTANT_RE.test(s) && Number.isFinite(Date.parse(s))) {
      return { kind: 'instant', ms: Date.parse(s) };
    }
    ctx.addIssue({ code: 'custom', message: 'Enter the departure as a date and time (YYYY-MM-DDTHH:MM, the airfield’s local time, or ISO 8601 with an offset).' });
    return z.NEVER;
  });

const readyC = optionalNumberIn('ready temperature', -40, 60, ' °C');
/** The start window, minutes: the oil is at ready from departure through it, the heater on until just before start. */
export const MAX_HOLD_MINUTES = 120;
const holdMinutes = z.preprocess(
  toNumberInput,
  z
    .number({ error: 'Enter the start window in whole minutes, 0 to 120.' })
    .int('Enter the start window in whole minutes, 0 to 120.')
    .min(0, 'The start window cannot be negative.')
    .max(MAX_HOLD_MINUTES, `The start window is at most ${MAX_HOLD_MINUTES} minutes.`)
    .optional(),
);
const notes = multilineText({ error: 'Notes are text.' }).trim().max(500, 'Use at most 500 characters.');

export const departureCreateSchema = z.object({
  aircraftId: idSchema('an aircraft'),
  /** Who flies; defaults to the person booking. Only roles that book for anyone may name someone else. */
  pilotId: z.preprocess(toNumberInput, z.number({ error: 'Choose a pilot.' }).int().positive().optional()),
  departAt: departAtSchema,
  /**
   * Oil temperature needed at departure, °C; defaults to the engine class's. Raised freely; an operator
   * may lower it to the aircraft's own figure (the maker's minimum oil for start), recorded with who and when.
   */
  readyC,
  /** Optional overnight floor, °C: the oil is kept at or above it all night. */
  floorC: clearableNumberIn('overnight floor', -40, 60, ' °C'),
  /** Start window, minutes (default: the organization's, 30). */
  holdMinutes,
  notes: notes.default(''),
});
export type DepartureCreate = z.infer<typeof departureCreateSchema>;

export const departureUpdateSchema = z
  .object({
    pilotId: z.preprocess(toNumberInput, z.number({ error: 'Choose a pilot.' }).int().positive().optional()),
    departAt: departAtSchema.optional(),
    readyC,
    floorC: clearableNumberIn('overnight floor', -40, 60, ' °C'),
    holdMinutes,
    notes: notes.optional(),
  })
  .strict()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Nothing to change.', path: ['departAt'] });
export type DepartureUpdate = z.infer<typeof departureUpdateSchema>;

/** A list bound: an ISO instant, or a date (YYYY-MM-DD, midnight UTC). */
const bound = (what: string) =>
  text()
    .trim()
    .optional()
    .transform((s, ctx) => {
      if (!s) return undefined;
      const ms = /^\d{4}-\d{2}-\d{2}$/.test(s) ? Date.parse(`${s}T00:00:00Z`) : INSTANT_RE.test(s) ? Date.parse(s) : NaN;
      if (!Number.isFinite(ms)) {
        ctx.addIssue({ code: 'custom', message: `Give ${what} as a date (YYYY-MM-DD) or an ISO 8601 instant.` });
        return z.NEVER;
      }
      return ms;
    });

export const departureListQuery = z
  .object({
    from: bound('from'),
    to: bound('to'),
    airfieldId: z.preprocess(toNumberInput, z.number({ error: 'Choose an airfield.' }).int().positive().optional()),
    aircraftId: z.preprocess(toNumberInput, z.number({ error: 'Choose an aircraft.' }).int().positive().optional()),
    pilotId: z.preprocess(toNumberInput, z.number({ error: 'Choose a pilot.' }).int().positive().optional()),
    cancelled: z.enum(['0', '1']).optional(),
  })
  .refine((q) => q.from === undefined || q.to === undefined || q.to > q.from, { message: 'The end must come after the start.', path: ['to'] });
