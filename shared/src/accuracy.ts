/**
 * Accuracy after the fact: the wire contract between the server (server/src/accuracy) and the
 * Accuracy page.
 *
 *   GET /api/accuracy?zone=A,B&from=yyyy-MM-dd&to=yyyy-MM-dd   AccuracyReportDto
 *   (viewer, operator, supervisor). `from` and `to` are operating days, both included, at most
 *   ACCURACY_MAX_DAYS days; zone absent means every active zone. 400 when `to` is before `from`,
 *   the range is too long, a date is not yyyy-MM-dd or a zone is unknown.
 *
 * WHAT IS COMPARED WITH WHAT
 * - Operating day: the 23, 24 or 25 hours between two local midnights of the zone's time zone.
 *   A day's metrics use its own hours; hours are labelled hour-ending as in schedules.ts
 *   (HE01..HE24, no HE02 on the spring day, HE25 on the autumn day).
 * - Actuals: the stored hourly readings, less hours inside an outage or bad-data window.
 * - Model forecast for a day: the latest stored forecast run issued before the day's gate closure
 *   (the zone's gateClosure, local time on the day before) whose hours cover the whole day. That
 *   run may be a replay (ForecastOrigin 'replayed': worked out at the installation's first start
 *   as the desk would have issued it then); such days say so (`replayed`, `daysReplayed`).
 * - Published schedule for a day: the revision in force for the zone and day, that is the latest
 *   published revision (state published, or superseded only when no later one was published).
 *   Its adjusted MW are compared; hours without a schedule value are not scored.
 * - A day is scored once it has ended (a missing hour is a meter dropout and is skipped) or once
 *   every hour has an actual. Days without actuals, days still running and days without a
 *   forecast or schedule are listed as such and never scored as zero.
 *
 * METRICS (per day, per hour of day, per zone and for the system total)
 * - MAPE: mean of |forecast − actual| / actual, in %; hours with a zero actual are left out.
 * - MAE: mean of |forecast − actual|, MW.
 * - Bias: mean of forecast − actual, MW. Positive = over-forecast, negative = under-forecast.
 * - Peak-hour error: forecast − actual at the hour of the day's highest actual, MW and % of that
 *   actual. Over several days (a zone's range, the system) it is the mean of the days' peak-hour
 *   errors; it is not given per hour of day.
 * - Ranges (a zone over the days asked for, an hour-ending over the days) pool every scored hour.
 * - Adjustment effect = schedule MAPE − model MAPE, in percentage points, on the same day (or
 *   pooled over the days that have both). Negative = the operator's adjustments improved on the
 *   model; positive = they made it worse.
 * - System total: per UTC hour, the sum of the selected zones' actuals and forecasts, counted
 *   only when every selected zone has both; its operating days follow the first zone's time zone.
 *
 * Numbers are rounded to 3 decimals; null where nothing could be scored.
 */

export const ACCURACY_MAX_DAYS = 92;

export interface AccuracyScore {
  /** Hours scored. */
  hours: number;
  mape: number | null;
  mae: number | null;
  /** Mean of forecast − actual, MW; positive = over-forecast. */
  bias: number | null;
  /** Forecast − actual at the actual's peak hour, MW (mean over days for ranges). */
  peakErrorMw: number | null;
  peakErrorPct: number | null;
}

/**
 * Why a day has no score: no readings at all, the day is still running, or (per source) no
 * forecast run / published schedule for it.
 */
export type AccuracyActualsState = 'complete' | 'gaps' | 'in-progress' | 'none';

export interface AccuracyDaySourceDto {
  /** Forecast run id or schedule revision id. */
  id: number;
  /** Run issuedAt, or the revision's publishedAt. */
  at: string;
  /** Schedule revision number (null for the model). */
  revision: number | null;
  /** A replayed model forecast, not one the desk issued at the time (always false for schedules). */
  replayed: boolean;
  /** Null when the day is not scored (see AccuracyDayDto.actuals). */
  score: AccuracyScore | null;
  /** The day's peak-hour label (hour-ending) when scored. */
  peakHourEnding: string | null;
}

