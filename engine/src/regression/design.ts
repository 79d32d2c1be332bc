/**
 * The regression's design, checked and differenced: the load and the regressor columns on one
 * timeline, an hour with a missing regressor made a missing hour of the load (as R's arima
 * does with an NA in xreg: y − Xβ is then NA), the intercept column when asked for, and the
 * same differencing Δ(B) applied to the load and to every column (R's arima(x, order, seasonal,
 * xreg=) differences both; Harvey 1989, §7.4).
 */
import { difference } from '../series/differencing';
import type { Regressor } from './types';

export const INTERCEPT = 'intercept';

export interface Design {
  /** the load with hours of missing regressors made missing */
  y: Float64Array;
  /** column names: "intercept" first when included, then the regressors */
  names: string[];
  /** the columns on the load's timeline */
  columns: Float64Array[];
  /** Δ(B) y, NaN where any term is missing */
  w: Float64Array;
  /** Δ(B) of each column, NaN exactly where w is NaN */
  wColumns: Float64Array[];
}

/** Checks names and lengths; refuses what cannot be a regressor (clear messages, nothing normalised). */
export function checkRegressors(regressors: readonly Regressor[], hours: number, what: string): void {
  const seen = new Set<string>();
  for (const r of regressors) {
    if (typeof r.name !== 'string' || r.name.trim() === '') throw new Error(`${what}: a regressor has an empty name`);
    if (r.name === INTERCEPT) throw new Error(`${what}: "${INTERCEPT}" is reserved for the model's constant; give the regressor another name`);
    if (seen.has(r.name)) throw new Error(`${what}: regressor "${r.name}" is given twice`);
    seen.add(r.name);
    if (r.values.length !== hours) throw new Error(`${what}: regressor "${r.name}" has ${r.values.length} values for ${hours} hours`);
  }
}

export function buildDesign(yIn: ArrayLike<number>, regressors: readonly Regressor[], diff: readonly number[], includeMean: boolean): Design {
  const n = yIn.length;
  checkRegressors(regressors, n, 'fit');
  const y = Float64Array.from(yIn, (v) => (Number.isFinite(v) ? v : NaN));
  const columns: Float64Array[] = [];
  const names: string[] = [];
  if (includeMean) {
    columns.push(new Float64Array(n).fill(1));
    names.push(INTERCEPT);
  }
  for (const r of regressors) {
    const c = Float64Array.from(r.values, (v) => (Number.isFinite(v) ? v : NaN));
    for (let t = 0; t < n; t++) if (c[t] !== c[t]) y[t] = NaN;
    columns.push(c);
    names.push(r.name);
  }
  const w = difference(y, diff);
  const wColumns = columns.map((c, j) => {
    const d = difference(c, diff);
    let before = 0;
    let after = 0;
    for (let t = 0; t < d.length; t++) {
      if (w[t] !== w[t]) d[t] = NaN;
      else {
        before += c[t + n - d.length] ** 2;
        after += d[t] ** 2;
      }
    }
    // a shape the differencing removes (a daily profile under (1 − B^24)) leaves round-off only
    if (!(after > 1e-20 * before)) throw new Error(`regressor "${names[j]}" is zero on every hour used${diff.length ? ' after the differencing' : ''}`);
    return d;
  });
  return { y, names, columns, w, wColumns };
}
