/**
 * The workbench's model report (pure; runs in the compute pool): the automatic pipeline of the
 * engine (./forecasting/pipeline) on the zone's history, reshaped for the wire, with the
 * residual checks in plain words.
 */
import type { ModelCandidateDto, ModelFitDto, ModelReportDto } from '@morrowline/shared';
import { runPipeline } from '@morrowline/engine';
import { num, toWire } from './stationarity-analysis';
import { differencingLabel, residualVerdict } from './verdict';

export const MODEL_SELECTION_DAYS = 7;

export interface ModelInput {
  values: Float64Array;
  excluded: number[];
}

/** The part of the wire's model report this analysis fills; the service adds the window and timing. */
export type ModelOutput = Pick<ModelReportDto, 'method' | 'fallbackReason' | 'model' | 'candidates' | 'baselineMape' | 'selectionDays' | 'warnings' | 'summary'>;

const sameLags = (a: readonly number[], b: readonly number[]) => a.length === b.length && a.every((v, i) => v === b[i]);

export function analyseModel(input: ModelInput): ModelOutput {
  const r = runPipeline({ history: input.values, excluded: input.excluded, horizon: 24, options: { selectionDays: MODEL_SELECTION_DAYS } });
  const m = r.model;
  let model: ModelFitDto | null = null;
  if (m) {
    const residual = residualVerdict(m.ljungBox);
    model = {
      diff: m.diff,
      label: differencingLabel(m.diff),
      p: m.p,
      q: m.q,
      P: m.P,
      Q: m.Q,
      period: m.period,
      includeMean: m.includeMean,
      coefficients: m.coefficients.map((c) => ({ name: c.name, value: c.value, se: num(c.se) })),
      sigma2: m.sigma2,
      loglik: m.loglik,
      aic: m.aic,
      aicc: m.aicc,
      bic: m.bic,
      hoursUsed: m.nUsed,
      ljungBox: m.ljungBox.map((l) => ({ lag: l.lag, statistic: l.statistic, df: l.df, pValue: l.pValue })),
      residualAcf: { values: toWire(m.residualAcf, 4), band: m.residualAcfBand },
      residualVerdict: residual.text,
      residualsLookWhite: residual.white,
      fitMs: m.fitMs,
    };
  }
  const candidates: ModelCandidateDto[] = r.candidates.map((c) => ({
    diff: c.diff,
    label: differencingLabel(c.diff),
    p: num(c.p),
    q: num(c.q),
    aicc: num(c.aicc),
    mape: num(c.mape),
    ...(c.error ? { error: c.error } : {}),
    chosen: !!m && sameLags(c.diff, m.diff),
  }));
  const baselineMape = num(r.baselineMape);
  const chosen = candidates.find((c) => c.chosen);
  let summary: string;
  if (r.method === 'arima' && model) {
    summary = `The desk would forecast with ARMA(${model.p},${model.q}) on ${model.label}: it had the smallest day-ahead error over the last ${MODEL_SELECTION_DAYS} days${
      chosen?.mape != null ? ` (MAPE ${chosen.mape.toFixed(2)} %` + (baselineMape !== null ? ` against ${baselineMape.toFixed(2)} % for the same hour last week)` : ')') : ''
    }, and its orders have the lowest AICc.`;
  } else {
    summary = `The desk would fall back to the same hour last week (seasonal naive): ${r.fallbackReason ?? 'the model could not be used'}.`;
  }
  return {
    method: r.method,
    fallbackReason: r.fallbackReason ?? null,
    model,
    candidates,
    baselineMape,
    selectionDays: MODEL_SELECTION_DAYS,
    warnings: r.warnings,
    summary,
  };
}
