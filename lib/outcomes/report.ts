// The Season report from Morning outcomes (pure): per aircraft and for the organization, predicted
// against recorded oil at start, the error's mean and spread, the bias estimate, how often the stated
// chance held, and the energy used against the usual rule (heater on all night).
import { estimateBias, reliability, summarizeErrors, type BiasEstimate, type ErrorSummary, type ReliabilityRow } from './stats';

export interface ReportOutcome {
  aircraftId: number;
  departAt: string;
  flown: boolean;
  oilAtStartC: number | null;
  predictedOilC: number | null;
  probabilityReady: number | null;
  readyC: number;
  energyKWh: number | null;
  usualEnergyKWh: number | null;
  thermalSource: string | null;
}

export interface ReportPoint {
  aircraftId: number;
  departAt: string;
  predictedC: number;
  recordedC: number;
  readyC: number;
  ready: boolean;
}

export interface ReportGroup {
  /** Mornings recorded, flown and not flown. */
  recorded: number;
  flown: number;
  notFlown: number;
  points: ReportPoint[];
  errors: ErrorSummary;
  /** Share of flown mornings (with a recorded temperature) that were ready at start. */
  readyShare: number | null;
  reliability: ReliabilityRow[];
  /** Energy of the plans of flown mornings with both figures, and the usual rule's for the same mornings, kWh. */
  energy: { mornings: number; plannedKWh: number; usualKWh: number };
}

export interface AircraftReport extends ReportGroup {
  aircraftId: number;
  registration: string;
  thermalSource: string | null;
  bias: BiasEstimate;
}

export interface SeasonReport {
  organization: ReportGroup;
  aircraft: AircraftReport[];
}

function group(outs: readonly ReportOutcome[]): ReportGroup {
  const flown = outs.filter((o) => o.flown);
  const points: ReportPoint[] = flown.flatMap((o) =>
    o.oilAtStartC !== null && o.predictedOilC !== null
      ? [{ aircraftId: o.aircraftId, departAt: o.departAt, predictedC: o.predictedOilC, recordedC: o.oilAtStartC, readyC: o.readyC, ready: o.oilAtStartC >= o.readyC }]
      : [],
  );
  const withTemp = flown.filter((o) => o.oilAtStartC !== null);
  const energyRows = flown.filter((o) => o.energyKWh !== null && o.usualEnergyKWh !== null);
  return {
    recorded: outs.length,
    flown: flown.length,
    notFlown: outs.length - flown.length,
    points,
    errors: summarizeErrors(points.map((p) => p.recordedC - p.predictedC)),
    readyShare: withTemp.length ? withTemp.filter((o) => o.oilAtStartC! >= o.readyC).length / withTemp.length : null,
    reliability: reliability(
      withTemp.flatMap((o) => (o.probabilityReady !== null ? [{ probabilityReady: o.probabilityReady, recordedC: o.oilAtStartC!, readyC: o.readyC }] : [])),
    ),
    energy: {
      mornings: energyRows.length,
      plannedKWh: energyRows.reduce((a, o) => a + o.energyKWh!, 0),
      usualKWh: energyRows.reduce((a, o) => a + o.usualEnergyKWh!, 0),
    },
  };
}

/** The report for the given outcomes; aircraft listed in `fleet` order, those without outcomes left out. */
export function buildSeasonReport(outs: readonly ReportOutcome[], fleet: readonly { id: number; registration: string; thermalSource: string | null }[]): SeasonReport {
  const aircraft = fleet.flatMap((a) => {
    const mine = outs.filter((o) => o.aircraftId === a.id);
    if (!mine.length) return [];
    const g = group(mine);
    return [{ ...g, aircraftId: a.id, registration: a.registration, thermalSource: a.thermalSource, bias: estimateBias(g.points.map((p) => p.recordedC - p.predictedC), a.thermalSource) }];
  });
  return { organization: group(outs), aircraft };
}
