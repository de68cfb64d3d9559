// Pure: turns stored records (plain data) into the soak model and the planner's request.
// No database, network or clock: the caller passes `nowMs` and the forecast hours.
import type { ForecastHour } from '@/lib/weather/types';
import { toSoakInputs } from '@/lib/weather/derive';
import type { ErrorModel } from '@/lib/planner/chance';
import { ENGINE_CLASSES, engineThresholdFor, type EngineClassId } from '@/lib/thermal/presets';
import { outsideAt, type SoakModel } from '@/lib/thermal';
import type { PlanMode, PlannedHeater, PlanRequest, TariffPeriod } from '@/lib/planner/types';
import { oneControl } from '@/lib/planner/joint';
import { COMBUSTION_HEATER_KINDS } from '@/lib/devices/commands';

const HOUR = 3_600_000;
/** How long before departure the model starts at the latest (a longer-parked engine is cold-soaked). */
export const MAX_SOAK_HOURS = 72;
/** The Soak forecast runs on past departure, so the chart shows the morning. */
export const AFTER_DEPARTURE_HOURS = 1.5;

export type HeaterControl = 'timer' | 'relay' | 'manual';

export interface PlanRecords {
  departure: { id: number; departAtMs: number; readyC: number; floorC: number | null; /** Start window, minutes (default 0). */ holdMinutes?: number };
  aircraft: {
    engineClass: string;
    thermal: {
      nodes: { name: 'oil' | 'engine'; heatCapacityJPerK: number; lossWPerK: number }[];
      couplingWPerK?: number;
      coverFactor: number;
      windCoefficient?: number;
    };
    coverOnByDefault: boolean;
    lastShutdownAtMs: number | null;
    lastShutdownOilC: number | null;
    /** The aircraft's engine-mass threshold, °C (null or absent: the class's, estimate). */
    engineReadyC?: number | null;
    /** The maker's rule in force (the aircraft's figures, else the class's estimate); absent: none. */
    makerRule?: { preheatBelowC: number; soakHours: number; minStartOilC: number; estimate: boolean } | null;
  };
  heaters: { kind: string; powerW: number; node: 'oil' | 'engine'; control: HeaterControl; slotMinutes: number }[];
  shelter: { kind: string; heatCapacityJPerK: number; lossWPerK: number; setpointC: number | null; heatingPowerW: number | null; solarApertureM2: number } | null;
  site: { lat: number; lon: number };
  hours: readonly ForecastHour[];
  tariff: TariffPeriod[];
  forecastIssuedAtMs: number | null;
  /** Plan to be ready with this chance, counting these error sources (lib/planner/chance.ts); absent: the forecast's best guess. */
  chance?: { target: number; errors: ErrorModel };
}

/** The heater the plan drives: the strongest one fitted. */
export function primaryHeater<H extends { powerW: number }>(heaters: readonly H[]): H | null {
  return [...heaters].sort((a, b) => b.powerW - a.powerW)[0] ?? null;
}

/** A relay can follow the least-cost slots; a plain timer, or a heater switched by hand, goes on once and stays on to departure. */
export function modeFor(control: HeaterControl, kind?: string): PlanMode {
  // A combustion heater is attended only: never a relay's slot schedule, one attended block at most.
  if (kind !== undefined && COMBUSTION_HEATER_KINDS.includes(kind)) return 'single-start';
  return control === 'relay' ? 'least-cost' : 'single-start';
}

/**
 * The soak model from the last shutdown (or, for an engine parked longer than MAX_SOAK_HOURS, from that
 * far back with the oil at the outside air — cold-soaked) to a little after departure.
 */