export interface AccuracyDayDto {
  operatingDay: string;
  /** 23, 24 or 25. */
  hours: number;
  /** Hours with a usable actual. */
  actualHours: number;
  /**
   * complete: every hour has an actual; gaps: the day has ended with some hours missing (scored
   * on the others); in-progress: the day has not ended yet (not scored); none: no actuals.
   */
  actuals: AccuracyActualsState;
  model: AccuracyDaySourceDto | null;
  schedule: AccuracyDaySourceDto | null;
  /** Schedule MAPE − model MAPE (percentage points); null unless both were scored. */
  adjustmentEffect: number | null;
  /**
   * The temperature forecast's error on the same day, so a weather miss can be told from a model
   * miss: the forecast as known when the day's model forecast was issued (else at its gate
   * closure) against the observed temperature, both the zone's weighted stations. Null for the
   * system total and for a zone without weather stations.
   */
  temperature?: AccuracyTemperatureDto | null;
}

export interface AccuracyTemperatureDto {
  /** The moment the forecast is taken as known at. */
  asOf: string;
  /** Hours with both an observed and a forecast temperature. */
  hours: number;
  /** Mean of |forecast − observed|, °C; null when no hour has both. */
  maeC: number | null;
  /** Mean of forecast − observed, °C; positive = forecast too warm. */
  biasC: number | null;
}

export interface AccuracyHourDto {
  /** "HE01".."HE25". */
  hourEnding: string;
  /** Days that had this hour (HE25 only on autumn days, HE02 not on spring days). */
  days: number;
  model: AccuracyScore;
  schedule: AccuracyScore;
}

export interface AccuracyComparisonDto {
  /** Days with both a scored model forecast and a scored schedule. */
  days: number;
  modelMape: number | null;
  scheduleMape: number | null;
  /** scheduleMape − modelMape on those days; negative = the adjustments helped. */
  difference: number | null;
  /** Of those days, on how many the schedule beat the model (lower MAPE). */
  daysHelped: number;
}

export interface AccuracyZoneDto {
  zone: string;
  zoneName: string;
  timeZone: string;
  days: AccuracyDayDto[];
  byHour: AccuracyHourDto[];
  model: AccuracyScore;
  schedule: AccuracyScore;
  comparison: AccuracyComparisonDto;
  daysScored: number;
  daysWithoutActuals: number;
  daysWithoutForecast: number;
  daysWithoutSchedule: number;
  /** Days whose model forecast is a replay (see AccuracyDaySourceDto.replayed). */
  daysReplayed: number;
}

export interface AccuracyReportDto {
  from: string;
  to: string;
  /** Latest stored reading hour (UTC start) among the zones asked for. */
  latestReadingHour: string | null;
  computedAt: string;
  zones: AccuracyZoneDto[];
  /** The sum of the zones asked for (see the top of this file); same shape, zone "SYSTEM". */
  system: AccuracyZoneDto;
}

/** A plain sentence on whether the adjustments helped, from AccuracyComparisonDto. */
export function adjustmentVerdict(c: Pick<AccuracyComparisonDto, 'days' | 'difference' | 'daysHelped'>): string {
  if (c.days === 0 || c.difference === null) return 'No day in this range has both a scored model forecast and a published schedule, so there is nothing to compare yet.';
  const pts = Math.abs(c.difference).toFixed(2);
  const days = `${c.days} day${c.days === 1 ? '' : 's'}`;
  const helped = `better on ${c.daysHelped} of them`;
  if (Math.abs(c.difference) < 0.005) return `Over ${days}, the published schedule was as accurate as the model forecast (${helped}).`;
  if (c.difference < 0) return `The adjustments helped: over ${days}, the published schedule's MAPE was ${pts} points lower than the model forecast's (${helped}).`;
  return `The adjustments did not help: over ${days}, the published schedule's MAPE was ${pts} points higher than the model forecast's (${helped}).`;
}
