// Devices (MQTT relays and probes): the add form, the route handler and the CLIs share this schema.
import { z } from 'zod';
import { DEVICE_KINDS, PROBE_MEASURES } from '@/lib/devices/topics';
import { text } from './text';

export { DEVICE_KINDS, PROBE_MEASURES };

export const deviceCreateSchema = z
  .object({
    kind: z.enum(DEVICE_KINDS, { message: 'Choose a relay or a probe.' }),
    measures: z.enum(PROBE_MEASURES, { message: 'Choose what the probe measures.' }).optional(),
    label: text().trim().min(1, 'Give the device a name.').max(80, 'Keep the name to 80 characters.'),
    aircraftId: z.number().int().positive().optional(),
    shelterId: z.number().int().positive().optional(),
  })
  .superRefine((v, ctx) => {
    if (v.kind === 'probe' && !v.measures) ctx.addIssue({ code: 'custom', path: ['measures'], message: 'Choose what the probe measures.' });
    const needsShelter = v.kind === 'probe' && v.measures === 'shelter';
    if (needsShelter && !v.shelterId) ctx.addIssue({ code: 'custom', path: ['shelterId'], message: 'Choose the shelter the probe is in.' });
    if (!needsShelter && !v.aircraftId) ctx.addIssue({ code: 'custom', path: ['aircraftId'], message: 'Choose the aircraft the device is fitted to.' });
  });
export type DeviceCreateInput = z.infer<typeof deviceCreateSchema>;

/** Manual override of a relay: on now for N minutes, or off now. */
export const deviceOverrideSchema = z.discriminatedUnion('action', [
  z.object({ action: z.literal('on'), minutes: z.number({ message: 'Give the minutes.' }).int('Whole minutes.').min(1, 'At least 1 minute.').max(12 * 60, 'At most 12 hours.') }),
  z.object({ action: z.literal('off') }),
], { message: 'Choose on or off.' });
export type DeviceOverrideInput = z.infer<typeof deviceOverrideSchema>;
