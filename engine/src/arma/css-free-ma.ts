/**
 * A second conditional-sum-of-squares start, searched in the parametrisation of R's arima CSS
 * step (stats::arima, method "CSS-ML", transform.pars = TRUE): the AR coefficients through the
 * partial-autocorrelation transform, the MA coefficients as they are (unconstrained), and the
 * mean as a parameter beside them, from zero coefficients and the sample mean. css.ts searches
 * the MA part through the same transform as the AR part, which keeps it invertible all the way;
 * on short real series the CSS surface has several minima, and the two searches can end in
 * different ones. The MA roots of the end point that lie inside the unit circle are then
 * reflected to 1/z̄ (the exact Gaussian likelihood is the same for both: Brockwell & Davis 1991,
 * §3.5), which is what R's arima does before its ML step (maInvert).
 *
 * Why it is kept beside css.ts's start: over R's datasets differenced as usual (EuStockMarkets'
 * log returns, WWWusage, beaver2, Seatbelts, BJsales.lead, JohnsonJohnson; every ARMA(p, q),
 * p, q ≤ 3), 11 of 375 fits ended below R's best log-likelihood by 0.02–0.75 from the other
 * starts, and 9 of them reach it from this one (engine/src/fixtures/r-arima-sweep.R; when it is
 * tried, fitArma).
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { minimizeBfgs } from './bfgs';
import { usableTerms } from './css-problem';
import { fromInvertible, fromStationary, toStationaryJacobian } from './transform';

/** How close to the unit circle a reflected MA root may stay (a start needs a finite transform). */
const MIN_ROOT_MODULUS = 1.001;

/** The free-MA CSS objective log(Σ e_t² / m) over v = (AR unconstrained, MA as is, ν), μ = x̄ + s·ν. */
export interface FreeMaCssProblem {
  /** length of v */
  k: number;
  objective: (v: Float64Array) => number;
  /** at the point of the last evaluation (null elsewhere) */
  gradient: (v: Float64Array) => Float64Array | null;
  /** v for stationary AR coefficients, MA coefficients and a mean (null when the AR part is not stationary) */
  encode: (ar: ArrayLike<number>, ma: ArrayLike<number>, mean: number) => Float64Array | null;
}

export function freeMaCssProblem(x: Float64Array, p: number, q: number, includeMean: boolean): FreeMaCssProblem {
  const terms = usableTerms(x, p);
  const used = new Uint8Array(x.length);
  for (let i = 0; i < terms.length; i++) used[terms[i]] = 1;
  // the mean as x̄ + s·ν, so that ν is on the scale of the coefficients whatever the data's units
  let mean = 0;
  let sd = 1;
  if (includeMean) {
    let sum = 0;
    let count = 0;
    for (const v of x) {
      if (v !== v) continue;
      sum += v;
      count++;
    }
    mean = sum / count;
    let ss = 0;
    for (const v of x) if (v === v) ss += (v - mean) * (v - mean);
    sd = Math.sqrt(ss / count) || 1;
  }
  const k = p + q + (includeMean ? 1 : 0);
  const e = new Float64Array(x.length);
  const lambda = new Float64Array(x.length);
  let last: Float64Array | null = null;
  let lastSsq = NaN;
  let lastA: Float64Array = new Float64Array(p);
  let lastJac: Float64Array = new Float64Array(p * p);
  const objective = (v: Float64Array): number => {
    const { phi, jac } = toStationaryJacobian(v.subarray(0, p));
    const mu = includeMean ? mean + sd * v[p + q] : 0;
    const ssq = forward(x, used, e, phi, v.subarray(p, p + q), mu, p);
    last = Float64Array.from(v);
    lastSsq = ssq;
    lastA = phi;
    lastJac = jac;
    return ssq > 0 && terms.length > 0 ? Math.log(ssq / terms.length) : Infinity;
  };
  const gradient = (v: Float64Array): Float64Array | null => {
    if (!last || !(lastSsq > 0)) return null;
    for (let i = 0; i < k; i++) if (v[i] !== last[i]) return null;
    const mu = includeMean ? mean + sd * v[p + q] : 0;
    const d = adjoint(x, used, e, lambda, lastA, v.subarray(p, p + q), mu, p);
    const g = new Float64Array(k);
    for (let j = 0; j < p; j++) {
      let s = 0;
      for (let i = 0; i < p; i++) s += d[i] * lastJac[j * p + i];
      g[j] = s / lastSsq;
    }
    for (let j = 0; j < q; j++) g[p + j] = d[p + j] / lastSsq;
    if (includeMean) g[p + q] = (d[p + q] * sd) / lastSsq;
    return g;
  };
  const encode = (ar: ArrayLike<number>, ma: ArrayLike<number>, mu: number): Float64Array | null => {
    const u = fromStationary(ar);
    if (!u) return null;
    const v = new Float64Array(k);
    v.set(u, 0);
    for (let j = 0; j < q; j++) v[p + j] = ma[j];
    if (includeMean) v[p + q] = (mu - mean) / sd;
    return v;
  };
  return { k, objective, gradient, encode };
}

