/**
 * The analysis workbench: wire types of GET /api/workbench/:zone/stationarity, GET …/model and
 * POST …/backtest. Numbers the engine could not compute travel as null (JSON has no NaN).
 */

/** Weeks of history the workbench analyses by default, and the range a request may ask for. */
export const WORKBENCH_DEFAULT_WEEKS = 8;
export const WORKBENCH_MIN_WEEKS = 3;
export const WORKBENCH_MAX_WEEKS = 12;
/** Hours with a reading the analysis needs at least (three weeks). */
export const WORKBENCH_MIN_HOURS = 3 * 168;
export const BACKTEST_MIN_DAYS = 7;
export const BACKTEST_MAX_DAYS = 28;
/** Largest lag of the ACF and PACF charts (past the weekly lag 168). */
export const WORKBENCH_MAX_LAG = 200;

/** A differencing as lags, e.g. [24, 168] for (1−B^24)(1−B^168); [] for the series as it is. */
export type DifferencingLags = number[];

export interface AdfOutcome {
  /** 'c' = constant, 'ct' = constant and linear trend. */
  regression: 'c' | 'ct';
  statistic: number | null;
  pValue: number | null;
  lags: number;
  criticalValue5: number | null;
  /** H0 (unit root) rejected at 5 %: the series does not wander like a random walk. */
  rejectsUnitRoot: boolean;
  /** The result in plain words. */
  reading: string;
}

export interface KpssOutcome {
  statistic: number | null;
  pValue: number | null;
  lags: number;
  criticalValue5: number;
  /** H0 (stationary around a level) rejected at 5 %. */
  rejectsStableLevel: boolean;
  /** The result in plain words. */
  reading: string;
}

/** ACF or PACF values from lag 1, with the ±1.96/√n white-noise band. */
export interface Correlogram {
  /** values[k − 1] is lag k */
  values: (number | null)[];
  band: number;
}

/** One of the things that may be not constant in a series. */
export type NonConstancy = 'mean' | 'variance' | 'daily' | 'weekly' | 'unit-root';

/** The tests on one version of the series (as it is, or after one differencing). */
export interface SeriesCheckDto {
  diff: DifferencingLags;
  /** "as recorded" or the operator, e.g. "(1−B^168)". */
  label: string;
  hours: number;
  adf: AdfOutcome[];
  kpss: KpssOutcome;
  acf: Correlogram;
  pacf: Correlogram;
  acf24: number | null;
  acf168: number | null;
  /** (largest − smallest weekly mean) / overall level, as a fraction. */
  meanDrift: number | null;
  /** largest weekly variance / smallest. */
  varianceRatio: number | null;
  /** What is not constant in this version of the series. */
  problems: NonConstancy[];
  /** ADF (constant) rejects a unit root and KPSS does not reject a stable level. */
  testsAgreeStationary: boolean;
  /** Plain sentences for an operator, one per finding. */
  sentences: string[];
  /** One sentence for this version as a whole. */
  summary: string;
}

export interface StationarityVerdictDto {
  /** The headline sentence for the operator. */
  headline: string;
  /** What is not constant in the series as recorded. */
  problems: NonConstancy[];
  /**
   * The differencing the workbench marks suggested: the one the zone's model in service uses when
   * it has one (the refit chose it by day-ahead error; one decision for the desk), otherwise the
   * simplest candidate after which the tests find nothing left to remove, or null.
   */
  recommended: DifferencingLags | null;
  recommendedLabel: string | null;
  /** Who decided `recommended`: the model in service, or the tests alone (no model yet). */
  recommendedBy?: 'model' | 'tests';
  /** The model in service and its differencing; null when the zone has none. */
  inUse?: { versionId: number; diff: DifferencingLags; label: string } | null;
  /** The simplest candidate the tests alone find clean, or null. */
  testsPick?: DifferencingLags | null;
}

