/**
 * The likelihood of a differenced model on a series with gaps, as R's arima computes it
 * (R 4.2.2, stats: makeARIMA and ARIMA_Like; Harvey 1989, §3.4 and §6.4; Durbin & Koopman 2012,
 * §5.1 on the diffuse start). Differencing the data first (design.ts) loses every differenced
 * value that touches a missing hour; the state-space form of the undifferenced errors keeps the
 * information a gap leaves (y_{t+1} − y_{t−1} across a one-hour gap under (1 − B)):
 *   state (ARMA state of Δ(B)u, u_{t−1}, …, u_{t−D}),  u_t = (ARMA state)_0 + Σ δ_i u_{t−i},
 * δ = −(c_1, …, c_D) the differencing polynomial's coefficients, the ARMA block started from its
 * stationary covariance and the D lagged levels from a diffuse κ·I with κ = 10⁶ (R's default).
 * As in R, an observation whose prediction variance F is 10⁴ or more (the first D, whose levels
 * are still diffuse) updates the state but is left out of the likelihood. The filter runs the
 * load's errors and every regressor column through the same gains, so β is concentrated out
 * by GLS as in profile.ts. T and Z are sparse (a companion block, the differencing row, a shift),
 * so one step costs O(m²) for an m-dimensional state rather than O(m³).
 */
import { ArmaStateSpace, stationaryCovariance } from '../arma/state-space';
import { differencePolynomial } from '../series/differencing';

export const KAPPA = 1e6;
/** R's ARIMA_Like leaves an observation out of the likelihood when its F is this or more. */
export const DIFFUSE_GAIN = 1e4;

export interface DiffuseModel {
  /** ARMA state dimension r and full dimension m = r + D */
  r: number;
  m: number;
  /** rows of T as (column, coefficient) lists */
  rows: Array<{ cols: Int32Array; coefs: Float64Array }>;
  /** nonzeros of Z */
  zCols: Int32Array;
  zCoefs: Float64Array;
  /** R R' on the ARMA block (m×m, zero elsewhere) */
  V: Float64Array;
  /** the predicted covariance of the first hour */
  P0: Float64Array;
}

export function diffuseModel(ss: ArmaStateSpace, diff: readonly number[]): DiffuseModel {
  const { r, phi, R } = ss;
  const c = differencePolynomial(diff);
  const D = c.length - 1;
  const m = r + D;
  const rows: DiffuseModel['rows'] = [];
  const row = (cols: number[], coefs: number[]) => rows.push({ cols: Int32Array.from(cols), coefs: Float64Array.from(coefs) });
  for (let i = 0; i < r; i++) {
    const cols: number[] = [];
    const coefs: number[] = [];
    if (phi[i] !== 0) {
      cols.push(0);
      coefs.push(phi[i]);
    }
    if (i + 1 < r) {
      cols.push(i + 1);
      coefs.push(1);
    }
    row(cols, coefs);
  }
  const zc = [0];
  const zv = [1];
  for (let j = 1; j <= D; j++) {
    if (c[j] === 0) continue;
    zc.push(r + j - 1);
    zv.push(-c[j]);
  }
  if (D > 0) row(zc, zv);
  for (let i = r + 1; i < m; i++) row([i - 1], [1]);
  const V = new Float64Array(m * m);
  for (let i = 0; i < r; i++) for (let j = 0; j < r; j++) V[i * m + j] = R[i] * R[j];
  const Q0 = stationaryCovariance(ss);
  const P0 = new Float64Array(m * m);
  for (let i = 0; i < r; i++) for (let j = 0; j < r; j++) P0[i * m + j] = Q0[i * r + j];
  for (let i = r; i < m; i++) P0[i * m + i] = KAPPA;
  return { r, m, rows, zCols: Int32Array.from(zc), zCoefs: Float64Array.from(zv), V, P0 };
}

