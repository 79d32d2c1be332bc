/**
 * Forecasts as desks see them. A forecast run is what one fit or update produced for one zone:
 * hourly means with 80 % and 95 % prediction intervals, from the hour after the last reading it
 * used to the end of the next operating day.
 */

export type ForecastMethod = 'arima' | 'seasonal-naive';

/**
 * issued: made by the desk at `issuedAt`, as the desk saw it then. replayed: made afterwards, at an
 * installation's first start, by replaying the desk's daily work over the history it was given
 * (the forecast the desk would have issued at `issuedAt` from the readings that existed then). A
 * replay is never what was issued: every screen that shows one says so.
 */
export const FORECAST_ORIGINS = ['issued', 'replayed'] as const;
export type ForecastOrigin = (typeof FORECAST_ORIGINS)[number];

export interface ForecastRunDto {
  id: number | null;
  zone: string;
  /** When it was made, and the last reading hour (UTC start) it used. */
  issuedAt: string;
  basedOnHour: string | null;
  /** Whether the desk issued it at `issuedAt` or it was replayed afterwards (see FORECAST_ORIGINS). */
  origin: ForecastOrigin;
  method: ForecastMethod;
  /** Set when the model could not be used and the seasonal-naive forecast stands in. */
  fallbackReason: string | null;
  /** Model version that produced it (null for the seasonal-naive stand-in). */
  modelVersionId: number | null;
  /** UTC hour starts, one per element of the arrays below. */
  hours: string[];
  mean: number[];
  lower80: number[];
  upper80: number[];
  lower95: number[];
  upper95: number[];
}

/**
 * GET /api/forecasts/latest?zone=A,B&from=&to= — the newest issued run per zone, cut to [from, to)
 * (replayed runs are history and never serve the live desk). A zone with no issued run gets the
 * seasonal-naive stand-in computed from its readings.
 */
export interface LatestForecastsDto {
  zones: ForecastRunDto[];
}

/** A stored run without its values: GET /api/forecasts/runs?zone=&limit= lists these, newest first. */
export interface ForecastRunSummaryDto {
  id: number;
  zone: string;
  issuedAt: string;
  origin: ForecastOrigin;
  basedOnHour: string | null;
  method: ForecastMethod;
  modelVersionId: number | null;
  /** UTC start of the first hour, and how many hours it runs */
  firstHour: string;
  hours: number;
}

/** One hour of two runs side by side; null where a run does not reach the hour. */
export interface ForecastDiffHourDto {
  hour: string;
  fromMw: number | null;
  toMw: number | null;
  /** toMw − fromMw, MW; null unless both reach the hour */
  changeMw: number | null;
}

/**
 * GET /api/forecasts/runs/:id/diff?against=:other&from=&to= — how the forecast moved from run
 * `id` to run `against` (same zone), hour by hour over [from, to) (default: the hours either run covers).
 */
export interface ForecastDiffDto {
  zone: string;
  from: ForecastRunSummaryDto;
  to: ForecastRunSummaryDto;
  hours: ForecastDiffHourDto[];
  /** the largest change in either direction, MW (null when no hour is shared) */
  largestChangeMw: number | null;
  /** the hour of the largest change */
  largestChangeHour: string | null;
}
