/**
 * Ljung–Box portmanteau test (Ljung & Box 1978): Q = n(n+2) Σ_{k=1..h} r_k² / (n − k), compared
 * with a chi-square on h − fitdf degrees of freedom (fitdf = p + q of the fitted ARMA).
 * n is the number of finite values; autocorrelations as in ./acf (R's `Box.test` convention).
 */
import { acf } from './series/acf';
import { chiSquareUpper } from './distributions';
import { countFinite } from './series/series';

export interface LjungBoxResult {
  lag: number;
  fitdf: number;
  statistic: number;
  df: number;
  pValue: number;
}

export function ljungBox(x: ArrayLike<number>, lag: number, fitdf = 0): LjungBoxResult {
  const n = countFinite(x);
  const r = acf(x, lag);
  let q = 0;
  for (let k = 1; k <= lag; k++) q += (r[k] * r[k]) / (n - k);
  q *= n * (n + 2);
  const df = lag - fitdf;
  return { lag, fitdf, statistic: q, df, pValue: df > 0 ? chiSquareUpper(q, df) : NaN };
}
