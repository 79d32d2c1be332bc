/** Ordinary least squares by the normal equations (ml-matrix), with coefficient standard errors. */
import { Matrix, solve, inverse } from 'ml-matrix';

export interface OlsResult {
  beta: number[];
  se: number[];
  rss: number;
  n: number;
  k: number;
  /** Gaussian log-likelihood with σ² = rss/n */
  llf: number;
  residuals: Float64Array;
}

/** `rows` are the regressor rows (length k each), `y` the response. */
export function ols(rows: Float64Array[], y: ArrayLike<number>): OlsResult {
  const n = rows.length;
  const k = n ? rows[0].length : 0;
  const XtX = new Matrix(k, k);
  const Xty = new Array<number>(k).fill(0);
  for (let t = 0; t < n; t++) {
    const r = rows[t];
    for (let i = 0; i < k; i++) {
      Xty[i] += r[i] * y[t];
      for (let j = 0; j <= i; j++) XtX.set(i, j, XtX.get(i, j) + r[i] * r[j]);
    }
  }
  for (let i = 0; i < k; i++) for (let j = 0; j < i; j++) XtX.set(j, i, XtX.get(i, j));
  const beta = solve(XtX, Matrix.columnVector(Xty)).getColumn(0);
  const residuals = new Float64Array(n);
  let rss = 0;
  for (let t = 0; t < n; t++) {
    let f = 0;
    for (let i = 0; i < k; i++) f += rows[t][i] * beta[i];
    residuals[t] = y[t] - f;
    rss += residuals[t] * residuals[t];
  }
  const s2 = rss / Math.max(n - k, 1);
  const V = inverse(XtX);
  const se = beta.map((_, i) => Math.sqrt(Math.max(V.get(i, i) * s2, 0)));
  const llf = -0.5 * n * (Math.log(2 * Math.PI) + Math.log(rss / n) + 1);
  return { beta, se, rss, n, k, llf, residuals };
}
