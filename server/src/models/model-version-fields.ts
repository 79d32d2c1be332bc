import { HOUR_MS } from '@morrowline/shared';
import type { ZoneHistory } from '../history/zone-history.loader';
import type { RefitResult } from './analysis/refit';
import type { ModelVersion } from './entities/model-version.entity';
import type { RefitJob } from './entities/refit-job.entity';

/** Lags of the residual ACF kept with a version (two days of hours). */
const STORED_ACF_LAGS = 48;

export type ModelVersionFields = Omit<ModelVersion, 'id' | 'zone'>;

/**
 * What a model version stores of a successful fit: the orders, named coefficients with standard
 * errors, information criteria, residual diagnostics, training window and backtest scores.
 * Values JSON cannot hold (NaN, infinities) become null or 0, so a stored row always reads back.
 */
export function modelVersionFields(
  result: RefitResult & { model: NonNullable<RefitResult['model']>; stored: NonNullable<RefitResult['stored']> },
  history: ZoneHistory,
  job: Pick<RefitJob, 'id' | 'trigger' | 'requestedByEmail'>,
  promoted: boolean,
  now: Date,
  durationMs: number,
): ModelVersionFields {
  const m = result.model;
  const racf = m.residualAcf.slice(0, STORED_ACF_LAGS).map((x) => (Number.isFinite(x) ? x : 0));
  return {
    status: promoted ? 'in-service' : 'candidate',
    trigger: job.trigger,
    differencing: m.diff,
    differencingLabel: m.label,
    p: m.p,
    q: m.q,
    coefficients: m.coefficients.map((c) => ({ name: c.name, value: c.value, se: Number.isFinite(c.se) ? c.se : null })),
    parameters: result.stored,
    sigma2: m.sigma2,
    loglik: m.loglik,
    aic: m.aic,
    aicc: Number.isFinite(m.aicc) ? m.aicc : m.aic,
    bic: m.bic,
    ljungBox: m.ljungBox.map((l) => ({ lag: l.lag, statistic: l.statistic, df: l.df, pValue: l.pValue })),
    residualAcf: {
      lags: racf,
      band: m.residualAcfBand,
      outside: racf.filter((x) => Math.abs(x) > m.residualAcfBand).length,
      maxAbs: racf.reduce((a, x) => Math.max(a, Math.abs(x)), 0),
    },
    trainingFrom: new Date(history.firstHourMs),
    trainingTo: new Date(history.lastHourMs + HOUR_MS),
    trainingHours: history.values.length,
    excludedHours: history.excluded.length,
    backtestDays: result.score?.days ?? 0,
    backtestMape: result.score?.mape ?? null,
    baselineMape: result.score?.baselineMape ?? null,
    backtestCoverage80: result.score?.coverage80 ?? null,
    backtestCoverage95: result.score?.coverage95 ?? null,
    warnings: result.warnings,
    createdByEmail: job.requestedByEmail,
    createdAt: now,
    durationMs,
    jobId: job.id,
    promotedAt: promoted ? now : null,
    retiredAt: null,
    weather: result.weather ?? null,
  };
}
