import type { CommittedBasis } from './committed';

/**
 * Deviation alerts: actual load off what was committed for the hour (the published schedule, else
 * the day-ahead forecast issued by gate closure) for N consecutive hours.
 */
export type AlertState = 'open' | 'acknowledged';

export interface AlertDto {
  id: number;
  zone: string;
  /** First deviating hour start and the end of the last one (UTC, exclusive). */
  start: string;
  end: string;
  /** Largest |actual − committed| / committed over the window, in percent, signed (+ above). */
  peakDeviationPct: number;
  /** What the peak hour was measured against; null for alerts raised before this was recorded. */
  comparedWith: CommittedBasis | null;
  /** The committed MW of the peak hour (null as above). */
  committedMw: number | null;
  thresholdPct: number;
  consecutiveHours: number;
  state: AlertState;
  raisedAt: string;
  acknowledgedAt: string | null;
  /** E-mail of who acknowledged it. */
  acknowledgedBy: string | null;
  /** Their name, as the desk shows it. */
  acknowledgedByName: string | null;
  comment: string | null;
}

export interface AcknowledgeAlertRequest {
  comment?: string;
}