export interface StationarityReportDto {
  zone: string;
  timeZone: string;
  weeks: number;
  /** UTC hour starts of the analysed range (first inclusive, last the latest reading's hour). */
  from: string;
  to: string;
  /** Hours in range, and how many of them hold a usable reading. */
  hours: number;
  usableHours: number;
  excludedHours: number;
  /** UTC hour starts, one per series value. */
  times: string[];
  load: (number | null)[];
  rolling: {
    day: { mean: (number | null)[]; variance: (number | null)[] };
    week: { mean: (number | null)[]; variance: (number | null)[] };
  };
  /** [as recorded, (1−B^24), (1−B^168), (1−B^24)(1−B^168)] */
  checks: SeriesCheckDto[];
  verdict: StationarityVerdictDto;
  computedAt: string;
  computeMs: number;
}

export interface CoefficientDto {
  /** ar1, ma2, sar1, intercept … */
  name: string;
  value: number;
  se: number | null;
}

export interface LjungBoxResultDto {
  lag: number;
  statistic: number;
  df: number;
  pValue: number;
}

export interface ModelCandidateDto {
  diff: DifferencingLags;
  label: string;
  p: number | null;
  q: number | null;
  /** the seasonal block at 24 hours of the orders kept for this differencing, when they have one */
  seasonal?: { P: number; Q: number };
  aicc: number | null;
  /** Mean day-ahead MAPE (%) on the selection days. */
  mape: number | null;
  /** The same with recent days weighted more (weights halving every `halfLifeDays` back): what
   *  the candidates are ranked by. */
  recentMape: number | null;
  error?: string;
  chosen: boolean;
}

export interface ModelFitDto {
  diff: DifferencingLags;
  label: string;
  p: number;
  q: number;
  P: number;
  Q: number;
  period: number;
  includeMean: boolean;
  coefficients: CoefficientDto[];
  sigma2: number;
  loglik: number;
  aic: number;
  aicc: number;
  bic: number;
  hoursUsed: number;
  ljungBox: LjungBoxResultDto[];
  residualAcf: Correlogram;
  /** Plain words on the residual checks. */
  residualVerdict: string;
  residualsLookWhite: boolean;
  fitMs: number;
}

export interface ModelReportDto {
  zone: string;
  weeks: number;
  from: string;
  to: string;
  usableHours: number;
  /** 'arima' when the model is used; 'seasonal-naive' when the desk would fall back. */
  method: 'arima' | 'seasonal-naive';
  fallbackReason: string | null;
  model: ModelFitDto | null;
  candidates: ModelCandidateDto[];
  /** Weekly seasonal-naive MAPE (%) on the selection days. */
  baselineMape: number | null;
  selectionDays: number;
  /** Half-life (days) of the weights of the candidates' `recentMape`. */
  halfLifeDays: number;
  warnings: string[];
  /** One sentence: what was chosen and why. */
  summary: string;
  computedAt: string;
  computeMs: number;
}

export interface BacktestRequest {
  days: number;
}

export interface BacktestScoresDto {
  mape: number | null;
  mae: number | null;
  rmse: number | null;
  bias: number | null;
  peakError: number | null;
  coverage80: number | null;
  coverage95: number | null;
}

export interface BacktestDayDto {
  /** Local date of the operating day, yyyy-MM-dd in the zone's time zone. */
  date: string;
  /** UTC start of the operating day. */
  start: string;
  hours: number;
  /** The first hour the day's forecast did not know (its issue time, on the hour), ISO. */
  issuedFrom: string;
  /** What forecast the day: "(1−B^168) ARMA(2,1)" or "seasonal naive". */
  model: string;
  fallbackReason: string | null;
  mape: number | null;
  mae: number | null;
  bias: number | null;
  peakError: number | null;
  baselineMape: number | null;
  baselineMae: number | null;
}

export interface BacktestReportDto {
  zone: string;
  timeZone: string;
  days: number;
  /** When each day was forecast: "at the 10:00 gate closure the day before (America/Denver), …". */
  issueTime: string;
  model: BacktestScoresDto;
  baseline: BacktestScoresDto;
  /** 1 − model MAPE / baseline MAPE (0.2 = 20 % smaller error than seasonal naive). */
  improvement: number | null;
  perDay: BacktestDayDto[];
  summary: string;
  computedAt: string;
  computeMs: number;
}