export interface DiffusePass {
  /** standardized innovations v/√F of each series, NaN where missing or diffuse */
  std: Float64Array[];
  sumLogF: number;
  /** observations in the likelihood (F below DIFFUSE_GAIN) */
  nu: number;
  /** filtered state a_{n|n} of each series and P_{n|n}, when asked for */
  a?: Float64Array[];
  P?: Float64Array;
}

/** P ← T P T' + V (the prediction step), using T's sparse rows; `work` is m×m. */
export function predictCovariance(md: DiffuseModel, P: Float64Array, work: Float64Array): void {
  const { m, rows, V } = md;
  // work = T P
  for (let i = 0; i < m; i++) {
    const { cols, coefs } = rows[i];
    const wi = i * m;
    for (let j = 0; j < m; j++) work[wi + j] = 0;
    for (let k = 0; k < cols.length; k++) {
      const pk = cols[k] * m;
      const ck = coefs[k];
      for (let j = 0; j < m; j++) work[wi + j] += ck * P[pk + j];
    }
  }
  // P = work T' + V
  for (let i = 0; i < m; i++) {
    const wi = i * m;
    for (let j = 0; j < m; j++) {
      const { cols, coefs } = rows[j];
      let s = V[wi + j];
      for (let k = 0; k < cols.length; k++) s += work[wi + cols[k]] * coefs[k];
      P[wi + j] = s;
    }
  }
}

/** a ← T a (into `out`). */
export function predictState(md: DiffuseModel, a: Float64Array, out: Float64Array): void {
  for (let i = 0; i < md.m; i++) {
    const { cols, coefs } = md.rows[i];
    let s = 0;
    for (let k = 0; k < cols.length; k++) s += coefs[k] * a[cols[k]];
    out[i] = s;
  }
}

/**
 * Filters each series (the load's errors or its values, then the regressor columns; all with
 * the missing hours of `observed`) through the same gains.
 */
export function diffuseFilter(md: DiffuseModel, series: readonly Float64Array[], observed: Uint8Array, keepState = false): DiffusePass {
  const { m, zCols, zCoefs } = md;
  const n = observed.length;
  const S = series.length;
  const P = Float64Array.from(md.P0);
  const work = new Float64Array(m * m);
  const M = new Float64Array(m);
  const a = series.map(() => new Float64Array(m));
  const an = new Float64Array(m);
  const std = series.map(() => new Float64Array(n).fill(NaN));
  let sumLogF = 0;
  let nu = 0;
  for (let t = 0; t < n; t++) {
    if (t > 0) {
      for (let s = 0; s < S; s++) {
        predictState(md, a[s], an);
        a[s].set(an);
      }
      predictCovariance(md, P, work);
    }
    if (!observed[t]) continue;
    // M = P Z', F = Z M
    for (let i = 0; i < m; i++) {
      let v = 0;
      for (let k = 0; k < zCols.length; k++) v += P[i * m + zCols[k]] * zCoefs[k];
      M[i] = v;
    }
    let F = 0;
    for (let k = 0; k < zCols.length; k++) F += zCoefs[k] * M[zCols[k]];
    const counted = F < DIFFUSE_GAIN;
    if (counted) {
      nu++;
      sumLogF += Math.log(F);
    }
    const sF = Math.sqrt(F);
    for (let s = 0; s < S; s++) {
      const as = a[s];
      let pred = 0;
      for (let k = 0; k < zCols.length; k++) pred += zCoefs[k] * as[zCols[k]];
      const v = series[s][t] - pred;
      if (counted) std[s][t] = v / sF;
      const g = v / F;
      for (let i = 0; i < m; i++) as[i] += M[i] * g;
    }
    for (let i = 0; i < m; i++) {
      const mi = M[i] / F;
      for (let j = 0; j < m; j++) P[i * m + j] -= mi * M[j];
    }
  }
  return keepState ? { std, sumLogF, nu, a, P } : { std, sumLogF, nu };
}
