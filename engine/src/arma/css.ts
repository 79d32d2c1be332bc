/**
 * Starting values by conditional sum of squares (CSS; Box & Jenkins 1970, §7.1): the innovations
 * are run forward from zero pre-sample innovations, conditioning on the first p + P·s values,
 *   e_t = w_t − Σ a_k w_{t−k} − Σ b_k e_{t−k},
 * and Σ e_t² is minimised over the same unconstrained (partial-autocorrelation) values the exact
 * likelihood is searched over, from all-zero coefficients. On long cycles and near-unit roots the
 * CSS optimum sits near the exact one and away from the boundary where a unit AR root and an MA
 * root near −1 cancel, which is why it serves as another start when a search ends there. A term
 * whose values are missing contributes nothing, and its innovation is taken as zero.
 */
import { minimizeBfgs } from './bfgs';
import { CssOrders, usableTerms } from './css-problem';
import { generalCss } from './css-general';
import { smallOrderCss } from './css-small-order';

export type { CssOrders, CssProblem } from './css-problem';
export { generalCss } from './css-general';
export { smallOrderCss } from './css-small-order';

/** Σ e_t² / (number of terms) for expanded AR coefficients a and MA coefficients b. */
export function conditionalSumOfSquares(w: Float64Array, a: Float64Array, b: Float64Array, e: Float64Array): number {
  const n = w.length;
  const start = a.length;
  let ssq = 0;
  let used = 0;
  e.fill(0);
  for (let t = start; t < n; t++) {
    let v = w[t];
    for (let k = 0; k < a.length; k++) v -= a[k] * w[t - k - 1];
    for (let k = 0; k < b.length && k < t; k++) v -= b[k] * e[t - k - 1];
    if (v === v) {
      e[t] = v;
      ssq += v * v;
      used++;
    }
  }
  return used > 0 ? ssq / used : Infinity;
}

/**
 * The CSS estimate in unconstrained values (order ar, ma, sar, sma) of the centred series w, or
 * null when the search fails. `maxHours` keeps only the latest values: a start needs no more.
 */
export function cssStart(w: Float64Array, o: CssOrders, maxHours = 4000): Float64Array | null {
  const k = o.p + o.q + o.P + o.Q;
  if (k === 0) return new Float64Array(0);
  const x = w.length > maxHours ? w.subarray(w.length - maxHours) : w;
  const s = o.period || 1;
  const terms = usableTerms(x, o.p + o.P * s);
  const css = o.P + o.Q === 0 && o.p <= 3 && o.q <= 3 ? smallOrderCss(x, o.p, o.q, terms) : generalCss(x, { ...o, period: s }, terms);
  const r = minimizeBfgs(css.objective, new Float64Array(k), { maxIter: 100, gradTol: 1e-6, fTol: 1e-10, step: 1e-6, gradient: css.gradient });
  return Number.isFinite(r.f) && r.x.every(Number.isFinite) ? r.x : null;
}