/**
 * The start in the fit's unconstrained values (AR, then MA), or null when the search fails or
 * its end cannot be carried into the region. `maxHours` keeps only the latest values.
 */
export function freeMaCssStart(series: Float64Array, p: number, q: number, includeMean: boolean, maxHours = 4000): Float64Array | null {
  const x = series.length > maxHours ? series.subarray(series.length - maxHours) : series;
  if (usableTerms(x, p).length <= p + q + 1) return null;
  const problem = freeMaCssProblem(x, p, q, includeMean);
  // A start, not an estimate: R's optim stops at a relative change of about 1e-8, and with the MA
  // part free the search can wander where the recursion explodes (Nile's ARMA(2,2) and
  // LakeHuron's ARMA(3,3) ran to 100 iterations without converging); 30 iterations gave the same
  // maxima on R's datasets as 100, at a third of the evaluations.
  const r = minimizeBfgs(problem.objective, new Float64Array(problem.k), { maxIter: 30, gradTol: 1e-6, fTol: 1e-8, step: 1e-6, gradient: problem.gradient });
  if (!Number.isFinite(r.f) || !r.x.every(Number.isFinite)) return null;
  const ar = fromStationary(toStationaryJacobian(r.x.subarray(0, p)).phi);
  const ma = fromInvertible(invertibleMa(r.x.subarray(p, p + q)));
  if (!ar || !ma || !ar.every(Number.isFinite) || !ma.every(Number.isFinite)) return null;
  const out = new Float64Array(p + q);
  out.set(ar, 0);
  out.set(ma, p);
  return out;
}

/**
 * Σ e_t² of e_t = (x_t − μ) − Σ a_i (x_{t−i} − μ) − Σ b_j e_{t−j}, zero pre-sample innovations,
 * conditioning on the first p values; an unusable term (a value of its window missing) adds
 * nothing and its innovation is zero, as in css.ts.
 */
function forward(x: Float64Array, used: Uint8Array, e: Float64Array, a: Float64Array, b: Float64Array, mu: number, p: number): number {
  const n = x.length;
  const q = b.length;
  let ssq = 0;
  e.fill(0);
  for (let t = p; t < n; t++) {
    if (!used[t]) continue;
    let v = x[t] - mu;
    for (let i = 0; i < p; i++) v -= a[i] * (x[t - i - 1] - mu);
    for (let j = 0; j < q && j < t; j++) v -= b[j] * e[t - j - 1];
    e[t] = v;
    ssq += v * v;
  }
  return ssq;
}

