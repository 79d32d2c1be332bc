/**
 * Rolling mean and rolling variance over a trailing window (one day = 24 h, one week = 168 h)
 * for the stationarity plots. Missing hours are skipped; a window with fewer than half its
 * hours present gives NaN.
 */
export function rollingStats(x: ArrayLike<number>, window: number): { mean: Float64Array; variance: Float64Array } {
  const n = x.length;
  const mean = new Float64Array(n).fill(NaN);
  const variance = new Float64Array(n).fill(NaN);
  let s = 0;
  let ss = 0;
  let c = 0;
  // a shift keeps the running sums well conditioned for large MW values
  let shift = 0;
  for (let i = 0; i < n; i++) if (Number.isFinite(x[i])) {
    shift = x[i];
    break;
  }
  for (let i = 0; i < n; i++) {
    const v = x[i] - shift;
    if (v === v) {
      s += v;
      ss += v * v;
      c++;
    }
    if (i >= window) {
      const o = x[i - window] - shift;
      if (o === o) {
        s -= o;
        ss -= o * o;
        c--;
      }
    }
    if (i >= window - 1 && c >= Math.max(2, window / 2)) {
      const m = s / c;
      mean[i] = m + shift;
      variance[i] = Math.max(0, (ss - c * m * m) / (c - 1));
    }
  }
  return { mean, variance };
}
