// Alert preferences and acknowledgements: one set of schemas for the form and the route handlers.
import { z } from 'zod';
import { canonicalTimeZone } from '@/lib/time';
import { text } from './text';

export const HHMM_RE = /^([01]\d|2[0-3]):[0-5]\d$/;
const hhmm = text()
  .trim()
  .regex(HHMM_RE, 'Use a 24-hour time such as 22:00.');
const optionalHhmm = z.union([hhmm, z.literal('').transform(() => null), z.null()]);

export const CHANNELS = ['email', 'app', 'off'] as const;
export const CHANNEL_LABEL: Record<(typeof CHANNELS)[number], string> = {
  email: 'In the app and by e-mail',
  app: 'In the app only',
  off: 'Off',
};

export const MIN_LEAD_MINUTES = 5;
export const MAX_LEAD_MINUTES = 240;

export const alertPreferencesSchema = z
  .object({
    oilTooCold: z.enum(['email', 'app'], { error: 'The oil-too-cold warning is always shown in the app: choose e-mail or app only.' }).optional(),
    switchOn: z.enum(CHANNELS).optional(),
    coldNight: z.enum(CHANNELS).optional(),
    emailEnabled: z.boolean().optional(),
    quietStart: optionalHhmm.optional(),
    quietEnd: optionalHhmm.optional(),
    timeZone: text()
      .trim()
      .transform((z0, ctx) => {
        const c = canonicalTimeZone(z0);
        if (!c) {
          ctx.addIssue({ code: 'custom', message: 'Choose a time zone from the list.' });
          return z.NEVER;
        }
        return c;
      })
      .optional(),
    reminderLeadMinutes: z.coerce
      .number({ error: 'Enter a number of minutes.' })
      .int('Use whole minutes.')
      .min(MIN_LEAD_MINUTES, `At least ${MIN_LEAD_MINUTES} minutes.`)
      .max(MAX_LEAD_MINUTES, `At most ${MAX_LEAD_MINUTES} minutes.`)
      .optional(),
    tempUnit: z.enum(['C', 'F']).optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (Object.keys(v).length === 0) ctx.addIssue({ code: 'custom', path: ['oilTooCold'], message: 'Nothing to change.' });
    const s = v.quietStart;
    const e = v.quietEnd;
    if (s !== undefined || e !== undefined) {
      if ((s ?? null) === null && (e ?? null) !== null) ctx.addIssue({ code: 'custom', path: ['quietStart'], message: 'Give the start of the quiet hours too.' });
      if ((e ?? null) === null && (s ?? null) !== null) ctx.addIssue({ code: 'custom', path: ['quietEnd'], message: 'Give the end of the quiet hours too.' });
      if (s && e && s === e) ctx.addIssue({ code: 'custom', path: ['quietEnd'], message: 'The quiet hours must end at another time than they start.' });
    }
  });
export type AlertPreferencesInput = z.infer<typeof alertPreferencesSchema>;

export const acknowledgeSchema = z.object({ acknowledged: z.boolean({ error: 'Send acknowledged: true or false.' }) }).strict();

export const acknowledgeAllSchema = z.object({ kind: z.enum(['oil-too-cold', 'switch-on', 'cold-night']).optional() }).strict();

export const alertListQuery = z.object({
  show: z.enum(['current', 'all']).default('current'),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
