// The simulate contract (CLI `npm run simulate`, POST /api/v1/simulations): one zod schema.
// Every issue carries the path of its field (e.g. ["outside", 3, "tempC"]).
import { z } from 'zod';
import { text } from './text';

export const MAX_OUTSIDE_POINTS = 10_000;
export const MAX_OUTPUT_POINTS = 100_000;
export const MAX_SERIES_POINTS = 10_000;
export const MAX_HEATERS = 1_000;
export const MAX_SPAN_DAYS = 31;

function describe(v: unknown): string {
  if (v === null) return 'null';
  if (typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean') return JSON.stringify(v) ?? String(v);
  return Array.isArray(v) ? 'an array' : typeof v;
}

/** A finite number in [min, max]; NaN, ±Infinity and non-numbers get one clear message. Shared by other contracts. */
export function finiteNumber(min: number, max: number, what = 'a number') {
  return z
    .number({
      error: (iss) =>
        iss.input === undefined
          ? 'Required.'
          : typeof iss.input === 'number' || iss.input === 'NaN' || iss.input === 'Infinity' || iss.input === '-Infinity'
            ? `Must be a finite number, not ${String(iss.input)}.`
            : `Must be ${what}, not ${describe(iss.input)}.`,
    })
    .min(min, `Must be at least ${min}.`)
    .max(max, `Must be at most ${max}.`);
}
const num = finiteNumber;
const positive = (max: number) => num(0, max).refine((v) => v > 0, 'Must be greater than 0.');
const temp = num(-100, 250, 'a temperature in °C');

/** ISO-8601 date-time with a zone: minutes or seconds (fractions allowed), "Z" or ±hh:mm / ±hhmm. */
const ISO_DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:?\d{2})$/;
function isIsoDateTime(v: string): boolean {
  if (!ISO_DATE_TIME.test(v) || !Number.isFinite(Date.parse(v))) return false;
  const [y, m, d] = v.slice(0, 10).split('-').map(Number);
  const day = new Date(Date.UTC(y, m - 1, d));
  return day.getUTCMonth() === m - 1 && day.getUTCDate() === d; // no 30 February
}
/** An ISO-8601 date-time string with a zone (Z or an offset); shared by other contracts. */
export const isoDateTime = text({ error: (iss) => (iss.input === undefined ? 'Required.' : `Must be an ISO-8601 date-time string, not ${describe(iss.input)}.`) })
  .refine(isIsoDateTime, {
    error: (iss) => `Must be an ISO-8601 date-time with a zone, e.g. "2025-01-15T18:00:00Z" (got ${describe(iss.input)}).`,
  });

const iso = isoDateTime;

const nodeName = z.enum(['oil', 'engine'], {
  error: (iss) => (iss.input === undefined ? 'Required.' : `Unknown node ${describe(iss.input)}: must be "oil" or "engine".`),
});

const tooMany = (max: number, what: string) => (iss: { input?: unknown }) =>
  Array.isArray(iss.input) ? `At most ${max.toLocaleString('en-US')} ${what} (got ${iss.input.length.toLocaleString('en-US')}).` : undefined;

const outsidePoint = z.strictObject({ at: iso, tempC: temp, dewPointC: temp.optional() });
const windPoint = z.strictObject({ at: iso, mps: num(0, 100, 'a speed in m/s') });
const cloudPoint = z.strictObject({ at: iso, fraction: num(0, 1, 'a fraction 0..1') });

const node = z.strictObject({
  name: nodeName,
  heatCapacityJPerK: positive(1e12),
  lossWPerK: num(0, 1e9),
  initialTempC: temp,
});

const tieDown = z.strictObject({ kind: z.literal('tie-down') });
const hangar = z.strictObject({
  kind: z.literal('hangar'),
  heatCapacityJPerK: positive(1e15),
  lossWPerK: positive(1e12),
  initialTempC: temp.optional(),
  /** A heated hangar: the thermostat holds setpointC with up to heatingPowerW. */
  setpointC: temp.optional(),
  heatingPowerW: num(0, 1e9).optional(),
  /** a·A, m²: solar gain W = a·A × global horizontal irradiance (needs `site`). */
  solarApertureM2: num(0, 1e6).optional(),
});

const heater = z.strictObject({
  node: nodeName,
  powerW: num(0, 1e7),
  from: iso,
  to: iso,
  /** Free text for the caller's own use, e.g. "oil-pad". */
  kind: text().max(40).optional(),
});

const ms = (s: string) => Date.parse(s);

function increasing(pts: readonly { at: string }[], field: string, ctx: z.RefinementCtx) {
  for (let i = 1; i < pts.length; i++) {
    if (!(ms(pts[i].at) > ms(pts[i - 1].at))) {
      ctx.addIssue({ code: 'custom', path: [field, i, 'at'], message: `Must be later than ${field}[${i - 1}].at: points go in time order.` });
      return;
    }
  }
}

