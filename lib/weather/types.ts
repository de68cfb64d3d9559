// Shared types of the forecast layer.

/** One forecast hour, in SI-ish units Thawline uses everywhere. */
export interface ForecastHour {
  /** UTC instant, ISO 8601 with "Z". */
  at: string;
  tempC: number;
  dewPointC: number;
  windMps: number;
  /** Total cloud cover as a fraction, 0..1. */
  cloudFraction: number;
}

/** An hourly forecast for one location, as the rest of Thawline consumes it. */
export interface HourlyForecast {
  /** UTC ISO instant the forecast was fetched. */
  fetchedAt: string;
  source: 'fake' | 'remote';
  latitude: number;
  longitude: number;
  elevationM: number;
  /** Strictly increasing in time; hours the service left empty (null) are dropped. */
  hours: ForecastHour[];
}

/** The hourly variables Thawline asks for. */
export const HOURLY_VARIABLES = ['temperature_2m', 'dew_point_2m', 'wind_speed_10m', 'cloud_cover'] as const;
export type HourlyVariable = (typeof HOURLY_VARIABLES)[number];

/** The Open-Meteo `/v1/forecast` JSON response, restricted to the fields Thawline reads or the fake writes. */
export interface OpenMeteoForecastResponse {
  latitude: number;
  longitude: number;
  generationtime_ms: number;
  utc_offset_seconds: number;
  timezone: string;
  timezone_abbreviation: string;
  elevation: number;
  hourly_units?: Partial<Record<'time' | HourlyVariable, string>>;
  hourly?: { time: (number | string)[] } & Partial<Record<HourlyVariable, (number | null)[]>>;
}
