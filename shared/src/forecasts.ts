/**
 * Forecasts as desks see them. A forecast run is what one fit or update produced for one zone:
 * hourly means with 80 % and 95 % prediction intervals, from the hour after the last reading it
 * used to the end of the next operating day.
 */

export type ForecastMethod = 'arima' | 'seasonal-naive';

export interface ForecastRunDto {
  id: number | null;
  zone: string;
  /** When it was made, and the last reading hour (UTC start) it used. */
  issuedAt: string;
  basedOnHour: string | null;
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
 * GET /api/forecasts/latest?zone=A,B&from=&to= — the newest run per zone, cut to [from, to).
 * A zone with no stored run gets the seasonal-naive stand-in computed from its readings.
 */
export interface LatestForecastsDto {
  zones: ForecastRunDto[];
}
