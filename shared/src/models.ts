import type { ModelWeatherDto } from './model-weather';
/**
 * Refit jobs and model versions. A refit fits a zone's model in the worker pool; every fit is
 * stored as a model version. One version per zone is in service; a new fit is a candidate.
 */
export const REFIT_JOB_STATES = ['queued', 'running', 'done', 'failed'] as const;
export type RefitJobState = (typeof REFIT_JOB_STATES)[number];

/**
 * schedule: the nightly full refit; update: the hourly forecast update with orders kept;
 * first-model: a zone's first model, fitted a little after start-up or once it has the history.
 */
export const REFIT_TRIGGERS = ['schedule', 'operator', 'update', 'first-model'] as const;
export type RefitTrigger = (typeof REFIT_TRIGGERS)[number];

export const MODEL_STATUSES = ['candidate', 'in-service', 'retired'] as const;
export type ModelStatus = (typeof MODEL_STATUSES)[number];

/** Pushed as DESK_EVENTS.refitProgress on every change; GET /api/models/refits?state=&zone= */
export interface RefitJobDto {
  id: number;
  zone: string;
  trigger: RefitTrigger;
  /** full: differencing and order selection; update: the orders of the model in service kept. */
  mode: 'full' | 'update';
  reason: string | null;
  state: RefitJobState;
  /** 0–100 */
  progress: number;
  /** What it is doing now, in plain words. */
  stage: string;
  /** Why it failed, or what came of it. */
  message: string | null;
  requestedBy: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  modelVersionId: number | null;
  forecastRunId: number | null;
  /** Whether the new version went into service. */
  promoted: boolean;
}

/** POST /api/models/refits — omit zone for all active zones. */
export interface StartRefitRequest {
  zone?: string;
  reason: string;
}

export interface ModelCoefficientDto {
  name: string;
  value: number;
  se: number | null;
}

export interface LjungBoxDto {
  lag: number;
  statistic: number;
  df: number;
  pValue: number;
}

export interface ModelVersionDto {
  id: number;
  zone: string;
  status: ModelStatus;
  trigger: RefitTrigger;
  /** differencing lags, e.g. [168] or [24, 168], and its label "(1−B^168)" */
  differencing: number[];
  differencingLabel: string;
  p: number;
  q: number;
  /** seasonal block ×(P, Q) at `period` hours, null when the model has none */
  seasonal: { P: number; Q: number; period: number } | null;
  coefficients: ModelCoefficientDto[];
  sigma2: number;
  loglik: number;
  aic: number;
  aicc: number;
  bic: number;
  ljungBox: LjungBoxDto[];
  /** Residual ACF at lags 1..48 with its ±1.96/√n band, and how many lags fall outside it. */
  residualAcf: { lags: number[]; band: number; outside: number; maxAbs: number };
  trainingFrom: string;
  trainingTo: string;
  trainingHours: number;
  excludedHours: number;
  /**
   * Day-ahead backtest over the last `backtestDays` days (orders fixed, refitted each day). A
   * version with weather terms is scored with them, each day on the temperature forecast known at
   * its origin (`backtestOnForecastWeather`); versions from before that, and versions without
   * weather, on the model without weather.
   */
  backtestDays: number;
  backtestOnForecastWeather: boolean;
  backtestMape: number | null;
  baselineMape: number | null;
  /** Shares (%) of the backtest's hours inside the 80 % and 95 % bands; null before calibration was stored. */
  backtestCoverage80: number | null;
  backtestCoverage95: number | null;
  warnings: string[];
  createdBy: string | null;
  createdAt: string;
  durationMs: number;
  jobId: number | null;
  promotedAt: string | null;
  retiredAt: string | null;
  /** weather and calendar terms tried by the refit (null: the zone had no observed temperature then, or a version from before them) */
  weather: ModelWeatherDto | null;
}

/** One operating day of a version's score: how it was forecast and how it did. */
export interface VersionDayScoreDto {
  /** yyyy-MM-dd in the zone's time zone */
  day: string;
  /** the day's issue time: the zone's gate closure the day before */
  issuedAt: string;
  /** issued: the forecast the version issued then; re-forecast: made now as it would have been then; null: could not be made */
  source: 'issued' | 're-forecast' | null;
  hours: number;
  mape: number | null;
}

/** A version scored as it forecast: each day at its issue time, with its own coefficients. */
export interface VersionIssueScoreDto {
  versionId: number;
  days: number;
  hours: number;
  mape: number | null;
  /** mean error, MW (positive: forecasts too high) */
  bias: number | null;
  /** share of hours inside the 80 % band, % */
  coverage80: number | null;
  /** days scored from forecasts the version actually issued (the rest were re-forecast) */
  issuedDays: number;
  /** scored days inside the version's own training window (partly in-sample for it) */
  inSampleDays: number;
  perDay: VersionDayScoreDto[];
}

/**
 * GET /api/models/:id/compare — the version beside the one in service, both scored on the same
 * latest operating days as they forecast them: each day at its issue time (the zone's gate
 * closure) from the hours that had ended by then, with each version's own coefficients held
 * (the forecast it issued where one is stored, otherwise a re-forecast; never re-estimated).
 */
export interface ModelCompareDto {
  zone: string;
  /** the zone's time zone (the issue times are local gate closures) */
  timeZone: string;
  candidate: ModelVersionDto;
  inService: ModelVersionDto | null;
  sameDays: {
    days: number;
    from: string | null;
    to: string | null;
    candidateMape: number | null;
    inServiceMape: number | null;
    /** the same hour one week earlier, from the history at each issue time */
    baselineMape: number | null;
    /** the issue time in words, e.g. "at the 10:00 gate closure the day before" */
    issueTime: string;
    candidate: VersionIssueScoreDto | null;
    inService: VersionIssueScoreDto | null;
    /** both scored on exactly the same days and hours */
    comparable: boolean;
    /** why not, when they are not */
    notComparable: string | null;
  };
  /** candidate MAPE below in-service MAPE; null unless the two are comparable */
  candidateBetter: boolean | null;
  /** What the scores mean for the operator, in plain words (band coverage, bias, in-sample days). */
  diagnostics: string[];
}

/** POST /api/models/:id/promote — also the rollback (promote an earlier retired version). */
export interface PromoteModelRequest {
  reason: string;
}
