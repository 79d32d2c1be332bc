/**
 * Augmented Dickey–Fuller test (Dickey & Fuller 1979; Said & Dickey 1984):
 *   Δx_t = [α] [+ β t] + γ x_{t−1} + Σ_{i=1..k} δ_i Δx_{t−i} + e_t,  τ = γ̂ / s.e.(γ̂),
 * H0: unit root (γ = 0). The lag length k is fixed or chosen by AIC from 0 up to
 * 12·(n/100)^{1/4} (Schwert 1989) on a common sample, then the regression is re-run on all
 * rows available for the chosen k. p-values and critical values by MacKinnon (1994, 2010).
 * Rows touching a missing value are left out of the regression.
 */
import { AdfRegression, CriticalValues, mackinnonCritical, mackinnonP } from './mackinnon';
import { ols } from './ols';

export interface AdfOptions {
  regression?: AdfRegression;
  /** fixed lag length (no selection) */
  lags?: number;
  /** largest lag considered by AIC (default ceil(12·(n/100)^{1/4})) */
  maxLag?: number;
}

export interface AdfResult {
  regression: AdfRegression;
  statistic: number;
  pValue: number;
  lags: number;
  nobs: number;
  criticalValues: CriticalValues;
}

function adfRegression(x: ArrayLike<number>, k: number, firstRow: number, reg: AdfRegression) {
  const n = x.length;
  const rows: Float64Array[] = [];
  const ys: number[] = [];
  // dx[t] = x[t+1] − x[t]; row for dx[t], t from firstRow to n−2
  for (let t = firstRow; t <= n - 2; t++) {
    const dy = x[t + 1] - x[t];
    const cols = (reg === 'n' ? 0 : reg === 'c' ? 1 : 2) + 1 + k;
    const r = new Float64Array(cols);
    let c = 0;
    if (reg !== 'n') r[c++] = 1;
    if (reg === 'ct') r[c++] = t + 1;
    r[c++] = x[t];
    for (let i = 1; i <= k; i++) r[c++] = x[t + 1 - i] - x[t - i];
    let ok = Number.isFinite(dy);
    for (let i = 0; i < cols && ok; i++) ok = Number.isFinite(r[i]);
    if (!ok) continue;
    rows.push(r);
    ys.push(dy);
  }
  const res = ols(rows, ys);
  const gi = reg === 'n' ? 0 : reg === 'c' ? 1 : 2;
  return { res, tau: res.beta[gi] / res.se[gi] };
}

export function adfTest(x: ArrayLike<number>, opts: AdfOptions = {}): AdfResult {
  const reg = opts.regression ?? 'c';
  const n = x.length;
  const ntrend = reg === 'n' ? 0 : reg === 'c' ? 1 : 2;
  let k: number;
  if (opts.lags !== undefined) k = opts.lags;
  else {
    let maxLag = opts.maxLag ?? Math.ceil(12 * Math.pow(n / 100, 0.25));
    maxLag = Math.max(0, Math.min(Math.floor(n / 2) - ntrend - 1, maxLag));
    let best = Infinity;
    k = 0;
    for (let lag = 0; lag <= maxLag; lag++) {
      const { res } = adfRegression(x, lag, maxLag, reg);
      const aic = -2 * res.llf + 2 * res.k;
      if (aic < best) {
        best = aic;
        k = lag;
      }
    }
  }
  const { res, tau } = adfRegression(x, k, k, reg);
  return { regression: reg, statistic: tau, pValue: mackinnonP(tau, reg), lags: k, nobs: res.n, criticalValues: mackinnonCritical(reg, res.n) };
}
