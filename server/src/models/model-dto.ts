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
    backtestMape: v.backtestMape,
    baselineMape: v.baselineMape,
    warnings: v.warnings,
    createdBy: v.createdByEmail,
    createdAt: v.createdAt.toISOString(),
    durationMs: v.durationMs,
    jobId: v.jobId,
    promotedAt: v.promotedAt ? v.promotedAt.toISOString() : null,
    retiredAt: v.retiredAt ? v.retiredAt.toISOString() : null,
  };
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
  return { diff: v.differencing, p: v.p, q: v.q, start: { ar: v.parameters.ar, ma: v.parameters.ma } };
}
