/**
 * Distribution of the Dickey–Fuller τ statistic from MacKinnon's response surfaces:
 * approximate p-values from MacKinnon (1994, J. Business & Economic Statistics 12, 167–176,
 * Tables 3–4: p = Φ(Σ c_i τ^i), one polynomial for the left tail and one for the rest) and
 * finite-sample critical values from MacKinnon (2010, Queen's Economics Dept. Working Paper
 * 1227, Table 2: c(T) = β∞ + β1/T + β2/T² + β3/T³), for one I(1) series (N = 1).
 * "n" = no deterministic terms, "c" = constant, "ct" = constant and linear trend.
 */
import { normalCdf } from './distributions';

export type AdfRegression = 'n' | 'c' | 'ct';

const TAU_MAX: Record<AdfRegression, number> = { n: Infinity, c: 2.74, ct: 0.7 };
const TAU_MIN: Record<AdfRegression, number> = { n: -19.04, c: -18.83, ct: -16.18 };
const TAU_STAR: Record<AdfRegression, number> = { n: -1.04, c: -1.61, ct: -2.89 };
// MacKinnon (1994): small-p (left tail) and large-p polynomial coefficients, ascending powers
const SMALL_P: Record<AdfRegression, number[]> = {
  n: [0.6344, 1.2378, 3.2496e-2],
  c: [2.1659, 1.4412, 3.8269e-2],
  ct: [3.2512, 1.6047, 4.9588e-2],
};
const LARGE_P: Record<AdfRegression, number[]> = {
  n: [0.4797, 9.3557e-1, -0.6999e-1, 3.3066e-2],
  c: [1.7339, 9.3202e-1, -1.2745e-1, -1.0368e-2],
  ct: [2.5261, 6.1654e-1, -3.7956e-1, -6.0285e-2],
};
// MacKinnon (2010), N = 1: rows 1 %, 5 %, 10 %; columns β∞, β1, β2, β3
const CRIT_2010: Record<AdfRegression, number[][]> = {
  n: [
    [-2.56574, -2.2358, -3.627, 0],
    [-1.941, -0.2686, -3.365, 31.223],
    [-1.61682, 0.2656, -2.714, 25.364],
  ],
  c: [
    [-3.43035, -6.5393, -16.786, -79.433],
    [-2.86154, -2.8903, -4.234, -40.04],
    [-2.56677, -1.5384, -2.809, 0],
  ],
  ct: [
    [-3.95877, -9.0531, -28.428, -134.155],
    [-3.41049, -4.3904, -9.036, -45.374],
    [-3.12705, -2.5856, -3.925, -22.38],
  ],
};

export function mackinnonP(tau: number, regression: AdfRegression): number {
  if (tau > TAU_MAX[regression]) return 1;
  if (tau < TAU_MIN[regression]) return 0;
  const c = tau <= TAU_STAR[regression] ? SMALL_P[regression] : LARGE_P[regression];
  let z = 0;
  for (let i = c.length - 1; i >= 0; i--) z = z * tau + c[i];
  return normalCdf(z);
}

export interface CriticalValues {
  '1%': number;
  '5%': number;
  '10%': number;
}

/** Critical values for a sample of `nobs` observations (asymptotic when nobs is omitted). */
export function mackinnonCritical(regression: AdfRegression, nobs?: number): CriticalValues {
  const inv = nobs ? 1 / nobs : 0;
  const v = CRIT_2010[regression].map((b) => b[0] + b[1] * inv + b[2] * inv * inv + b[3] * inv * inv * inv);
  return { '1%': v[0], '5%': v[1], '10%': v[2] };
}
