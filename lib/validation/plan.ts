// The plan contract (CLI `npm run plan`, POST /api/v1/plans): the simulate contract without
// `heaters` (the planner chooses them), plus `plan`. Every issue carries the path of its field
// (e.g. ["plan", "heater", "node"]).
import { z } from 'zod';
import { finiteNumber, isoDateTime, simulationInputSchema } from './simulation';

export const MAX_TARIFF_PERIODS = 1_000;
export const MAX_PLAN_SLOTS = 2_000;

// Field schemas of the simulate contract, reused so both contracts word their errors alike.
const S = simulationInputSchema.shape;
const iso = isoDateTime;
const temp = S.outside.element.shape.tempC;
const nodeName = S.engine.shape.nodes.element.shape.name;
const ms = (s: string) => Date.parse(s);

const tariffPeriod = z.strictObject({ from: iso, to: iso, pricePerKWh: finiteNumber(0, 1e4, 'a price per kWh') });

export const planSchema = z.strictObject({
  departure: iso,
  readyC: temp,
  heater: z.strictObject({
    node: nodeName,
    powerW: finiteNumber(0, 1e6, 'a power in W').refine((v) => v > 0, 'Must be greater than 0.'),
  }),
  tariff: z
    .array(tariffPeriod, { error: (iss) => (iss.input === undefined ? 'Required.' : 'Must be an array of { from, to, pricePerKWh } periods.') })
    .min(1, 'Give at least one period, or leave the tariff out for a flat price.')
    .max(MAX_TARIFF_PERIODS, `At most ${MAX_TARIFF_PERIODS} periods.`)
    .optional(),
  /** A flat price per kWh when there is no tariff: costs are then reported. */
  flatPricePerKWh: finiteNumber(0, 1e4, 'a price per kWh').optional(),
  floorC: temp.optional(),
  mode: z.enum(['least-cost', 'single-start'], {
    error: (iss) => (iss.input === undefined ? 'Required: "least-cost" or "single-start".' : `Must be "least-cost" or "single-start", not ${JSON.stringify(iss.input)}.`),
  }),
  slotMinutes: finiteNumber(1, 240, 'a number of minutes').optional(),
  /** The step a switch-on may be set to inside a slot (default 1 minute; = slotMinutes for a pure slot grid). */
  switchOnStepMinutes: finiteNumber(0.1, 240, 'a number of minutes').optional(),
  earliestSwitchOn: iso.optional(),
  now: iso.optional(),
  /** When the forecast was issued (default: now, else start), for its error's lead time. */
  forecastIssuedAt: iso.optional(),
  /** The "on N hours before departure" rules to compare against (default 1, 2, 3, 4). */
  baselineHours: z.array(finiteNumber(0.1, 168, 'a number of hours')).max(24, 'At most 24 rules.').optional(),
  /** Per-hour forecast errors correlated over this many hours (default: one uniform shift). */
  correlationHours: finiteNumber(0, 1000, 'a number of hours').optional(),
  /** Plan for this chance of being ready (0.5–0.999) instead of the forecast's best guess. */
  targetProbability: finiteNumber(0.5, 0.999, 'a probability').optional(),
  /** The start window after departure, minutes (default 0: judged at departure only; the app passes its setting). */
  holdMinutes: finiteNumber(0, 240, 'a number of minutes').optional(),
  /** The engine-mass threshold, °C (needs an "engine" node): readiness needs it too over the window. */
  engineReadyC: temp.optional(),
}, {
  error: (iss) =>
    iss.input === undefined ? 'Required: { departure, readyC, heater: { node, powerW }, mode }.' : 'Must be an object { departure, readyC, heater, mode, … }.',
});

export const planInputSchema = simulationInputSchema
  .safeExtend({
    heaters: z
      .undefined({ error: 'A plan request takes no "heaters": the planner chooses when the heater runs (give it under plan.heater).' })
      .optional(),
    plan: planSchema,
  })
  .superRefine((v, ctx) => {
    const start = ms(v.start);
    const end = ms(v.end);
    const p = v.plan;
    const dep = ms(p.departure);
    const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: 'custom', path: ['plan', ...path], message });
    if (dep < start || dep > end) issue(['departure'], `Must lie within the run, from start (${v.start}) to end (${v.end}).`);
    if (p.heater.node === 'engine' && !v.engine.nodes.some((n) => n.name === 'engine')) {
      issue(['heater', 'node'], 'No "engine" node in engine.nodes: the one-node form heats "oil".');
    }
    if (p.engineReadyC !== undefined && !v.engine.nodes.some((n) => n.name === 'engine')) {
      issue(['engineReadyC'], 'No "engine" node in engine.nodes: an engine-mass threshold needs the two-node form.');
    }
    const now = p.now !== undefined ? ms(p.now) : undefined;
    if (now !== undefined && now > dep) issue(['now'], 'Must not be after departure: there is nothing left to plan.');
    let earliest = Math.max(start, now ?? start);
    if (p.earliestSwitchOn !== undefined) {
      earliest = ms(p.earliestSwitchOn);
      if (earliest < start || earliest > dep) issue(['earliestSwitchOn'], 'Must lie between the run start and departure.');
    }
    const slotMin = p.slotMinutes ?? 5;
    const slots = Math.ceil((dep - earliest) / (slotMin * 60_000));
    if (slots > MAX_PLAN_SLOTS) {
      issue(['slotMinutes'], `Gives ${slots.toLocaleString('en-US')} slots from the earliest switch-on to departure; at most ${MAX_PLAN_SLOTS.toLocaleString('en-US')}: raise slotMinutes.`);
    }
    if (p.tariff) {
      const order = p.tariff.map((t, i) => ({ i, from: ms(t.from), to: ms(t.to) }));
      order.forEach((t) => {
        if (!(t.to > t.from)) issue(['tariff', t.i, 'to'], 'Must be after from.');
      });
      order.sort((a, b) => a.from - b.from);
      for (let k = 1; k < order.length; k++) {
        if (order[k].from < order[k - 1].to) {
          issue(['tariff', order[k].i, 'from'], `Overlaps tariff period ${order[k - 1].i}.`);
          return;
        }
      }
      // Every moment from the earliest switch-on to departure needs a price.
      let covered = earliest;
      for (const t of order) {
        if (t.from > covered && covered < dep) break;
        covered = Math.max(covered, t.to);
      }
      if (covered < dep && dep > earliest) {
        issue(['tariff'], `Must cover the earliest switch-on to departure; nothing covers ${new Date(covered).toISOString()}.`);
      }
    }
  });

/** The contract after validation. */
export type PlanInput = z.output<typeof planInputSchema>;
