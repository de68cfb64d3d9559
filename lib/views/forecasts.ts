// The forecast as the data layer returns it and client components show it. Type-only: no I/O.
import type { ShelterRow } from './airfields';

export type ForecastStatus = 'fresh' | 'stale' | 'missing';

export interface ForecastStateView {
  status: ForecastStatus;
  fetchedAt: string | null;
  ageMinutes: number | null;
  source: 'fake' | 'remote' | null;
  /** The last attempt's failure, while no later attempt has succeeded. */
  error: { kind: string; message: string; at: string } | null;
}

export interface TonightSummary {
  from: string;
  to: string;
  /** The forecast low of outside air in the night window; null without a forecast covering it. */
  low: { tempC: number; at: string } | null;
}

export interface SunDayView {
  date: string;
  civilDawn: string | null;
  sunrise: string | null;
  sunset: string | null;
  civilDusk: string | null;
  polar: 'day' | 'night' | null;
}

export interface ShelterCurve {
  shelterId: number;
  name: string;
  kind: ShelterRow['kind'];
  /** Shelter air at each chart time, °C. */
  airC: number[];
  /** Lowest shelter air in tonight's window (°C), when the chart covers it. */
  tonightLowC: number | null;
}

export interface ForecastView extends ForecastStateView {
  airfieldId: number;
  timeZone: string;
  now: string;
  tonight: TonightSummary;
  /** Local days the chart touches, with sunrise, sunset and civil twilight. */
  sun: SunDayView[];
  /** Outside air and each shelter's air, every 30 min; null without a forecast. */
  chart: { atMs: number[]; outsideC: number[]; shelters: ShelterCurve[] } | null;
}
