/** Normal and chi-square distribution functions, through jstat. */
import { jStat } from 'jstat';

export function normalQuantile(p: number): number {
  return jStat.normal.inv(p, 0, 1);
}

export function normalCdf(x: number): number {
  return jStat.normal.cdf(x, 0, 1);
}

/** Upper tail P(X > x) of a chi-square with `df` degrees of freedom. */
export function chiSquareUpper(x: number, df: number): number {
  if (df <= 0) return NaN;
  return 1 - jStat.chisquare.cdf(x, df);
}
