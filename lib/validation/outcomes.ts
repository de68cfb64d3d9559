// Morning outcomes: the oil temperature shown at start (in the user's unit; stored in °C), or "not flown".
// One schema for the entry card, the route handler and any CLI.
import { z } from 'zod';
import { fromDisplayTemp, tempLabel, toDisplayTemp, type TempUnit } from '@/lib/units';
import { toNumberInput } from './numbers';
import { multilineText } from './text';

/** The oil temperature at start we accept, °C (a gauge's range with room; outside it is a typing slip). */
export const OIL_AT_START_MIN_C = -50;
export const OIL_AT_START_MAX_C = 130;
/** How long after a departure its outcome may still be recorded from the departures pages (hours). */
export const OUTCOME_ENTRY_HOURS = 36;

const round = (v: number) => Math.round(v);

export const outcomeSchema = z
  .object({
    flown: z.boolean({ error: 'Say whether the aircraft flew (true or false).' }),
    oilAtStart: z.preprocess(toNumberInput, z.number({ error: 'Enter the oil temperature shown at start as a number.' }).optional()),
    unit: z.enum(['C', 'F'], { error: 'The unit is C or F.' }).default('C'),
    notes: multilineText({ error: 'Notes are text.' }).trim().max(500, 'Use at most 500 characters.').default(''),
  })
  .superRefine((v, ctx) => {
    if (!v.flown) return;
    const unit = v.unit as TempUnit;
    if (v.oilAtStart === undefined || !Number.isFinite(v.oilAtStart)) {
      ctx.addIssue({ code: 'custom', path: ['oilAtStart'], message: 'Enter the oil temperature shown at start, or choose “Not flown”.' });
      return;
    }
    const c = fromDisplayTemp(v.oilAtStart, unit);
    if (c < OIL_AT_START_MIN_C || c > OIL_AT_START_MAX_C) {
      const lo = round(toDisplayTemp(OIL_AT_START_MIN_C, unit));
      const hi = round(toDisplayTemp(OIL_AT_START_MAX_C, unit));
      ctx.addIssue({ code: 'custom', path: ['oilAtStart'], message: `Enter an oil temperature from ${lo} to ${hi} ${tempLabel(unit)}.` });
    }
  })
  .transform((v) => ({
    flown: v.flown,
    oilAtStartC: v.flown && v.oilAtStart !== undefined ? Math.round(fromDisplayTemp(v.oilAtStart, v.unit as TempUnit) * 10) / 10 : null,
    notes: v.notes,
  }));

export type OutcomeInput = z.output<typeof outcomeSchema>;
