// Airfields and shelters: one set of zod schemas for the forms, the route handlers and any CLI.
// Form values arrive as strings; numbers are coerced ("" means "not given", a decimal comma is read
// as a point). Every issue carries its field's path, so errors show beside the field.
import { z } from 'zod';
import { toNumberInput } from './numbers';
import type { ShelterKind } from '@/lib/thermal/presets';
import { shelterDefaultsFor } from '@/lib/defaults';
import { canonicalTimeZone } from '@/lib/time';
import { text } from './text';

export type { ShelterKind };

/** The shelter kinds, in the order forms offer them. The one list: models/Shelter.ts takes it from here; the type is the soak model's (lib/thermal/presets.ts). */
export const SHELTER_KINDS = ['heated-hangar', 'unheated-hangar', 't-hangar', 'tie-down'] as const satisfies readonly ShelterKind[];
type Exhaustive<T extends ShelterKind> = [ShelterKind] extends [T] ? true : never;
const exhaustive: Exhaustive<(typeof SHELTER_KINDS)[number]> = true;
void exhaustive;

export const SHELTER_KIND_LABEL: Record<ShelterKind, string> = {
  'heated-hangar': 'Heated hangar',
  'unheated-hangar': 'Unheated hangar',
  't-hangar': 'T-hangar',
  'tie-down': 'Open tie-down',
};

export const SHELTER_KIND_HINT: Record<ShelterKind, string> = {
  'heated-hangar': 'Heating holds a set-point while its power allows.',
  'unheated-hangar': 'Air follows the outside with a lag of hours; a dark roof gains some sun.',
  't-hangar': 'Small, light shelter: follows the outside within an hour or two.',
  'tie-down': 'No shelter air: the engine sits in the outside air and the wind.',
};

/** Kinds with an air node (heat capacity and loss to outside). */
export function hasShelterAir(kind: ShelterKind): boolean {
  return kind !== 'tie-down';
}

export const MAX_SHELTERS_PER_REQUEST = 30;


/** A finite number in [min, max] with messages naming the quantity (`unit` carries its own spacing: "°", " m"). */
function numberCore(what: string, min: number, max: number, unit = '') {
  const fmt = (n: number) => `${n.toLocaleString('en-GB').replace('-', '\u2212')}${unit}`;
  const inRange = (n: number) => n >= min && n <= max;
  const core = z.number({ error: (iss) => (iss.input === undefined ? `Enter the ${what}.` : `Enter the ${what} as a number.`) });
  if (min === 0) {
    return core
      .refine((n) => n >= 0, `The ${what} cannot be negative.`)
      .refine((n) => n < 0 || n <= max, `The ${what} must be at most ${fmt(max)}.`);
  }
  return core.refine(inRange, `The ${what} must be between ${fmt(min)} and ${fmt(max)}.`);
}

/** A required number; form strings are coerced. */
function number(what: string, min: number, max: number, unit = '') {
  return z.preprocess(toNumberInput, numberCore(what, min, max, unit));
}

/** An optional number: "", null and a missing key all mean "not given". */
function optionalNumber(what: string, min: number, max: number, unit = '') {
  return z.preprocess(toNumberInput, numberCore(what, min, max, unit).optional());
}

export const nameSchema = text({ error: 'Enter a name.' })
  .trim()
  .min(1, 'Enter a name.')
  .max(120, 'Use at most 120 characters.');

export const timeZoneSchema = text({ error: 'Choose a time zone.' })
  .trim()
  .min(1, 'Choose a time zone.')
  .max(64, 'That is not a time zone Thawline knows (IANA name, e.g. Europe/Helsinki).')
  .transform((z0, ctx) => {
    const c = canonicalTimeZone(z0);
    if (!c) {
      ctx.addIssue({ code: 'custom', message: 'That is not a time zone Thawline knows (IANA name, e.g. Europe/Helsinki).' });
      return z.NEVER;
    }
    return c;
  });

const airfieldFields = {
  name: nameSchema,
  ident: text({ error: 'Enter an identifier.' })
    .trim()
    .toUpperCase()
    .min(2, 'Use 2 to 8 letters or digits.')
    .max(8, 'Use 2 to 8 letters or digits.')
    .regex(/^[A-Z0-9-]+$/, 'Use letters, digits and hyphens only.'),
  latitude: number('latitude', -90, 90, '°'),
  longitude: number('longitude', -180, 180, '°'),
  elevationM: number('elevation', -500, 9000, ' m'),
  timeZone: timeZoneSchema,
};

// ---------------------------------------------------------------------------------------------
// Shelters

const shelterFields = {
  name: nameSchema,
  kind: z.enum(SHELTER_KINDS, { error: 'Choose a shelter kind.' }),
  heatCapacityJPerK: optionalNumber('heat capacity', 0, 1e12, ' J/K'),
  lossWPerK: optionalNumber('heat loss', 0, 1e9, ' W/K'),
  solarApertureM2: optionalNumber('solar aperture', 0, 1e5, ' m²'),
  setpointC: optionalNumber('set-point', -30, 30, ' °C'),
  heatingPowerW: optionalNumber('heating power', 0, 1e8, ' W'),
};

