/**
 * Weather on the desk: stations, the zone's weighted temperature, observed hourly temperature and
 * temperature forecasts kept as vintages. Temperatures are stored and sent in °C.
 *
 * A forecast vintage is every value one station's forecast carried at one issue time: each
 * (station, issued_at, hour, member) is written once and never overwritten, so the forecast any
 * past load forecast could have used can be rebuilt from what was known at its issue time.
 *
 * Feeds send weather on FEED_NAMESPACE as WEATHER_EVENT batches with the same API-key mechanics,
 * ordering and acknowledgements as readings (see feed.ts): batches of one socket are applied in
 * arrival order, each whole or not at all, and the ack follows the commit.
 */
import type { BatchErrorCode } from './feed';

export const WEATHER_EVENT = 'weather';

/** Coldest and hottest temperature accepted, °C: beyond them a value is a sensor or unit fault (°F, K). */
export const MIN_TEMP_C = -60;
export const MAX_TEMP_C = 60;
/** Furthest ahead of its issue time a forecast may reach: 16 days. */
export const MAX_FORECAST_LEAD_HOURS = 16 * 24;
/** How far before its issue time a forecast hour may lie (its analysis hours): one day. */
export const MAX_FORECAST_HINDCAST_HOURS = 24;
/**
 * An ensemble member or quantile label: letters, digits, '.', '_' or '-', up to 16 characters
 * ("m07", "p10"). Left out, the value is the forecast's central (deterministic) one.
 */
export const FORECAST_MEMBER_PATTERN = /^[A-Za-z0-9._-]{1,16}$/;
/** Hours without a new forecast after which the desk calls a station's forecast feed stale (default). */
export const DEFAULT_FORECAST_STALE_HOURS = 18;
/** Hours behind after which observed temperature is stale (as readings: STALE_AFTER_HOURS). */
export const OBSERVED_STALE_AFTER_HOURS = 2;

export interface FeedTemperatureObservation {
  /** Station code, e.g. "VALLEYFLOOR". */
  station: string;
  /** Start of the hour the value is for (ISO 8601 with offset, on the hour). */
  hour: string;
  tempC: number;
  /** As a reading's version (feed.ts): the highest version of a (station, hour) is kept. */
  version?: number;
}

export interface FeedTemperatureForecast {
  station: string;
  /** When the forecast was issued (ISO 8601 with offset). */
  issuedAt: string;
  /** Start of the hour forecast (on the hour). */
  hour: string;
  tempC: number;
  member?: string;
}

export interface WeatherBatch {
  batchId: string;
  observations?: FeedTemperatureObservation[];
  forecasts?: FeedTemperatureForecast[];
}

export type WeatherRejectionReason =
  | 'unknown-station'
  | 'not-on-the-hour'
  | 'not-a-number'
  | 'implausible'
  | 'too-far-in-future'
  | 'malformed'
  /** The feed's key is limited to another station, or to a zone's readings. */
  | 'station-not-allowed'
  /** A vintage value already stored with a different temperature: vintages are never overwritten. */
  | 'vintage-exists'
  /** A CSV file gives the same key twice. */
  | 'duplicate';

export interface WeatherRejection {
  list: 'observations' | 'forecasts';
  index: number;
  reason: WeatherRejectionReason;
  message: string;
}

export interface WeatherBatchAck {
  batchId: string;
  /** Values accepted and committed (a repeat of a stored value counts as stored). */
  stored: number;
  rejected: WeatherRejection[];
  error?: string;
  errorCode?: BatchErrorCode;
}

/** Most values (observations and forecasts together) one weather batch may carry. */
export const MAX_WEATHER_PER_BATCH = 20_000;

export interface StationWeightDto {
  zone: string;
  weight: number;
}

export interface WeatherStationDto {
  id: number;
  code: string;
  name: string;
  timeZone: string;
  latitude: number | null;
  longitude: number | null;
  elevationM: number | null;
  /** The zones whose temperature this station takes part in, with its weight there. */
  zones: StationWeightDto[];
}

export interface CreateWeatherStationRequest {
  code: string;
  name: string;
  timeZone: string;
  latitude?: number | null;
  longitude?: number | null;
  elevationM?: number | null;
}

/** PUT /api/weather/zones/:zone/stations: the zone's temperature as a weighted average of these stations. */
export interface ZoneStationWeightsRequest {
  stations: { station: string; weight: number }[];
}

export interface ZoneStationsDto {
  zone: string;
  stations: { station: string; weight: number }[];
}

/**
 * GET /api/weather/zones: per zone and hour, the observed temperature and the temperature forecast
 * as known at `asOf` (the newest vintage of each station issued at or before it), each the
 * weighted average of the zone's stations (null where a station of the zone has no value).
 */
export interface ZoneWeatherSeriesDto {
  from: string;
  to: string;
  /** UTC hour starts. */
  hours: string[];
  asOf: string;
  zones: ZoneWeatherDto[];
}

export interface ZoneWeatherDto {
  zone: string;
  observedC: (number | null)[];
  forecastC: (number | null)[];
  /** Issue time of the forecast each hour's value comes from (the latest of the zone's stations), null where none. */
  forecastIssuedAt: (string | null)[];
  /** Newest vintage used for this zone (any hour in range). */
  latestIssuedAt: string | null;
}

/** GET /api/weather/status: is each station's weather keeping up? */
export interface WeatherStatusDto {
  station: string;
  zones: string[];
  lastObservedHour: string | null;
  lastIssuedAt: string | null;
  /** No observed value for more than OBSERVED_STALE_AFTER_HOURS past the hour (or never one). */
  observedStale: boolean;
  /** No forecast issued within the configured age (or never one). */
  forecastStale: boolean;
  forecastStaleAfterHours: number;
}

/** POST /api/weather/observed/upload and /forecasts/upload answer this (readings' CsvUploadReport, weather's reasons). */
export interface WeatherCsvReport {
  fileName: string;
  rows: number;
  accepted: number;
  rejected: { line: number; reason: WeatherRejectionReason; message: string }[];
  rejectedCount: number;
}

/**
 * Weighted average of the values that exist, or null when any weighted station has none: a zone's
 * temperature from only some of its stations would jump when one goes missing.
 */
export function weightedTemperature(values: readonly (number | null | undefined)[], weights: readonly number[]): number | null {
  let sum = 0;
  let total = 0;
  for (let i = 0; i < weights.length; i++) {
    const value = values[i];
    if (value === null || value === undefined) return null;
    sum += value * weights[i];
    total += weights[i];
  }
  return total > 0 ? Math.round((sum / total) * 100) / 100 : null;
}
