/** One window of consecutive hours whose load was off the forecast beyond the threshold. */
export interface DeviationRun {
  /** Index of the first and one past the last deviating hour. */
  start: number;
  end: number;
  /** Signed percent with the largest magnitude in the run, and the index of its hour. */
  peakPct: number;
  peakIndex: number;
}

/** Signed deviation of actual from the committed MW in percent of it; null when either is missing. */
export function deviationPct(actual: number | null, forecast: number | null): number | null {
  if (actual === null || forecast === null || !(forecast > 0)) return null;
  return ((actual - forecast) / forecast) * 100;
}

/**
 * Runs of at least `minHours` consecutive hours with |actual − committed| / committed above
 * `thresholdPct`. A missing hour breaks a run: an alert needs evidence for every hour.
 */
export function deviationRuns(actual: readonly (number | null)[], committed: readonly (number | null)[], thresholdPct: number, minHours: number): DeviationRun[] {
  const runs: DeviationRun[] = [];
  let start = -1;
  let peak = 0;
  let peakIndex = -1;
  for (let i = 0; i <= actual.length; i++) {
    const d = i < actual.length ? deviationPct(actual[i], committed[i]) : null;
    if (d !== null && Math.abs(d) > thresholdPct) {
      if (start < 0 || Math.abs(d) > Math.abs(peak)) {
        peak = d;
        peakIndex = i;
      }
      if (start < 0) start = i;
      continue;
    }
    if (start >= 0 && i - start >= minHours) runs.push({ start, end: i, peakPct: peak, peakIndex });
    start = -1;
  }
  return runs;
}
