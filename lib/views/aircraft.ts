// Aircraft types shared by the models, the data layer and client components. Type-only: no I/O.
import type { HeaterControl } from '@/lib/validation/aircraft';
import type { ShelterKind } from '@/lib/validation/airfields';

/** Thermal parameters of the engine: one node (oil and engine together) or two (oil; engine mass). */
export interface ThermalParams {
  nodes: { name: 'oil' | 'engine'; heatCapacityJPerK: number; lossWPerK: number }[];
  couplingWPerK?: number;
  /** Loss coefficients are multiplied by this when the cover is on (0 < f ≤ 1). */
  coverFactor: number;
  /** k in G(v) = G0·(1 + k·√v) on an open tie-down. */
  windCoefficient?: number;
  source: 'preset' | 'manual' | 'fitted';
}

export interface HeaterRecord {
  id: number;
  kind: string;
  kindLabel: string;
  powerW: number;
  node: 'oil' | 'engine';
  control: HeaterControl;
  slotMinutes: number;
}

export interface ShelterRef {
  id: number;
  name: string;
  kind: ShelterKind;
  heatCapacityJPerK: number;
  lossWPerK: number;
  solarApertureM2: number;
  setpointC: number | null;
  heatingPowerW: number | null;
}

export interface AirfieldRef {
  id: number;
  name: string;
  ident: string;
  latitude: number;
  longitude: number;
  elevationM: number;
  /** IANA zone: every time at this airfield is shown in it. */
  timeZone: string;
}

export interface AircraftRecord {
  id: number;
  registration: string;
  typeLabel: string;
  engineClass: string;
  engineClassLabel: string;
  oilQuantityL: number;
  thermal: ThermalParams;
  coverOnByDefault: boolean;
  shelter: ShelterRef | null;
  airfield: AirfieldRef | null;
  heaters: HeaterRecord[];
  pilots: { id: number; name: string }[];
  pilotIds: number[];
  /** As entered (ISO) or null when nobody entered one. */
  lastShutdownAt: string | null;
  /** As entered, or null: then the class's typical value (`classDefaults.shutdownOilC`) applies. */
  lastShutdownOilC: number | null;
  /** The engine class's typical values: ready temperature, oil at shutdown, oil quantity. */
  classDefaults: { readyC: number; shutdownOilC: number; oilL: number; engineReadyC: number | null; readinessOil: 'oil' | 'engine' };
  /** The aircraft's engine-mass threshold as entered, or null: then classDefaults.engineReadyC (estimate). */
  engineReadyC: number | null;
  /** The maker's rule in force: the aircraft's own figures where entered, else the class's (estimate: true). */
  makerRule: { preheatBelowC: number; soakHours: number; minStartOilC: number; estimate: boolean } | null;
  /** Heater set-ups that mislead (a tank pad alone on a dry sump), with a suggestion. */
  heaterWarnings: { code: string; text: string; suggestion: string }[];
  oilChangeIntervalHours: number | null;
  oilChangeIntervalMonths: number | null;
  archived: boolean;
  updatedAt: string;
}

export interface ShelterChoice {
  airfield: { id: number; name: string; ident: string; timeZone: string };
  shelters: { id: number; name: string; kind: ShelterKind }[];
}

export interface PilotChoice {
  id: number;
  name: string;
  email: string;
  /** The aircraft this pilot is listed on (the booking form warns when another is chosen). */
  aircraftIds: number[];
}

export interface EngineClassOption {
  id: string;
  label: string;
  oilQuantityL: number;
  readyC: number;
  shutdownOilC: number;
  heaters: { kind: string; powerW: number; node: 'oil' | 'engine' }[];
  thermal: ThermalParams;
}
