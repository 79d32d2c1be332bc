/**
 * The workbench's model report (pure; runs in the compute pool): the automatic pipeline of the
 * engine on the zone's history with the options the desk's refits use (DESK_PIPELINE_OPTIONS:
 * the same four weeks of rolling day-ahead origins, fewer only when the history is short),
 * reshaped for the wire, with the residual checks in plain words.
 */
import { countInWords, type ModelCandidateDto, type ModelFitDto, type ModelReportDto } from '@morrowline/shared';
import { describeModel, runPipeline, SELECTION_HALF_LIFE_DAYS } from '@morrowline/engine';
import { DESK_DAY_AHEAD_CHOICE, DESK_PIPELINE_OPTIONS } from '../../models/analysis/refit';
import { num, toWire } from './stationarity-analysis';
import { differencingLabel, residualVerdict } from './verdict';

export interface ModelInput {
  values: Float64Array;
  excluded: number[];
}

/** The part of the wire's model report this analysis fills; the service adds the window and timing. */
export type ModelOutput = Pick<ModelReportDto, 'method' | 'fallbackReason' | 'model' | 'candidates' | 'baselineMape' | 'selectionDays' | 'halfLifeDays' | 'warnings' | 'summary'>;

const sameLags = (a: readonly number[], b: readonly number[]) => a.length === b.length && a.every((v, i) => v === b[i]);

export function analyseModel(input: ModelInput): ModelOutput {
  const r = runPipeline({ history: input.values, excluded: input.excluded, horizon: 24, options: DESK_PIPELINE_OPTIONS });
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
    ...((c.P ?? 0) + (c.Q ?? 0) > 0 ? { seasonal: { P: c.P ?? 0, Q: c.Q ?? 0 } } : {}),
    aicc: num(c.aicc),
    mape: num(c.mape),
    recentMape: num(c.recentMape),
    ...(c.error ? { error: c.error } : {}),
    chosen: !!m && sameLags(c.diff, m.diff),
  }));
  const baselineMape = num(r.baselineMape);
  const chosen = candidates.find((c) => c.chosen);
  let summary: string;
  if (r.method === 'arima' && model) {
    const orders = describeModel({ label: '', p: model.p, q: model.q, P: model.P, Q: model.Q, period: model.period }).trim();
    // each differencing stands with the best day-ahead forecaster of its DESK_DAY_AHEAD_CHOICE
    // orders with the lowest AICc (the criterion alone when that is one)
    const kept = DESK_DAY_AHEAD_CHOICE > 1 ? `of the ${countInWords(DESK_DAY_AHEAD_CHOICE)} orders with the lowest AICc on each differencing, it` : 'it';
    const figures = [
      chosen?.recentMape != null ? `${chosen.recentMape.toFixed(2)} % with weights halving every ${SELECTION_HALF_LIFE_DAYS} days back` : null,
      chosen?.mape != null ? `mean MAPE ${chosen.mape.toFixed(2)} %${baselineMape !== null ? ` against ${baselineMape.toFixed(2)} % for the same hour last week` : ''}` : null,
    ].filter((f): f is string => f !== null);
    summary = `The desk would forecast with ${orders} on ${model.label}: ${kept} had the smallest day-ahead error over the last ${r.selectionDays} days, recent days weighted more${
      figures.length ? ` (${figures.join('; ')})` : ''
    }${DESK_DAY_AHEAD_CHOICE > 1 ? '.' : ', and its orders have the lowest AICc.'}`;
  } else {
    summary = `The desk would fall back to the same hour last week (seasonal naive): ${r.fallbackReason ?? 'the model could not be used'}.`;
  }
  return {
    method: r.method,
    fallbackReason: r.fallbackReason ?? null,
    model,
    candidates,
    baselineMape,
    selectionDays: r.selectionDays,
    halfLifeDays: SELECTION_HALF_LIFE_DAYS,
    warnings: r.warnings,
    summary,
  };
}
