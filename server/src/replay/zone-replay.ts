import type { IntervalForecast, ModelChoice } from '@morrowline/engine';
import { forecastHorizon } from '../forecasts/forecast-horizon';
import { REFIT_BACKTEST_DAYS, type RefitPayload, type RefitResult } from '../models/analysis/refit';
import type { ZoneHistory } from '../history/zone-history.loader';
import type { ReadingsTimeline } from './history-cut';
import type { ReplayStep } from './replay-timeline';

const HOUR_MS = 3_600_000;

/** Runs the refit task of the compute pool (or, in unit tests, the function itself). */
export type RefitRunner = (payload: RefitPayload) => Promise<RefitResult>;

export interface ReplayedForecast {
  day: string;
  issuedAt: number;
  basedOnHour: number;
  firstHour: number;
  method: 'arima' | 'seasonal-naive';
  fallbackReason: string | null;
  forecast: IntervalForecast;
  /** Orders of the model that made it (null for seasonal naive). */
  model: { diff: number[]; p: number; q: number } | null;
}

export interface ZoneReplayInput {
  timeline: ReadingsTimeline;
  timeZone: string;
  steps: readonly ReplayStep[];
  /** Readings a zone needs before its first model (the refit jobs' FIRST_MODEL_MIN_HOURS). */
  minHours: number;
}

/** A model in service as the refit jobs keep it: its orders and coefficients (choiceOf). */
function served(result: RefitResult): ModelChoice | null {
  const s = result.stored;
  return s ? { diff: s.diff, p: s.p, q: s.q, start: { ar: s.ar, ma: s.ma } } : null;
}

function payloadOf(history: ZoneHistory, timeZone: string, at: number, fixed: ModelChoice | undefined, inService: ModelChoice | null): RefitPayload {
  return { values: history.values, excluded: history.excluded, horizon: forecastHorizon(history.lastHourMs, timeZone, at), fixed, inService, backtestDays: REFIT_BACKTEST_DAYS };
}

/**
 * Replays a zone's daily forecasting as the refit jobs (RefitsService) would have run it, each
 * fit seeing only the readings that had arrived by its time (ReadingsTimeline), with the same
 * payload, task and promotion rules:
 *  - at each nightly refit, a full selection (differencing and ARMA orders) with the model in
 *    service scored on the same days; the candidate goes into service only when its backtest MAPE
 *    beats the one in service (the first model of a zone goes in directly);
 *  - at the last hourly update before the gate closure, the orders in service are kept and the
 *    coefficients re-estimated on the history to then; its forecast is the day's replayed run;
 *  - a zone with no model yet gets a full refit (its first model) once it has `minHours`
 *    readings; when that fit fails, the seasonal-naive forecast stands in and is stored, as the
 *    refit jobs store it. When an update fails the model stays in service and the day gets no run.
 * A full selection every night and one update per day (not the 23 other hourly updates, which
 * only move the starting values of the next fit) is what keeps a replay of weeks to a minute.
 * `onDay` sees each day's forecast as soon as it is made (null when the day got none).
 */
export async function replayZone(input: ZoneReplayInput, refit: RefitRunner, onDay: (step: ReplayStep, forecast: ReplayedForecast | null) => Promise<void>): Promise<void> {
  const { timeline, timeZone, minHours } = input;
  let inService: ModelChoice | null = null;
  for (const step of input.steps) {
    // the nightly refit
    const night = timeline.historyAt(step.nightlyAt);
    if (night && (inService || timeline.countAt(step.nightlyAt) >= minHours)) {
      const result = await refit(payloadOf(night, timeZone, step.nightlyAt, undefined, inService));
      const candidate = served(result);
      if (candidate) {
        const mape = result.score?.mape ?? null;
        const current = result.inServiceScore?.mape ?? null;
        if (!inService || (mape !== null && current !== null && mape < current)) inService = candidate;
      }
    }
    // the forecast update before the gate closure
    const history = timeline.historyAt(step.issuedAt);
    if (!history) {
      await onDay(step, null);
      continue;
    }
    let result: RefitResult | null = null;
    if (inService) result = await refit(payloadOf(history, timeZone, step.issuedAt, inService, null));
    else if (timeline.countAt(step.issuedAt) >= minHours) result = await refit(payloadOf(history, timeZone, step.issuedAt, undefined, null));
    const model = result ? served(result) : null;
    if (model) inService = model;
    // a failed update leaves the model in service and stores nothing; a failed first fit stores seasonal naive
    const stored = result && (model || !inService);
    await onDay(
      step,
      stored && result
        ? {
            day: step.day,
            issuedAt: step.issuedAt,
            basedOnHour: history.lastHourMs,
            firstHour: history.lastHourMs + HOUR_MS,
            method: model ? 'arima' : 'seasonal-naive',
            fallbackReason: model ? null : (result.fallbackReason ?? 'the fit failed'),
            forecast: result.forecast,
            model: result.model ? { diff: result.model.diff, p: result.model.p, q: result.model.q } : null,
          }
        : null,
    );
  }
}
