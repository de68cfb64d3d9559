import { z } from 'zod';
import { toNumberInput } from './numbers';

// The organization's planning settings (managers): the chance plans aim at, and the start window new
// departures get.
export const organizationPlanningSchema = z
  .object({
    /** 0.5–0.99; the form sends per cent and converts. */
    targetChance: z.preprocess(toNumberInput, z.number({ error: 'Enter the chance as a number.' }).min(0.5, 'At least 50 %.').max(0.99, 'At most 99 %.').optional()),
    holdMinutes: z.preprocess(toNumberInput, z.number({ error: 'Enter minutes as a number.' }).int('Whole minutes.').min(0, 'At least 0.').max(120, 'At most 120.').optional()),
  })
  .strict()
  .refine((v) => v.targetChance !== undefined || v.holdMinutes !== undefined, { message: 'Nothing to change.', path: ['targetChance'] });
export type OrganizationPlanning = z.infer<typeof organizationPlanningSchema>;
