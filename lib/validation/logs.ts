// Fit from log: the upload query, the fit request, applying a fit and going back to an earlier profile.
// The file itself is the request body (CSV bytes); everything else is parsed here.
import { z } from 'zod';
import { idSchema, isoInstant, optionalNumberIn } from './aircraft';
import { text, multilineText } from './text';

export const TEMP_UNIT_CHOICES = ['auto', 'C', 'F'] as const;

export const logUploadQuery = z.object({
  fileName: text({ error: 'Give the file name.' })
    .trim()
    .max(200, 'Use a file name of at most 200 characters.')
    .transform((s) => s.replace(/^.*[\\/]/, '').replace(/[\u0000-\u001f]/g, '') || 'log.csv')
    .default('log.csv'),
  unit: z.enum(TEMP_UNIT_CHOICES, { error: 'Choose the unit: Detect, °C or °F.' }).default('auto'),
});

const bool = (what: string) => z.boolean({ error: `Say whether ${what} (true or false).` });

export const fitRequestSchema = z
  .strictObject({
    /** The cool-down window; the suggested one when absent. */
    window: z
      .strictObject({ start: isoInstant('window start'), end: isoInstant('window end') })
      .refine((w) => w.end.getTime() > w.start.getTime(), { message: 'The window must end after it starts.', path: ['end'] })
      .optional(),
    /** The engine cover was on while the log was taken: the fitted losses are scaled back to uncovered ones. */
    coverOn: bool('the cover was on').default(false),
    /** Heat capacity of the engine (oil and engine mass together); the profile's when absent. */
    heatCapacityJPerK: optionalNumberIn('heat capacity', 1000, 1e7, ' J/K'),
    twoNode: bool('to try two nodes').default(true),
  });
export type FitRequest = z.infer<typeof fitRequestSchema>;

export const applyFitSchema = z.strictObject({
  logId: idSchema('a log'),
  model: z.enum(['one-node', 'two-node'], { error: 'Choose the one-node or the two-node fit.' }),
  note: multilineText({ error: 'The note is text.' }).trim().max(500, 'Use at most 500 characters.').default(''),
});

export const revertSchema = z.strictObject({
  revisionId: idSchema('a profile revision'),
  note: multilineText({ error: 'The note is text.' }).trim().max(500, 'Use at most 500 characters.').default(''),
});
