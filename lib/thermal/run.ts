// The simulate contract on top of the model: validated input in, plain JSON-ready output.
import type { SimulationInput } from '@/lib/validation/simulation';
import { firstCrossingOf, minimumOf } from './analysis';
import { frostFlags } from './frost';
import { compile, stepAt, type Plan } from './plan';
import { sampleStates } from './integrate';
import { sunElevationDeg } from './solar';
import type { SoakModel, SoakSeries } from './types';

export interface SimulationPoint {
  at: string;
  outsideC: number;
  shelterC: number;
  oilC: number;
  engineC: number | null;
}

export interface SimulationOutput {
  /** Start to end, every outputEveryMinutes, both ends included. Temperatures rounded to 0.0001 K. */
  series: SimulationPoint[];
  /** Engine-heater energy within [start, end], Wh. */
  energyWh: number;
  /** Lowest oil temperature on the continuous solution, and when. */
  minimum: { at: string; oilC: number };
  /** A heated hangar's space-heating energy, Wh (0 for other shelters). */
  shelterHeatingWh: number;
  /** When `crossingC` was given: the first time the oil reaches it (null: never within the run). */
  crossing?: { tempC: number; at: string | null };
  /** On a tie-down with dew points: the forecast hours when frost can form on the airframe. */
  frost?: { at: string; airC: number; surfaceC: number; frostPointC: number }[];
}

const ms = (iso: string) => Date.parse(iso);
const iso = (t: number) => new Date(Math.round(t)).toISOString();
const r4 = (v: number) => Math.round(v * 1e4) / 1e4;
const r3 = (v: number) => Math.round(v * 1e3) / 1e3;

/** The model for a validated simulate request. */
export function toSoakModel(input: SimulationInput): SoakModel {
  const oil = input.engine.nodes.find((n) => n.name === 'oil')!;
  const engine = input.engine.nodes.find((n) => n.name === 'engine');
  const node = (n: typeof oil) => ({ heatCapacityJPerK: n.heatCapacityJPerK, lossWPerK: n.lossWPerK, initialTempC: n.initialTempC });
  const sh = input.shelter;
  return {
    startMs: ms(input.start),
    endMs: ms(input.end),
    outside: input.outside.map((p) => ({ atMs: ms(p.at), tempC: p.tempC })),
    shelter:
      sh.kind === 'tie-down'
        ? { kind: 'tie-down' }
        : {
            kind: 'hangar',
            heatCapacityJPerK: sh.heatCapacityJPerK,
            lossWPerK: sh.lossWPerK,
            initialTempC: sh.initialTempC,
            setpointC: sh.setpointC,
            heatingPowerW: sh.heatingPowerW,
            solarApertureM2: sh.solarApertureM2,
          },
    oil: node(oil),
    engine: engine ? node(engine) : undefined,
    couplingWPerK: input.engine.couplingWPerK,
    cover: input.cover,
    coverFactor: input.engine.coverFactor,
    windCoefficient: input.engine.windCoefficient,
    wind: input.wind?.map((p) => ({ atMs: ms(p.at), mps: p.mps })),
    cloud: input.cloud?.map((p) => ({ atMs: ms(p.at), fraction: p.fraction })),
    site: input.site,
    heaters: (input.heaters ?? []).map((h) => ({ node: h.node, powerW: h.powerW, fromMs: ms(h.from), toMs: ms(h.to) })),
  };
}

/** Output times: start, start + Δ, … while before end, then end. */
export function outputTimes(startMs: number, endMs: number, everyMinutes: number): Float64Array {
  const step = everyMinutes * 60_000;
  const m = Math.floor((endMs - startMs) / step + 1e-9);
  const last = startMs + m * step;
  const extra = endMs - last > 1e-6 ? 1 : 0;
  const t = new Float64Array(m + 1 + extra);
  for (let k = 0; k <= m; k++) t[k] = startMs + k * step;
  if (t[m] > endMs) t[m] = endMs;
  if (extra) t[m + 1] = endMs;
  return t;
}

export function seriesOf(plan: Plan, times: Float64Array): SoakSeries {
  const outsideC = new Float64Array(times.length);
  const st = sampleStates(plan, times, outsideC);
  return {
    atMs: times,
    outsideC,
    shelterC: plan.iS >= 0 ? st[plan.iS] : outsideC,
    oilC: st[plan.iO],
    engineC: plan.iE >= 0 ? st[plan.iE] : null,
    heaterEnergyWh: plan.heaterEnergyWh,
    shelterHeatingWh: plan.shelterHeatingWh,
  };
}

/** Runs a validated simulate request and returns the contract's output. */
export function runSimulation(input: SimulationInput): SimulationOutput {
  const model = toSoakModel(input);
  const plan = compile(model);
  const s = seriesOf(plan, outputTimes(model.startMs, model.endMs, input.outputEveryMinutes));
  const series: SimulationPoint[] = new Array(s.atMs.length);
  for (let j = 0; j < s.atMs.length; j++) {
    series[j] = {
      at: iso(s.atMs[j]),
      outsideC: r4(s.outsideC[j]),
      shelterC: r4(s.shelterC[j]),
      oilC: r4(s.oilC[j]),
      engineC: s.engineC ? r4(s.engineC[j]) : null,
    };
  }
  const min = minimumOf(plan, plan.iO);
  const out: SimulationOutput = {
    series,
    energyWh: r3(plan.heaterEnergyWh),
    minimum: { at: iso(min.atMs), oilC: r4(min.value) },
    shelterHeatingWh: r3(plan.shelterHeatingWh),
  };
  if (input.crossingC !== undefined) {
    const at = firstCrossingOf(plan, plan.iO, input.crossingC);
    out.crossing = { tempC: input.crossingC, at: at === null ? null : iso(at) };
  }
  if (input.shelter.kind === 'tie-down') {
    const hours = input.outside
      .filter((p) => p.dewPointC !== undefined && ms(p.at) >= model.startMs && ms(p.at) <= model.endMs)
      .map((p) => {
        const t = ms(p.at);
        return {
          atMs: t,
          airC: p.tempC,
          dewPointC: p.dewPointC!,
          cloudFraction: stepAt(model.cloud, t, (c) => c.fraction, 0),
          windMps: stepAt(model.wind, t, (w) => w.mps, 0),
          sunElevationDeg: model.site ? sunElevationDeg(t, model.site.lat, model.site.lon) : undefined,
        };
      });
    if (hours.length) {
      out.frost = frostFlags(hours)
        .filter((f) => f.frost)
        .map((f) => ({ at: iso(f.atMs), airC: r4(f.airC), surfaceC: r4(f.surfaceC), frostPointC: r4(f.frostPointC) }));
    }
  }
  return out;
}
