/**
 * The workbench's rolling day-ahead backtest (pure; runs in the compute pool): the engine's
 * rolling-origin backtest over the zone's last N operating days, with the weekly seasonal-naive
 * baseline beside it, run as the desk forecasts: each day issued at the zone's gate closure the
 * day before from the hours that had ended by then, and the model chosen with the options the
 * desk's refits use (DESK_PIPELINE_OPTIONS), so that the figures are those of the schedules the
 * desk would have submitted. Day boundaries come from the zone's time zone, so 23- and 25-hour
 * days are scored whole.
 */
import type { BacktestDayDto, BacktestScoresDto } from '@morrowline/shared';
import { backtest, type BacktestSummary } from '@morrowline/engine';
import { DESK_PIPELINE_OPTIONS } from '../../models/analysis/refit';
import { num } from './stationarity-analysis';

export interface BacktestInput {
  values: Float64Array;
  excluded: number[];
  days: number;
  /** indices of local midnights into `values` */
  dayStarts: number[];
  /** local date (yyyy-MM-dd) of each day start */
  dayDates: string[];
  /** for each day start, the index of the first hour not known at its issue time (the gate closure the day before) */
  origins: number[];
  /** UTC ms of index 0 */
  firstHourMs: number;
}

export interface BacktestOutput {
  model: BacktestScoresDto;
  baseline: BacktestScoresDto;
  improvement: number | null;
  perDay: BacktestDayDto[];
  summary: string;
}

const scores = (s: BacktestSummary): BacktestScoresDto => ({
  mape: num(s.mape),
  mae: num(s.mae),
  rmse: num(s.rmse),
  bias: num(s.bias),
  peakError: num(s.peakError),
  coverage80: num(s.coverage80),
  coverage95: num(s.coverage95),
});

export function runWorkbenchBacktest(input: BacktestInput): BacktestOutput {
  const r = backtest(input.values, {
    days: input.days,
    dayStarts: input.dayStarts,
    origins: input.origins,
    excluded: input.excluded,
    method: 'auto',
    pipeline: DESK_PIPELINE_OPTIONS,
  });
  const dateOf = new Map(input.dayStarts.map((s, i) => [s, input.dayDates[i]]));
  const perDay: BacktestDayDto[] = r.days.map((d) => ({
    date: dateOf.get(d.dayStart) ?? '',
    start: new Date(input.firstHourMs + d.dayStart * 3_600_000).toISOString(),
    issuedFrom: new Date(input.firstHourMs + d.origin * 3_600_000).toISOString(),
    hours: d.hours,
    model: d.model,
    fallbackReason: d.fallbackReason ?? null,
    mape: num(d.accuracy.mape),
    mae: num(d.accuracy.mae),
    bias: num(d.accuracy.bias),
    peakError: num(d.accuracy.peakError),
    baselineMape: num(d.baseline.mape),
    baselineMae: num(d.baseline.mae),
  }));
  const model = scores(r);
  const baseline = scores(r.baseline);
  const improvement = num(r.improvement);
  let summary: string;
  if (model.mape === null || baseline.mape === null) summary = 'Too few scored days to compare the model with the baseline.';
  else if (model.mape < baseline.mape) {
    summary = `Over ${perDay.length} days the model missed by ${model.mape.toFixed(2)} % on average, against ${baseline.mape.toFixed(2)} % for the same hour last week: ${(100 * (improvement ?? 0)).toFixed(0)} % smaller error.`;
  } else {
    summary = `Over ${perDay.length} days the model (${model.mape.toFixed(2)} %) did not beat the same hour last week (${baseline.mape.toFixed(2)} %); the baseline would have served better.`;
  }
  return { model, baseline, improvement, perDay, summary };
}