export function soakModelFor(r: PlanRecords): SoakModel {
  const inputs = toSoakInputs(r.hours);
  if (!inputs.outside.length) throw new Error('no forecast hours');
  const dep = r.departure.departAtMs;
  const preset = ENGINE_CLASSES[r.aircraft.engineClass as EngineClassId];
  const earliest = dep - MAX_SOAK_HOURS * HOUR;
  const shutdown = r.aircraft.lastShutdownAtMs;
  const fresh = shutdown !== null && shutdown >= earliest && shutdown < dep;
  const startMs = fresh ? shutdown! : Math.max(earliest, inputs.outside[0].atMs);
  const outsideAtStart = outsideAt(inputs.outside, startMs);
  const oilC = fresh ? (r.aircraft.lastShutdownOilC ?? preset?.shutdownOilC ?? 80) : outsideAtStart;
  const engineC = fresh ? (preset?.shutdownEngineC ?? oilC) : outsideAtStart;
  const oilNode = r.aircraft.thermal.nodes.find((n) => n.name === 'oil') ?? r.aircraft.thermal.nodes[0];
  const engineNode = r.aircraft.thermal.nodes.find((n) => n.name === 'engine');
  const s = r.shelter;
  const heated = s?.kind === 'heated-hangar' && s.setpointC !== null && (s.heatingPowerW ?? 0) > 0;
  const shelter: SoakModel['shelter'] =
    !s || s.kind === 'tie-down' || !(s.heatCapacityJPerK > 0)
      ? { kind: 'tie-down' }
      : {
          kind: 'hangar',
          heatCapacityJPerK: s.heatCapacityJPerK,
          lossWPerK: s.lossWPerK,
          solarApertureM2: s.solarApertureM2,
          ...(heated ? { setpointC: s.setpointC!, heatingPowerW: s.heatingPowerW! } : {}),
        };
  return {
    startMs,
    // On past departure through the start window and a little beyond, so the chart shows the hold.
    endMs: dep + Math.max(AFTER_DEPARTURE_HOURS * HOUR, ((r.departure.holdMinutes ?? 0) + 30) * 60_000),
    outside: inputs.outside,
    wind: inputs.wind,
    cloud: inputs.cloud,
    site: r.site,
    shelter,
    oil: { heatCapacityJPerK: oilNode.heatCapacityJPerK, lossWPerK: oilNode.lossWPerK, initialTempC: oilC },
    ...(engineNode ? { engine: { heatCapacityJPerK: engineNode.heatCapacityJPerK, lossWPerK: engineNode.lossWPerK, initialTempC: engineC } } : {}),
    couplingWPerK: r.aircraft.thermal.couplingWPerK ?? 0,
    cover: r.aircraft.coverOnByDefault,
    coverFactor: r.aircraft.thermal.coverFactor,
    windCoefficient: r.aircraft.thermal.windCoefficient,
  };
}

/**
 * The heater the plan switches: the strongest one fitted and every heater on the same control with it,
 * as one schedule (their powers add, each on its own node). Heaters on other controls are not in this
 * schedule (lib/planner/joint.ts plans controls jointly; the stored plan keeps one control).
 */
export function plannedHeaterFor(r: PlanRecords, model: SoakModel): PlannedHeater | null {
  const primary = primaryHeater(r.heaters);
  if (!primary) return null;
  const node = (n: 'oil' | 'engine') => (n === 'engine' && !model.engine ? 'oil' : n);
  return oneControl(r.heaters.filter((h) => h.control === primary.control).map((h) => ({ node: node(h.node), powerW: h.powerW })));
}

/** The planner's request for a departure, or null when the aircraft has no heater. */
export function planRequestFor(r: PlanRecords, nowMs: number, model = soakModelFor(r)): PlanRequest | null {
  const heater = primaryHeater(r.heaters);
  if (!heater) return null;
  return {
    model,
    departureMs: r.departure.departAtMs,
    readyC: r.departure.readyC,
    ...(r.departure.floorC !== null ? { floorC: r.departure.floorC } : {}),
    heater: plannedHeaterFor(r, model)!,
    tariff: r.tariff,
    slotMinutes: heater.slotMinutes || 5,
    earliestSwitchOnMs: Math.max(model.startMs, Math.min(nowMs, r.departure.departAtMs)),
    mode: modeFor(heater.control, heater.kind),
    nowMs,
    forecastIssuedAtMs: r.forecastIssuedAtMs ?? nowMs,
    holdMinutes: r.departure.holdMinutes ?? 0,
    // The whole engine: the engine mass too (two-node models), at the aircraft's or the class's
    // threshold; for a dry sump the engine-side oil lies in the engine node, so at least readyC.
    ...(model.engine ? { engineReadyC: engineThresholdFor(r.aircraft.engineClass, r.departure.readyC, r.aircraft.engineReadyC) } : {}),
  };
}
