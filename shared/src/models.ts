/**
 * Refit jobs and model versions. A refit fits a zone's model in the worker pool; every fit is
 * stored as a model version. One version per zone is in service; a new fit is a candidate.
 */
export const REFIT_JOB_STATES = ['queued', 'running', 'done', 'failed'] as const;
export type RefitJobState = (typeof REFIT_JOB_STATES)[number];

/** schedule: the nightly full refit; update: the hourly forecast update with orders kept. */
export const REFIT_TRIGGERS = ['schedule', 'operator', 'update'] as const;
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
  /** Day-ahead backtest over the last `backtestDays` days (orders fixed, refitted each day). */
  backtestDays: number;
  backtestMape: number | null;
  baselineMape: number | null;
  warnings: string[];
  createdBy: string | null;
  createdAt: string;
  durationMs: number;
  jobId: number | null;
  promotedAt: string | null;
  retiredAt: string | null;
}

/** GET /api/models/:id/compare — the version beside the one in service, scored on the same days. */
export interface ModelCompareDto {
  zone: string;
  candidate: ModelVersionDto;
  inService: ModelVersionDto | null;
  /** Both scored now on the same latest days (null when a side could not be scored). */
  sameDays: { days: number; from: string | null; to: string | null; candidateMape: number | null; inServiceMape: number | null; baselineMape: number | null };
  /** candidate MAPE below in-service MAPE on the same days */
  candidateBetter: boolean | null;
}

/** POST /api/models/:id/promote — also the rollback (promote an earlier retired version). */
export interface PromoteModelRequest {
  reason: string;
}
