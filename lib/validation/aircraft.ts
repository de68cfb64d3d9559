// Aircraft profiles, their heaters and the pilots who may book them: one set of zod schemas for the
// form, the route handlers and any CLI. Everything is stored in SI and °C / litres; the form converts
// from the user's units before it sends. Every issue carries its field's path.
import { z } from 'zod';
import { toNumberInput } from './numbers';
import { HEATER_CONTROLS, type HeaterControl } from '@/lib/heater-controls';
import { ENGINE_CLASSES, ENGINE_CLASS_IDS, HEATER_KINDS, type EngineClassId, type HeaterKind } from '@/lib/thermal/presets';
import { text } from './text';

export { ENGINE_CLASSES, ENGINE_CLASS_IDS, HEATER_KINDS, HEATER_CONTROLS, type EngineClassId, type HeaterKind, type HeaterControl };
export const HEATER_KIND_IDS = Object.keys(HEATER_KINDS) as HeaterKind[];

export const HEATER_CONTROL_LABEL: Record<HeaterControl, string> = {
  timer: 'Plain timer',
  relay: 'Switched relay',
  manual: 'By hand',
};
export const HEATER_CONTROL_HINT: Record<HeaterControl, string> = {
  timer: 'One switch-on time; the heater runs until departure.',
  relay: 'Switched on and off slot by slot to follow the cheapest hours.',
  manual: 'Someone switches it on: Thawline gives the switch-on time.',
};
/** Default control granularity in minutes for each kind of control. */
export const DEFAULT_SLOT_MINUTES: Record<HeaterControl, number> = { timer: 15, relay: 5, manual: 30 };

export const MAX_HEATERS = 6;
export const MAX_PILOTS = 500;

// ---------------------------------------------------------------------------------------------
// Shared field helpers (also used by the departure and tariff schemas)

export { toNumberInput };

function rangeMessage(what: string, min: number, max: number, unit: string) {
  const f = (n: number) => `${n.toLocaleString('en-GB').replace('-', '\u2212')}${unit}`;
  return `The ${what} must be between ${f(min)} and ${f(max)}.`;
}

/** A required finite number in [min, max], messages naming the quantity (unit carries its own spacing). */
export function numberIn(what: string, min: number, max: number, unit = '') {
  return z.preprocess(
    toNumberInput,
    z
      .number({ error: (iss) => (iss.input === undefined ? `Enter the ${what}.` : `Enter the ${what} as a number.`) })
      .refine((n) => Number.isFinite(n) && n >= min && n <= max, rangeMessage(what, min, max, unit)),
  );
}

/** An optional number: "", null and a missing key give undefined. */
export function optionalNumberIn(what: string, min: number, max: number, unit = '') {
  return z.preprocess(
    toNumberInput,
    z
      .number({ error: `Enter the ${what} as a number.` })
      .refine((n) => Number.isFinite(n) && n >= min && n <= max, rangeMessage(what, min, max, unit))
      .optional(),
  );
}

/** A nullable number for PATCH: null or "" clear the value (→ null); a missing key leaves it (→ undefined). */
export function clearableNumberIn(what: string, min: number, max: number, unit = '') {
  return z.preprocess(
    (v) => (v === null || (typeof v === 'string' && v.trim() === '') ? null : toNumberInput(v)),
    z
      .number({ error: `Enter the ${what} as a number.` })
      .refine((n) => Number.isFinite(n) && n >= min && n <= max, rangeMessage(what, min, max, unit))
      .nullable()
      .optional(),
  );
}

export const idSchema = (what: string) =>
  z.preprocess(toNumberInput, z.number({ error: `Choose ${what}.` }).int(`Choose ${what}.`).positive(`Choose ${what}.`));

/** An ISO-8601 instant with an offset or Z ("2026-01-14T05:30:00Z"). */
export const isoInstant = (what: string) =>
  text({ error: `Enter the ${what}.` })
    .trim()
    .refine((s) => /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,3})?)?(Z|[+-]\d{2}:?\d{2})$/.test(s) && Number.isFinite(Date.parse(s)), {
      message: `Enter the ${what} as a date and time with its offset (ISO 8601).`,
    })
    .transform((s) => new Date(Date.parse(s)));