/**
 * ∂S/∂a_i, ∂S/∂b_j and ∂S/∂μ at the last forward pass, by one backward (adjoint) pass
 * (Griewank & Walther 2008, ch. 3): λ_t = 2e_t − Σ_j b_j λ_{t+j} on used terms (zero elsewhere),
 * ∂S/∂a_i = −Σ λ_t (x_{t−i} − μ), ∂S/∂b_j = −Σ λ_t e_{t−j}, ∂S/∂μ = −(1 − Σ a_i) Σ λ_t.
 */
function adjoint(x: Float64Array, used: Uint8Array, e: Float64Array, lambda: Float64Array, a: Float64Array, b: Float64Array, mu: number, p: number): Float64Array {
  const n = x.length;
  const q = b.length;
  const d = new Float64Array(p + q + 1);
  lambda.fill(0);
  let sumLambda = 0;
  for (let t = n - 1; t >= p; t--) {
    if (!used[t]) continue;
    let l = 2 * e[t];
    for (let j = 0; j < q && t + j + 1 < n; j++) l -= b[j] * lambda[t + j + 1];
    lambda[t] = l;
    sumLambda += l;
    for (let i = 0; i < p; i++) d[i] -= l * (x[t - i - 1] - mu);
    for (let j = 0; j < q && j < t; j++) d[p + j] -= l * e[t - j - 1];
  }
  let sumA = 0;
  for (let i = 0; i < p; i++) sumA += a[i];
  d[p + q] = -(1 - sumA) * sumLambda;
  return d;
}

/**
 * The MA polynomial 1 + Σ b_j B^j with every root inside the unit circle (or on it) moved to
 * modulus ≥ MIN_ROOT_MODULUS by reflection z → 1/z̄; the roots are the eigenvalues of the
 * companion matrix. The constant term stays 1 (the innovation variance absorbs the rest).
 */
export function invertibleMa(b: ArrayLike<number>): Float64Array {
  const q = b.length;
  if (q === 0) return new Float64Array(0);
  // roots of 1 + b₁z + … + b_q z^q are the reciprocals of the eigenvalues of the companion
  // matrix of z^q + b₁z^{q−1} + … + b_q (its reversed polynomial)
  if (b[q - 1] === 0) {
    const lower = invertibleMa(Array.from(b).slice(0, q - 1));
    const out = new Float64Array(q);
    out.set(lower);
    return out;
  }
  const companion = Matrix.zeros(q, q);
  for (let j = 0; j < q; j++) companion.set(0, j, -b[j]);
  for (let i = 1; i < q; i++) companion.set(i, i - 1, 1);
  const evd = new EigenvalueDecomposition(companion, { assumeSymmetric: false });
  const re = evd.realEigenvalues;
  const im = evd.imaginaryEigenvalues;
  // each factor (1 − λ z), λ = 1/root: |root| ≥ m means |λ| ≤ 1/m; reflecting the root is λ → 1/λ̄
  let polyRe = [1];
  let polyIm = [0];
  for (let r = 0; r < q; r++) {
    let lr = re[r];
    let li = im[r];
    const mod2 = lr * lr + li * li;
    if (mod2 > 1) {
      lr /= mod2;
      li /= mod2;
    }
    const mod = Math.hypot(lr, li);
    if (mod > 1 / MIN_ROOT_MODULUS) {
      lr *= 1 / (MIN_ROOT_MODULUS * mod);
      li *= 1 / (MIN_ROOT_MODULUS * mod);
    }
    const nextRe = new Array<number>(polyRe.length + 1).fill(0);
    const nextIm = new Array<number>(polyIm.length + 1).fill(0);
    for (let i = 0; i < polyRe.length; i++) {
      nextRe[i] += polyRe[i];
      nextIm[i] += polyIm[i];
      nextRe[i + 1] -= polyRe[i] * lr - polyIm[i] * li;
      nextIm[i + 1] -= polyRe[i] * li + polyIm[i] * lr;
    }
    polyRe = nextRe;
    polyIm = nextIm;
  }
  return Float64Array.from(polyRe.slice(1));
}
