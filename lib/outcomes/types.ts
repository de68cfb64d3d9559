// Shapes of Morning outcomes as the pages and the API see them (plain data; safe for client bundles).

export interface OutcomeView {
  departureId: number;
  flown: boolean;
  /** Oil temperature shown at start, °C (null when not flown). */
  oilAtStartC: number | null;
  recordedBy: { id: number; name: string } | null;
  recordedAt: string;
  /** The plan's snapshot when recorded. */
  predictedOilC: number | null;
  probabilityReady: number | null;
  readyC: number;
  energyKWh: number | null;
  usualEnergyKWh: number | null;
  notes: string;
}

/** A departure whose morning may be recorded, with what its plan predicted and any outcome so far. */
export interface OutcomeEntry {
  departureId: number;
  departAt: string;
  timeZone: string;
  aircraft: { id: number; registration: string };
  pilot: { id: number; name: string };
  readyC: number;
  /** The stored plan's predicted oil at departure, °C (the entry's prefill). */
  predictedOilC: number | null;
  probabilityReady: number | null;
  outcome: OutcomeView | null;
}
