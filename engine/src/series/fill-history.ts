import { differencePolynomial } from './differencing';
import { meanFinite, toSeries } from './series';

/**
 * Replace missing load values by the model's one-step predictions: where a past value that
 * undoing the differencing needs is missing (a gap, an excluded outage hour), the model's
 * prediction of the differenced value is turned back into load, so an outage dip never comes
 * back through the seasonal lags; the first D hours, which no differenced value covers, take the
 * nearest value a season later (or the mean). Used by the ARIMA forecasts (forecast.ts) and the
 * regression with ARMA errors (regression/).
 */
export function fillHistory(y: ArrayLike<number>, diff: number[], wPred: ArrayLike<number>): { filled: Float64Array; count: number } {
  const c = differencePolynomial(diff);
  const D = c.length - 1;
  const n = y.length;
  const filled = toSeries(y);
  let count = 0;
  const longest = diff.length ? Math.max(...diff) : 1;
  const fallback = meanFinite(y);
  for (let t = 0; t < Math.min(D, n); t++) {
    if (filled[t] === filled[t]) continue;
    let v = NaN;
    for (let u = t + longest; u < n && !(v === v); u += longest) v = filled[u];
    filled[t] = v === v ? v : fallback;
    count++;
  }
  for (let t = D; t < n; t++) {
    if (filled[t] === filled[t]) continue;
    let s = wPred[t - D];
    for (let k = 1; k <= D; k++) if (c[k] !== 0) s -= c[k] * filled[t - k];
    filled[t] = s;
    count++;
  }
  return { filled, count };
}
