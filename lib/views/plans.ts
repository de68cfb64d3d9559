// Heat-plan view types shared by the data layer and client components. Type-only: no I/O.
import type { Readiness } from '@/lib/plans/state';

export interface PlanView {
  departureId: number;
  departAt: string;
  readyC: number;
  floorC: number | null;
  /** Start window, minutes: leave the heater on until just before start; unplug before start. */
  holdMinutes: number;
  /** The start window as planned: until when, and the lowest oil (and engine mass) over it. */
  hold: { until: string; minOilC: number; minEngineC: number | null; heaterOn: boolean } | null;
  notes: string;
  aircraft: { id: number; registration: string; typeLabel: string; engineClassLabel: string; coverOnByDefault: boolean };
  pilot: { id: number; name: string };
  airfield: { id: number; name: string; ident: string; timeZone: string } | null;
  shelter: { name: string; kind: string } | null;
  heater: { kind: string; kindLabel: string; powerW: number; control: string } | null;
  status: Readiness;
  /** What the status means in a few words. */
  summary: string;
  mode: 'least-cost' | 'single-start' | null;
  switchOnAt: string | null;
  heaterOn: { from: string; to: string }[];
  oilAtDepartureC: number | null;
  freeOilAtDepartureC: number | null;
  probabilityReady: number | null;
  energyKWh: number;
  cost: number | null;
  currency: string;
  fix: { readyAt: string | null; powerNeededW: number | null } | null;
  baselines: { rule: string; hours?: number; energyKWh: number; cost: number | null; oilAtDepartureC: number; meetsReady: boolean; savedKWh: number; savedCost: number | null }[];
  floor: { minOilC: number; met: boolean } | null;
  confirmed: { by: string; at: string } | null;
  computedAt: string;
  forecast: { fetchedAt: string | null; stale: boolean } | null;
  /** The chance's sources (σ of the oil at departure, K) and the organization's aim; null without a plan. */
  chance: { target: number; meetsTarget: boolean; forecastK: number; aircraftK: number; heaterK: number; outcomesK: number; biasK: number; coverDropK: number; coverOffProbability: number } | null;
  /** Frost on the airframe before departure (aircraft outside only; null under a roof or without a forecast). */
  frost: { likely: boolean; hours: number; from: string | null; to: string | null } | null;
  problem?: string;
  /** The ready temperature was lowered to the aircraft's figure: who and when (the caution to follow the manual goes with it). */
  readyLowered: { by: string; at: string } | null;
  /** Heater set-ups that mislead (a tank pad alone on a dry sump), with a suggestion. */
  warnings: { code: string; text: string; suggestion: string }[];
}