export const simulationInputSchema = z
  .strictObject({
    start: iso,
    end: iso,
    outputEveryMinutes: positive(1e6),
    outside: z
      .array(outsidePoint, { error: (iss) => (iss.input === undefined ? 'Required.' : 'Must be an array of { at, tempC } points.') })
      .min(1, 'Give at least one outside temperature point.')
      .max(MAX_OUTSIDE_POINTS, { error: tooMany(MAX_OUTSIDE_POINTS, 'outside points') }),
    shelter: z.discriminatedUnion('kind', [tieDown, hangar], {
      error: (iss) =>
        iss.input === undefined ? 'Required.' : 'Must be { "kind": "tie-down" } or { "kind": "hangar", heatCapacityJPerK, lossWPerK }.',
    }),
    engine: z.strictObject({
      nodes: z
        .array(node, { error: (iss) => (iss.input === undefined ? 'Required: give the "oil" node, and optionally "engine".' : 'Must be an array of nodes.') })
        .min(1, 'Give at least one node: "oil" (one-node form) or "oil" and "engine".')
        .max(2, 'At most two nodes: "oil" and "engine".'),
      couplingWPerK: num(0, 1e9).optional(),
      /** Multiplier on the loss coefficients when `cover` is true (default 0.5). */
      coverFactor: num(0, 1).refine((v) => v > 0, 'Must be greater than 0.').optional(),
      /** k in G(v) = G0·(1 + k·√v) on a tie-down (default 0.45). */
      windCoefficient: num(0, 100).optional(),
    }),
    heaters: z.array(heater).max(MAX_HEATERS, { error: tooMany(MAX_HEATERS, 'heaters') }).optional(),
    cover: z.boolean().optional(),
    site: z.strictObject({ lat: num(-90, 90, 'a latitude'), lon: num(-180, 180, 'a longitude') }).optional(),
    wind: z.array(windPoint).max(MAX_SERIES_POINTS, { error: tooMany(MAX_SERIES_POINTS, 'wind points') }).optional(),
    cloud: z.array(cloudPoint).max(MAX_SERIES_POINTS, { error: tooMany(MAX_SERIES_POINTS, 'cloud points') }).optional(),
    /** Report the first time the oil crosses this temperature. */
    crossingC: temp.optional(),
  })
  .superRefine((v, ctx) => {
    const start = ms(v.start);
    const end = ms(v.end);
    if (!(end > start)) {
      ctx.addIssue({ code: 'custom', path: ['end'], message: `Must be after start (${v.start}).` });
    } else if (end - start > MAX_SPAN_DAYS * 86_400_000) {
      ctx.addIssue({ code: 'custom', path: ['end'], message: `The run may span at most ${MAX_SPAN_DAYS} days.` });
    } else {
      const step = v.outputEveryMinutes * 60_000;
      const points = Math.floor((end - start) / step + 1e-9) + 1 + ((end - start) % step > 1e-6 ? 1 : 0);
      if (points > MAX_OUTPUT_POINTS) {
        ctx.addIssue({
          code: 'custom',
          path: ['outputEveryMinutes'],
          message: `Gives ${points.toLocaleString('en-US')} output points; at most ${MAX_OUTPUT_POINTS.toLocaleString('en-US')}: raise outputEveryMinutes or shorten the run.`,
        });
      }
    }
    increasing(v.outside, 'outside', ctx);
    if (v.wind) increasing(v.wind, 'wind', ctx);
    if (v.cloud) increasing(v.cloud, 'cloud', ctx);

    const names = v.engine.nodes.map((n) => n.name);
    names.forEach((name, i) => {
      if (names.indexOf(name) !== i) ctx.addIssue({ code: 'custom', path: ['engine', 'nodes', i, 'name'], message: `Duplicate node "${name}".` });
    });
    if (!names.includes('oil')) {
      ctx.addIssue({ code: 'custom', path: ['engine', 'nodes'], message: 'Needs a node named "oil" (the one-node form is "oil" alone).' });
    }
    (v.heaters ?? []).forEach((h, i) => {
      if (!names.includes(h.node)) {
        ctx.addIssue({ code: 'custom', path: ['heaters', i, 'node'], message: `No "${h.node}" node in engine.nodes for this heater.` });
      }
      if (!(ms(h.to) > ms(h.from))) ctx.addIssue({ code: 'custom', path: ['heaters', i, 'to'], message: 'Must be after from.' });
    });
    if (v.shelter.kind === 'hangar') {
      const s = v.shelter;
      if ((s.setpointC === undefined) !== (s.heatingPowerW === undefined)) {
        ctx.addIssue({
          code: 'custom',
          path: ['shelter', s.setpointC === undefined ? 'setpointC' : 'heatingPowerW'],
          message: 'A heated hangar needs both setpointC and heatingPowerW.',
        });
      }
    }
  });

/** The contract as received (before validation). */
export type SimulationRequest = z.input<typeof simulationInputSchema>;
/** The contract after validation: what `runSimulation` takes. */
export type SimulationInput = z.output<typeof simulationInputSchema>;
