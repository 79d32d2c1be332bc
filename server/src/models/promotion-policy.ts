import type { RefitTrigger } from '@morrowline/shared';

export interface PromotionCase {
  /** The version in service when the job finishes; null for a zone without a model. */
  inServiceId: number | null;
  mode: 'full' | 'update';
  trigger: RefitTrigger;
  /** The candidate's backtest MAPE (%), null when it could not be scored. */
  candidateMape: number | null;
  /** The model in service's MAPE on the same days; null when not scored (or it changed meanwhile). */
  inServiceMape: number | null;
  /** whether each MAPE is a weather backtest on forecast weather (a version is scored as it forecasts) */
  candidateOnWeather?: boolean;
  inServiceOnWeather?: boolean;
}

export interface PromotionDecision {
  promoted: boolean;
  /** Stored with the job and its audit entry. */
  why: string;
}

/**
 * Whether a newly fitted model goes into service. The first model of a zone does; the hourly
 * update (orders kept, coefficients re-estimated) replaces the model in service; the nightly
 * refit promotes its candidate only when its backtest MAPE beats the model in service's on the
 * same days; an operator's refit leaves a candidate for the operator to compare and promote.
 */
export function decidePromotion(c: PromotionCase): PromotionDecision {
  const { candidateMape: cand, inServiceMape: served } = c;
  const on = (w: boolean | undefined) => (w ? ' on forecast weather' : '');
  if (c.inServiceId === null) return { promoted: true, why: 'the first model of the zone goes into service' };
  if (c.mode === 'update') return { promoted: true, why: 'hourly update: same orders, coefficients re-estimated' };
  if (c.trigger === 'schedule' && cand !== null && served !== null && cand < served) {
    return { promoted: true, why: `scheduled refit: backtest MAPE ${cand.toFixed(2)} %${on(c.candidateOnWeather)} beat ${served.toFixed(2)} %${on(c.inServiceOnWeather)} of version ${c.inServiceId}` };
  }
  if (c.trigger === 'schedule') {
    return { promoted: false, why: `kept version ${c.inServiceId} in service: the candidate (MAPE ${cand?.toFixed(2) ?? '–'} %${on(c.candidateOnWeather)}) did not beat it (${served?.toFixed(2) ?? '–'} %${on(c.inServiceOnWeather)})` };
  }
  return { promoted: false, why: 'candidate stored; compare it with the model in service and promote it if it serves better' };
}