// ---------------------------------------------------------------------------------------------
// Aircraft fields

/** A registration mark: 2–10 upper-case letters and digits, hyphens inside (the form upper-cases it). */
export const registrationSchema = text({ error: 'Enter the registration.' })
  .trim()
  .toUpperCase()
  .min(1, 'Enter the registration.')
  .max(10, 'Use at most 10 characters.')
  .regex(/^[A-Z0-9](?:[A-Z0-9-]*[A-Z0-9])?$/, 'Use capital letters, digits and hyphens inside the mark (e.g. Q-ABCD).')
  .refine((s) => s.length >= 2, 'Use at least 2 characters.')
  .refine((s) => /[A-Z]/.test(s), 'A registration has at least one letter.');

export const typeLabelSchema = text({ error: 'Enter the type.' })
  .trim()
  .min(1, 'Enter the type (e.g. four-seat high-wing).')
  .max(80, 'Use at most 80 characters.');

export const engineClassSchema = z.enum(ENGINE_CLASS_IDS as [EngineClassId, ...EngineClassId[]], { error: 'Choose an engine class.' });

const nodeSchema = z.object({
  name: z.enum(['oil', 'engine'], { error: 'A node is "oil" or "engine".' }),
  heatCapacityJPerK: numberIn('heat capacity', 100, 1e8, ' J/K'),
  lossWPerK: numberIn('heat loss', 0.01, 1e4, ' W/K'),
});

/** Thermal parameters as sent: one node (oil) or two (oil, engine); the coupling is needed with two. */
export const thermalSchema = z
  .object({
    nodes: z.array(nodeSchema).min(1, 'Give one or two nodes.').max(2, 'Give one or two nodes.'),
    couplingWPerK: optionalNumberIn('oil–engine coupling', 0, 1e4, ' W/K'),
    coverFactor: numberIn('cover factor', 0.05, 1),
    windCoefficient: optionalNumberIn('wind coefficient', 0, 5),
    source: z.enum(['preset', 'manual', 'fitted']).optional(),
  })
  .superRefine((t, ctx) => {
    if (t.nodes[0]?.name !== 'oil') ctx.addIssue({ code: 'custom', path: ['nodes', 0, 'name'], message: 'The first node is the oil.' });
    if (t.nodes.length === 2) {
      if (t.nodes[1].name !== 'engine') ctx.addIssue({ code: 'custom', path: ['nodes', 1, 'name'], message: 'The second node is the engine mass.' });
      if (t.couplingWPerK === undefined) ctx.addIssue({ code: 'custom', path: ['couplingWPerK'], message: 'Enter the oil–engine coupling for a two-node engine.' });
    }
  });
export type ThermalInput = z.infer<typeof thermalSchema>;

export const heaterSchema = z
  .object({
    kind: z.enum(HEATER_KIND_IDS as [HeaterKind, ...HeaterKind[]], { error: 'Choose the kind of heater.' }),
    powerW: numberIn('heater power', 10, 20000, ' W'),
    node: z.enum(['oil', 'engine'], { error: 'Choose where the heat goes: oil or engine.' }),
    control: z.enum(HEATER_CONTROLS, { error: 'Choose how the heater is switched.' }),
    slotMinutes: optionalNumberIn('switching step', 1, 60, ' min').refine((n) => n === undefined || Number.isInteger(n), 'Use whole minutes.'),
  })
  .transform((h) => ({ ...h, slotMinutes: h.slotMinutes ?? DEFAULT_SLOT_MINUTES[h.control] }));
export type HeaterInput = z.infer<typeof heaterSchema>;

