import type { ModelVersionDto, RefitJobDto } from '@morrowline/shared';
import type { ModelChoice } from '@morrowline/engine';
import type { ModelVersion } from './entities/model-version.entity';
import type { RefitJob } from './entities/refit-job.entity';

export function toModelVersionDto(v: ModelVersion): ModelVersionDto {
  return {
    id: v.id,
    zone: v.zone.code,
    status: v.status,
    trigger: v.trigger,
    differencing: v.differencing,
    differencingLabel: v.differencingLabel,
    p: v.p,
    q: v.q,
    seasonal: (v.parameters.P ?? 0) + (v.parameters.Q ?? 0) > 0 ? { P: v.parameters.P ?? 0, Q: v.parameters.Q ?? 0, period: v.parameters.period ?? 0 } : null,
    coefficients: v.coefficients,
    sigma2: v.sigma2,
    loglik: v.loglik,
    aic: v.aic,
    aicc: v.aicc,
    bic: v.bic,
    ljungBox: v.ljungBox,
    residualAcf: v.residualAcf,
    trainingFrom: v.trainingFrom.toISOString(),
    trainingTo: v.trainingTo.toISOString(),
    trainingHours: v.trainingHours,
    excludedHours: v.excludedHours,
    backtestDays: v.backtestDays,
    backtestOnForecastWeather: v.weather?.scoredOnForecastWeather === true,
    backtestMape: v.backtestMape,
    baselineMape: v.baselineMape,
    backtestCoverage80: v.backtestCoverage80 === null ? null : 100 * v.backtestCoverage80,
    backtestCoverage95: v.backtestCoverage95 === null ? null : 100 * v.backtestCoverage95,
    warnings: operatorWarnings(v.warnings),
    createdBy: v.createdByEmail,
    createdAt: v.createdAt.toISOString(),
    durationMs: v.durationMs,
    jobId: v.jobId,
    promotedAt: v.promotedAt ? v.promotedAt.toISOString() : null,
    retiredAt: v.retiredAt ? v.retiredAt.toISOString() : null,
    weather: v.weather ? { used: v.weather.used, description: v.weather.description, terms: v.weather.terms, response: v.weather.response, candidates: v.weather.candidates, baselineMape: v.weather.baselineMape, selectionDays: v.weather.selectionDays, vintageIssuedAt: v.weather.vintageIssuedAt, responseCovariance: v.weather.responseCovariance ?? null } : null,
  };
}

/**
 * The fit's warnings an operator can act on. The engine's "residuals still correlated" (Ljung–Box
 * at 24 or 48 h) is left out: nearly every hourly load model fails it, so it says nothing about
 * one version; the comparison shows instead how often the forecast's 80 % band held the load.
 */
export function operatorWarnings(warnings: readonly string[]): string[] {
  return warnings.filter((w) => !w.startsWith('residuals still correlated'));
}

export function toRefitJobDto(j: RefitJob): RefitJobDto {
  return {
    id: j.id,
    zone: j.zone.code,
    trigger: j.trigger,
    mode: j.mode,
    reason: j.reason,
    state: j.state,
    progress: j.progress,
    stage: j.stage,
    message: j.message,
    requestedBy: j.requestedByEmail,
    createdAt: j.createdAt.toISOString(),
    startedAt: j.startedAt ? j.startedAt.toISOString() : null,
    finishedAt: j.finishedAt ? j.finishedAt.toISOString() : null,
    modelVersionId: j.modelVersionId,
    forecastRunId: j.forecastRunId,
    promoted: j.promoted,
  };
}

/** The orders of a stored version, as the engine takes them for a fit with the orders kept. */
export function choiceOf(v: ModelVersion): ModelChoice {
  const m = v.parameters;
  const seasonal = (m.P ?? 0) + (m.Q ?? 0) > 0 ? { P: m.P, Q: m.Q, period: m.period } : {};
  return { diff: v.differencing, p: v.p, q: v.q, ...seasonal, start: { ar: m.ar, ma: m.ma, sar: m.sar ?? [], sma: m.sma ?? [] } };
}
