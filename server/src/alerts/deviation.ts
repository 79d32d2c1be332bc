/** One window of consecutive hours whose load was off the forecast beyond the threshold. */
export interface DeviationRun {
  /** Index of the first and one past the last deviating hour. */
  start: number;
  end: number;
  /** Signed percent with the largest magnitude in the run. */
  peakPct: number;
}

/** Signed deviation of actual from forecast in percent of forecast; null when either is missing. */
export function deviationPct(actual: number | null, forecast: number | null): number | null {
  if (actual === null || forecast === null || !(forecast > 0)) return null;
  return ((actual - forecast) / forecast) * 100;
}

/**
 * Runs of at least `minHours` consecutive hours with |actual − forecast| / forecast above
 * `thresholdPct`. A missing hour breaks a run: an alert needs evidence for every hour.
 */
export function deviationRuns(actual: readonly (number | null)[], forecast: readonly (number | null)[], thresholdPct: number, minHours: number): DeviationRun[] {
  const runs: DeviationRun[] = [];
  let start = -1;
  let peak = 0;
  for (let i = 0; i <= actual.length; i++) {
    const d = i < actual.length ? deviationPct(actual[i], forecast[i]) : null;
    if (d !== null && Math.abs(d) > thresholdPct) {
      if (start < 0) {
        start = i;
        peak = d;
      } else if (Math.abs(d) > Math.abs(peak)) peak = d;
      continue;
    }
    if (start >= 0 && i - start >= minHours) runs.push({ start, end: i, peakPct: peak });
    start = -1;
  }
  return runs;
}
