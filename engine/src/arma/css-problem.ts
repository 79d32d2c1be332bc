/**
 * What the conditional-sum-of-squares searches share (css.ts): the orders, the objective with its
 * gradient, and the terms the recursion can use on a series with missing values.
 */
export interface CssOrders {
  p: number;
  q: number;
  P: number;
  Q: number;
  period: number;
}

/** The CSS objective in the unconstrained values and its gradient at the last point evaluated (null elsewhere). */
export interface CssProblem {
  objective: (u: Float64Array) => number;
  gradient: (u: Float64Array) => Float64Array | null;
}

/**
 * The terms the recursion uses: w_t and every value of its AR window present. That is where
 * conditionalSumOfSquares finds a number (a missing value times even a zero coefficient is NaN),
 * found once per series instead of once per pass.
 */
export function usableTerms(w: Float64Array, na: number): Int32Array {
  const out: number[] = [];
  for (let t = na; t < w.length; t++) {
    let ok = w[t] === w[t];
    for (let l = 1; ok && l <= na; l++) ok = w[t - l] === w[t - l];
    if (ok) out.push(t);
  }
  return Int32Array.from(out);
}
