/**
 * KPSS test of stationarity (Kwiatkowski, Phillips, Schmidt & Shin 1992): residuals e_t of x on a
 * constant ("level") or constant and trend ("trend"), partial sums S_t, statistic
 * η = Σ S_t² / (n² σ̂²), σ̂² the Newey–West (1987) long-run variance with the Bartlett kernel
 * and truncation lag l. H0: stationary. Critical values from the paper's Table 1; the p-value is
 * interpolated in that table and clipped to [0.01, 0.10]. Missing values are left out.
 */
import { ols } from './ols';

export type KpssType = 'level' | 'trend';

export interface KpssResult {
  type: KpssType;
  statistic: number;
  pValue: number;
  lags: number;
  criticalValues: { '10%': number; '5%': number; '2.5%': number; '1%': number };
}

const CRIT = {
  level: [0.347, 0.463, 0.574, 0.739],
  trend: [0.119, 0.146, 0.176, 0.216],
};
const PVALS = [0.1, 0.05, 0.025, 0.01];

export interface KpssOptions {
  type?: KpssType;
  /** truncation lag; default 'short' = trunc(4·(n/100)^{1/4}); 'long' = ceil(12·(n/100)^{1/4}) */
  lags?: number | 'short' | 'long';
}

export function kpssTest(xIn: ArrayLike<number>, opts: KpssOptions = {}): KpssResult {
  const type = opts.type ?? 'level';
  const x: number[] = [];
  for (let i = 0; i < xIn.length; i++) if (Number.isFinite(xIn[i])) x.push(xIn[i]);
  const n = x.length;
  const spec = opts.lags ?? 'short';
  let l = spec === 'short' ? Math.trunc(4 * Math.pow(n / 100, 0.25)) : spec === 'long' ? Math.ceil(12 * Math.pow(n / 100, 0.25)) : spec;
  l = Math.min(l, n - 1);
  const rows = x.map((_, t) => (type === 'level' ? Float64Array.of(1) : Float64Array.of(1, t + 1)));
  const e = ols(rows, x).residuals;
  let s2 = 0;
  for (let t = 0; t < n; t++) s2 += e[t] * e[t];
  for (let s = 1; s <= l; s++) {
    let c = 0;
    for (let t = s; t < n; t++) c += e[t] * e[t - s];
    s2 += 2 * (1 - s / (l + 1)) * c;
  }
  s2 /= n;
  let S = 0;
  let eta = 0;
  for (let t = 0; t < n; t++) {
    S += e[t];
    eta += S * S;
  }
  const stat = eta / (n * n * s2);
  const cv = CRIT[type];
  let p: number;
  if (stat <= cv[0]) p = PVALS[0];
  else if (stat >= cv[3]) p = PVALS[3];
  else {
    let i = 0;
    while (stat > cv[i + 1]) i++;
    p = PVALS[i] + ((stat - cv[i]) * (PVALS[i + 1] - PVALS[i])) / (cv[i + 1] - cv[i]);
  }
  return { type, statistic: stat, pValue: p, lags: l, criticalValues: { '10%': cv[0], '5%': cv[1], '2.5%': cv[2], '1%': cv[3] } };
}
