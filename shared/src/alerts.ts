/** Deviation alerts: actual load off the current forecast for N consecutive hours. */
export type AlertState = 'open' | 'acknowledged';

export interface AlertDto {
  id: number;
  zone: string;
  /** First deviating hour start and the end of the last one (UTC, exclusive). */
  start: string;
  end: string;
  /** Largest |actual − forecast| / forecast over the window, in percent, signed (+ above forecast). */
  peakDeviationPct: number;
  thresholdPct: number;
  consecutiveHours: number;
  state: AlertState;
  raisedAt: string;
  acknowledgedAt: string | null;
  acknowledgedBy: string | null;
  comment: string | null;
}

export interface AcknowledgeAlertRequest {
  comment?: string;
}
