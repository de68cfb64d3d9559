// Scenarios for the local fake forecast service: JSON files in data/scenarios/NAME.json that pull the
// seasonal model towards a chosen situation (the demo's cold snap). Windows are relative to the
// request's "now" (or to local solar midnight of now's day), so a demo always shows them on the
// coming nights.
import fs from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import { smoothstep, type WeatherNudge } from './climate';

const HOUR_MS = 3_600_000;
const DAY_MS = 86_400_000;

export const SCENARIO_NAME_RE = /^[a-z0-9-]{1,64}$/;

const HourWindow = z
  .tuple([z.number().min(-24 * 40).max(24 * 40), z.number().min(-24 * 40).max(24 * 40)])
  .refine(([a, b]) => b > a, { message: 'window end must be after its start' });

export const ScenarioEventSchema = z
  .object({
    label: z.string().max(200).optional(),
    /** [start, end] in hours from the request's now. */
    offsetHoursFromNow: HourWindow.optional(),
    /** [start, end] in hours from local solar midnight starting now's day at the site (stable all day). */
    offsetHoursFromLocalMidnight: HourWindow.optional(),
    /** Temperature shift at full strength, K. */
    deltaK: z.number().min(-40).max(40),
    /** Cloud cover at full strength, fraction 0..1. */
    cloud: z.number().min(0).max(1).optional(),
    /** Wind at full strength, m/s. */
    windMps: z.number().min(0).max(60).optional(),
    /** Hours over which the effect fades in after the start and out before the end. */
    rampHours: z.number().min(0).max(48).default(6),
  })
  .strict()
  .refine((e) => (e.offsetHoursFromNow === undefined) !== (e.offsetHoursFromLocalMidnight === undefined), {
    message: 'give exactly one of offsetHoursFromNow and offsetHoursFromLocalMidnight',
  });

export const ScenarioSchema = z
  .object({
    description: z.string().max(2000).optional(),
    events: z.array(ScenarioEventSchema).max(20),
  })
  .strict();

export type Scenario = z.infer<typeof ScenarioSchema>;
export type ScenarioEvent = z.infer<typeof ScenarioEventSchema>;

export class ScenarioError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'ScenarioError';
  }
}

function scenarioDir(): string {
  return path.join(process.cwd(), 'data/scenarios');
}

/** Read and validate data/scenarios/NAME.json. Throws ScenarioError for a bad name, a missing file or bad content. */
export function loadScenario(name: string): Scenario {
  if (!SCENARIO_NAME_RE.test(name)) {
    throw new ScenarioError(`scenario name must match ${SCENARIO_NAME_RE}: ${JSON.stringify(name.slice(0, 80))}`);
  }
  let text: string;
  try {
    text = fs.readFileSync(path.join(scenarioDir(), `${name}.json`), 'utf8');
  } catch (e) {
    throw new ScenarioError(`unknown scenario "${name}"`, { cause: e });
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    throw new ScenarioError(`scenario "${name}" is not valid JSON`, { cause: e });
  }
  const parsed = ScenarioSchema.safeParse(json);
  if (!parsed.success) {
    throw new ScenarioError(`scenario "${name}" is invalid: ${z.prettifyError(parsed.error)}`, { cause: parsed.error });
  }
  return parsed.data;
}

/** Names of the scenario files present, sorted. */
export function listScenarios(): string[] {
  try {
    return fs
      .readdirSync(scenarioDir())
      .filter((f) => f.endsWith('.json'))
      .map((f) => f.slice(0, -5))
      .filter((n) => SCENARIO_NAME_RE.test(n))
      .sort();
  } catch {
    return [];
  }
}

/** Epoch ms of the event window's [start, end] for a request made at `nowMs` at a site's longitude. */
export function eventWindowMs(event: ScenarioEvent, nowMs: number, longitude: number): [number, number] {
  if (event.offsetHoursFromNow) {
    const [a, b] = event.offsetHoursFromNow;
    return [nowMs + a * HOUR_MS, nowMs + b * HOUR_MS];
  }
  const [a, b] = event.offsetHoursFromLocalMidnight!;
  const solarShift = (longitude / 15) * HOUR_MS;
  const midnight = Math.floor((nowMs + solarShift) / DAY_MS) * DAY_MS - solarShift;
  return [midnight + a * HOUR_MS, midnight + b * HOUR_MS];
}

/** Strength 0..1 of one event at instant `ms`: smooth ramps inside the window's ends. */
export function eventWeight(event: ScenarioEvent, ms: number, nowMs: number, longitude: number): number {
  const [start, end] = eventWindowMs(event, nowMs, longitude);
  if (ms <= start || ms >= end) return 0;
  const ramp = event.rampHours * HOUR_MS;
  if (ramp === 0) return 1;
  return smoothstep((ms - start) / ramp) * smoothstep((end - ms) / ramp);
}

/** The scenario's nudges on the weather at instant `ms`, in the events' order. */
export function scenarioNudges(
  scenario: Scenario | undefined,
  ms: number,
  nowMs: number,
  longitude: number,
): WeatherNudge[] {
  if (!scenario) return [];
  const out: WeatherNudge[] = [];
  for (const e of scenario.events) {
    const weight = eventWeight(e, ms, nowMs, longitude);
    if (weight > 0) out.push({ weight, deltaK: e.deltaK, cloudFraction: e.cloud, windMps: e.windMps });
  }
  return out;
}