type ShelterDraft = {
  name: string;
  kind: ShelterKind;
  heatCapacityJPerK?: number;
  lossWPerK?: number;
  solarApertureM2?: number;
  setpointC?: number;
  heatingPowerW?: number;
};

/** A shelter as stored: thermal values complete for its kind (tie-downs carry zeros and no heating). */
export interface ShelterValues {
  name: string;
  kind: ShelterKind;
  heatCapacityJPerK: number;
  lossWPerK: number;
  solarApertureM2: number;
  setpointC: number | null;
  heatingPowerW: number | null;
}

function checkShelter(s: ShelterDraft, ctx: z.RefinementCtx) {
  if (hasShelterAir(s.kind)) {
    // Negative values are already refused by the field itself; here only zero is left.
    if (s.heatCapacityJPerK === 0) {
      ctx.addIssue({ code: 'custom', path: ['heatCapacityJPerK'], message: 'The heat capacity must be greater than 0.' });
    }
    if (s.lossWPerK === 0) {
      ctx.addIssue({ code: 'custom', path: ['lossWPerK'], message: 'The heat loss must be greater than 0.' });
    }
  }
  if (s.kind === 'heated-hangar' && s.heatingPowerW === 0) {
    ctx.addIssue({ code: 'custom', path: ['heatingPowerW'], message: 'A heated hangar needs a heating power greater than 0.' });
  }
}

/** Fill what was not given from the kind's preset; drop what the kind does not use. */
export function completeShelter(s: ShelterDraft): ShelterValues {
  const d = shelterDefaultsFor(s.kind);
  if (!hasShelterAir(s.kind)) {
    return { name: s.name, kind: s.kind, heatCapacityJPerK: 0, lossWPerK: 0, solarApertureM2: 0, setpointC: null, heatingPowerW: null };
  }
  const heated = s.kind === 'heated-hangar';
  return {
    name: s.name,
    kind: s.kind,
    heatCapacityJPerK: s.heatCapacityJPerK ?? d.heatCapacityJPerK,
    lossWPerK: s.lossWPerK ?? d.lossWPerK,
    solarApertureM2: s.solarApertureM2 ?? d.solarApertureM2,
    setpointC: heated ? (s.setpointC ?? d.setpointC ?? null) : null,
    heatingPowerW: heated ? (s.heatingPowerW ?? d.heatingPowerW ?? null) : null,
  };
}

/** A new shelter (or a whole shelter after a change): thermal values optional, prefilled from the kind. */
export const shelterSchema = z.object(shelterFields).superRefine(checkShelter).transform(completeShelter);

/** A change to a shelter: any of its fields. The handler merges it with the stored shelter and checks the whole with shelterSchema. */
export const shelterUpdateSchema = z
  .object({
    name: nameSchema.optional(),
    kind: shelterFields.kind.optional(),
    heatCapacityJPerK: shelterFields.heatCapacityJPerK,
    lossWPerK: shelterFields.lossWPerK,
    solarApertureM2: shelterFields.solarApertureM2,
    setpointC: shelterFields.setpointC,
    heatingPowerW: shelterFields.heatingPowerW,
    archived: z.boolean().optional(),
  })
  .strict()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Nothing to change.', path: ['name'] });
export type ShelterUpdate = z.infer<typeof shelterUpdateSchema>;

// ---------------------------------------------------------------------------------------------
// Airfields

export const airfieldCreateSchema = z.object({
  ...airfieldFields,
  /** Shelters created with the airfield, in the same transaction. */
  shelters: z
    .array(shelterSchema)
    .max(MAX_SHELTERS_PER_REQUEST, `Add at most ${MAX_SHELTERS_PER_REQUEST} shelters at once.`)
    .default([]),
});
export type AirfieldCreate = z.infer<typeof airfieldCreateSchema>;

export const airfieldUpdateSchema = z
  .object({
    name: airfieldFields.name.optional(),
    ident: airfieldFields.ident.optional(),
    latitude: airfieldFields.latitude.optional(),
    longitude: airfieldFields.longitude.optional(),
    elevationM: airfieldFields.elevationM.optional(),
    timeZone: airfieldFields.timeZone.optional(),
    archived: z.boolean().optional(),
  })
  .strict()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Nothing to change.', path: ['name'] });
export type AirfieldUpdate = z.infer<typeof airfieldUpdateSchema>;

export const airfieldListQuery = z.object({
  /** "1": include archived airfields. */
  archived: z.enum(['0', '1']).optional(),
  /** "tonight": add each airfield's forecast low for tonight (refreshing forecasts older than an hour). */
  forecast: z.enum(['none', 'tonight']).optional(),
});