const heatersSchema = z.array(heaterSchema).max(MAX_HEATERS, `Fit at most ${MAX_HEATERS} heaters.`);
const pilotIdsSchema = z
  .array(z.number({ error: 'Pilots are given by id.' }).int().positive())
  .max(MAX_PILOTS)
  .transform((ids) => [...new Set(ids)]);

const shutdownOilSchema = clearableNumberIn('oil temperature at shutdown', -60, 160, ' °C');
/** The aircraft's engine-mass threshold (crankcase and cylinders), °C; empty: the engine class's estimate. */
const engineReadySchema = clearableNumberIn('engine-mass ready temperature', -40, 60, ' °C');
const makerFields = {
  /** The maker's rule from the aircraft's own manual (empty: the engine class's estimate). */
  preheatBelowC: clearableNumberIn('preheat-below temperature', -40, 60, ' °C'),
  preheatSoakHours: clearableNumberIn('soak time', 0, 48, ' h'),
  minStartOilC: clearableNumberIn('minimum oil temperature for start', -40, 60, ' °C'),
};
const shutdownAtSchema = z.preprocess((v) => (v === '' ? null : v), isoInstant('last shutdown time').nullable().optional());

const shelterIdSchema = z.preprocess(
  (v) => (v === '' ? null : toNumberInput(v)),
  z.number({ error: 'Choose a home shelter.' }).int().positive().nullable().optional(),
);

export const aircraftCreateSchema = z.object({
  registration: registrationSchema,
  typeLabel: typeLabelSchema,
  engineClass: engineClassSchema,
  /** Litres; defaults to the class's quantity. */
  oilQuantityL: optionalNumberIn('oil quantity', 0.5, 40, ' L'),
  /** Omitted: from the engine class preset. */
  thermal: thermalSchema.optional(),
  coverOnByDefault: z.boolean({ error: 'Say whether the cover is on by default.' }).default(true),
  shelterId: shelterIdSchema,
  heaters: heatersSchema.default([]),
  pilotIds: pilotIdsSchema.default([]),
  lastShutdownAt: shutdownAtSchema,
  lastShutdownOilC: shutdownOilSchema,
  engineReadyC: engineReadySchema,
  ...makerFields,
});
export type AircraftCreate = z.infer<typeof aircraftCreateSchema>;

/**
 * A change: any of the fields. `heaters` and `pilotIds`, when given, replace the whole list.
 * `thermal: null` resets the parameters to the engine class preset; changing the engine class without
 * new thermal parameters resets them too (the old ones belong to another engine).
 */
export const aircraftUpdateSchema = z
  .object({
    registration: registrationSchema.optional(),
    typeLabel: typeLabelSchema.optional(),
    engineClass: engineClassSchema.optional(),
    oilQuantityL: optionalNumberIn('oil quantity', 0.5, 40, ' L'),
    thermal: thermalSchema.nullable().optional(),
    coverOnByDefault: z.boolean({ error: 'Say whether the cover is on by default.' }).optional(),
    shelterId: shelterIdSchema,
    heaters: heatersSchema.optional(),
    pilotIds: pilotIdsSchema.optional(),
    lastShutdownAt: shutdownAtSchema,
    lastShutdownOilC: shutdownOilSchema,
    engineReadyC: engineReadySchema,
    ...makerFields,
    /** false: bring an archived aircraft back. */
    archived: z.boolean().optional(),
  })
  .strict()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Nothing to change.', path: ['registration'] });
export type AircraftUpdate = z.infer<typeof aircraftUpdateSchema>;

export const aircraftListQuery = z.object({
  archived: z.enum(['0', '1']).optional(),
  airfieldId: z.preprocess(toNumberInput, z.number().int().positive().optional()),
});

/** The class's typical values shown when nothing was entered. */
export function classDefaults(engineClass: string) {
  const p = ENGINE_CLASSES[engineClass as EngineClassId];
  if (!p) return null;
  return { label: p.label, oilL: p.oilL, readyC: p.readyC, engineReadyC: p.engineReadyC, readinessOil: p.readinessOil, shutdownOilC: p.shutdownOilC, heaters: p.heaters };
}
