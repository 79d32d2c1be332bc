/**
 * A second conditional-sum-of-squares start, searched close to the way R's arima searches its
 * CSS step (stats::arima, method "CSS-ML": its armaCSS leaves every coefficient as it is): the MA
 * coefficients as they are (unconstrained) and the mean as a parameter beside them, from zero
 * coefficients and the sample mean. The AR coefficients go through the partial-autocorrelation
 * transform, so that the end is stationary (R stops with "non-stationary AR part from CSS"
 * where its CSS end is not). css.ts searches
 * the MA part through the same transform as the AR part, which keeps it invertible all the way;
 * on short real series the CSS surface has several minima, and the two searches can end in
 * different ones. The MA roots of the end point that lie inside the unit circle are then
 * reflected to 1/z̄ (the exact Gaussian likelihood is the same for both: Brockwell & Davis 1991,
 * §3.5), which is what R's arima does before its ML step (maInvert). A seasonal block is searched
 * the same way: the seasonal AR part through the transform, the seasonal MA part as it is.
 *
 * Why it is kept beside css.ts's start: over R's datasets differenced as usual (EuStockMarkets'
 * log returns, WWWusage, beaver2, Seatbelts, BJsales.lead, JohnsonJohnson; every ARMA(p, q),
 * p, q ≤ 3), 11 of 375 fits ended below R's best log-likelihood by 0.02–0.75 from the other
 * starts, and 9 of them reach it from this one (engine/src/fixtures/r-arima-sweep.R; when it is
 * tried, fitArma).
 */
import { minimizeBfgs } from './bfgs';
import { CssOrders, usableTerms } from './css-problem';
import { expansionAdjoint, filledLags, reciprocalRoots } from './polynomials';
import { fromInvertible, fromStationary, toStationaryInto, toStationaryJacobian } from './transform';

/** How close to the unit circle a reflected MA root may stay (a start needs a finite transform). */
const MIN_ROOT_MODULUS = 1.001;

/** Coefficients in the fit's natural terms. */
export interface FreeMaNatural {
  ar: ArrayLike<number>;
  ma: ArrayLike<number>;
  sar?: ArrayLike<number>;
  sma?: ArrayLike<number>;
}

/**
 * The free-MA CSS objective log(Σ e_t² / m) over v = (AR unconstrained, MA as is, seasonal AR
 * unconstrained, seasonal MA as is, ν), with the mean μ = x̄ + s·ν.
 */
export interface FreeMaCssProblem {
  /** length of v */
  k: number;
  objective: (v: Float64Array) => number;
  /** at the point of the last evaluation (null elsewhere) */
  gradient: (v: Float64Array) => Float64Array | null;
  /** v for stationary AR parts, MA parts and a mean (null when an AR part is not stationary) */
  encode: (nat: FreeMaNatural, mean: number) => Float64Array | null;
}

export function freeMaCssProblem(x: Float64Array, o: CssOrders, includeMean: boolean): FreeMaCssProblem {
  const { p, q, P, Q } = o;
  const s = o.period || 1;
  const nAr = p + P * s;
  const nMa = q + Q * s;
  const terms = usableTerms(x, nAr);
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
  const k = p + q + P + Q + (includeMean ? 1 : 0);
  const at = (v: Float64Array, from: number, len: number) => v.subarray(from, from + len);
  const e = new Float64Array(x.length);
  const lambda = new Float64Array(x.length);
  const aLags = filledLags(p, P, s);
  const bLags = filledLags(q, Q, s);
  let last: Float64Array | null = null;
  let lastSsq = NaN;
  // the coefficients of the last evaluation, in buffers of their own (the search evaluates the
  // objective some dozens of times and a start must cost little beside the fit)
  const phi = new Float64Array(p);
  const sphi = new Float64Array(P);
  const work = new Float64Array(Math.max(p, P, 1));
  const a = new Float64Array(nAr);
  const b = new Float64Array(nMa);
  let lastMu = 0;
  const objective = (v: Float64Array): number => {
    toStationaryInto(v, 0, p, phi, work, 1);
    toStationaryInto(v, p + q, P, sphi, work, 1);
    expandInto(a, phi, sphi, s, -1);
    expandInto(b, v.subarray(p, p + q), v.subarray(p + q + P, p + q + P + Q), s, 1);
    lastMu = includeMean ? mean + sd * v[k - 1] : 0;
    const ssq = forward(x, used, e, a, aLags, b, bLags, lastMu, nAr);
    if (last) last.set(v);
    else last = Float64Array.from(v);
    lastSsq = ssq;
    return ssq > 0 && terms.length > 0 ? Math.log(ssq / terms.length) : Infinity;
  };
  const gradient = (v: Float64Array): Float64Array | null => {
    if (!last || !(lastSsq > 0)) return null;
    for (let i = 0; i < k; i++) if (v[i] !== last[i]) return null;
    // ∂S/∂a_L, ∂S/∂b_L at the filled lags (index L − 1) and ∂S/∂μ
    const dA = new Float64Array(nAr);
    const dB = new Float64Array(nMa);
    const dMu = adjoint(x, used, e, lambda, a, aLags, b, bLags, lastMu, nAr, dA, dB);
    const ar = toStationaryJacobian(at(v, 0, p));
    const sar = toStationaryJacobian(at(v, p + q, P));
    const theta = at(v, p, q);
    const stheta = at(v, p + q + P, Q);
    // through the expansion: a_{js+i} = −φ_i Φ_j, b_{js+i} = θ_i Θ_j (polynomials.ts)
    const { dc: dPhi, dC: dSphi } = expansionAdjoint(dA, ar.phi, sar.phi, s, -1);
    const { dc: dTheta, dC: dStheta } = expansionAdjoint(dB, theta, stheta, s, 1);
    const g = new Float64Array(k);
    for (let i = 0; i < q; i++) g[p + i] = dTheta[i] / lastSsq;
    for (let j = 0; j < Q; j++) g[p + q + P + j] = dStheta[j] / lastSsq;
    // the AR parts through the transform's Jacobians, jac[j·m + i] = ∂φ_i/∂v_j
    const chain = (d: Float64Array, jac: Float64Array, m: number, from: number) => {
      for (let j = 0; j < m; j++) {
        let sum = 0;
        for (let i = 0; i < m; i++) sum += d[i] * jac[j * m + i];
        g[from + j] = sum / lastSsq;
      }
    };
    chain(dPhi, ar.jac, p, 0);
    chain(dSphi, sar.jac, P, p + q);
    if (includeMean) g[k - 1] = (dMu * sd) / lastSsq;
    return g;
  };
  const encode = (nat: FreeMaNatural, mu: number): Float64Array | null => {
    const u = fromStationary(nat.ar);
    const su = fromStationary(nat.sar ?? []);
    if (!u || !su) return null;
    const v = new Float64Array(k);
    v.set(u, 0);
    for (let j = 0; j < q; j++) v[p + j] = nat.ma[j];
    v.set(su, p + q);
    for (let j = 0; j < Q; j++) v[p + q + P + j] = (nat.sma ?? [])[j];
    if (includeMean) v[k - 1] = (mu - mean) / sd;
    return v;
  };
  return { k, objective, gradient, encode };
}

/**
 * The start in the fit's unconstrained values (AR, MA, seasonal AR, seasonal MA), or null when
 * the search fails or its end cannot be carried into the region. `maxHours` keeps only the
 * latest values.
 */
export function freeMaCssStart(series: Float64Array, o: CssOrders, includeMean: boolean, maxHours = 4000): Float64Array | null {
  const x = series.length > maxHours ? series.subarray(series.length - maxHours) : series;
  const { p, q, P, Q } = o;
  if (usableTerms(x, p + P * (o.period || 1)).length <= p + q + P + Q + 1) return null;
  const problem = freeMaCssProblem(x, o, includeMean);
  // A start, not an estimate: R's optim stops at a relative change of about 1e-8, and with the MA
  // part free the search can wander where the recursion explodes (Nile's ARMA(2,2) and
  // LakeHuron's ARMA(3,3) ran to 100 iterations without converging); 30 iterations gave the same
  // maxima on R's datasets as 100, at a third of the evaluations.
  const r = minimizeBfgs(problem.objective, new Float64Array(problem.k), { maxIter: 30, gradTol: 1e-6, fTol: 1e-8, step: 1e-6, gradient: problem.gradient });
  if (!Number.isFinite(r.f) || !r.x.every(Number.isFinite)) return null;
  const at = (from: number, len: number) => r.x.subarray(from, from + len);
  const parts = [
    fromStationary(toStationaryJacobian(at(0, p)).phi),
    fromInvertible(invertibleMa(at(p, q))),
    fromStationary(toStationaryJacobian(at(p + q, P)).phi),
    fromInvertible(invertibleMa(at(p + q + P, Q))),
  ];
  const out = new Float64Array(p + q + P + Q);
  let from = 0;
  for (const part of parts) {
    if (!part || !part.every(Number.isFinite)) return null;
    out.set(part, from);
    from += part.length;
  }
  return out;
}

/**
 * expandAr (sign −1) or expandMa (sign +1) of polynomials.ts written into out: c_i at lag i,
 * C_j at lag js, sign·c_i·C_j at lag js + i.
 */
function expandInto(out: Float64Array, c: ArrayLike<number>, C: ArrayLike<number>, s: number, sign: number): void {
  out.fill(0);
  for (let i = 0; i < c.length; i++) out[i] += c[i];
  for (let j = 0; j < C.length; j++) {
    out[(j + 1) * s - 1] += C[j];
    for (let i = 0; i < c.length; i++) out[(j + 1) * s + i] += sign * c[i] * C[j];
  }
}

/**
 * Σ e_t² of e_t = (x_t − μ) − Σ a_L (x_{t−L} − μ) − Σ b_L e_{t−L} over the expanded polynomials'
 * fillable lags, zero pre-sample innovations, conditioning on the first p + P·s values; an
 * unusable term (a value of its window missing) adds nothing and its innovation is zero, as in
 * css.ts.
 */
function forward(x: Float64Array, used: Uint8Array, e: Float64Array, a: Float64Array, aLags: Int32Array, b: Float64Array, bLags: Int32Array, mu: number, from: number): number {
  const n = x.length;
  let ssq = 0;
  e.fill(0);
  for (let t = from; t < n; t++) {
    if (!used[t]) continue;
    let v = x[t] - mu;
    for (let k = 0; k < aLags.length; k++) v -= a[aLags[k] - 1] * (x[t - aLags[k]] - mu);
    for (let k = 0; k < bLags.length; k++) {
      const l = t - bLags[k];
      if (l >= 0) v -= b[bLags[k] - 1] * e[l];
    }
    e[t] = v;
    ssq += v * v;
  }
  return ssq;
}

/**
 * ∂S/∂a_L and ∂S/∂b_L (into dA, dB at index L − 1) and ∂S/∂μ (returned) at the last forward
 * pass, by one backward (adjoint) pass (Griewank & Walther 2008, ch. 3):
 *   λ_t = 2e_t − Σ_L b_L λ_{t+L} on used terms (zero elsewhere),
 *   ∂S/∂a_L = −Σ λ_t (x_{t−L} − μ), ∂S/∂b_L = −Σ λ_t e_{t−L}, ∂S/∂μ = −(1 − Σ a_L) Σ λ_t.
 */
function adjoint(
  x: Float64Array,
  used: Uint8Array,
  e: Float64Array,
  lambda: Float64Array,
  a: Float64Array,
  aLags: Int32Array,
  b: Float64Array,
  bLags: Int32Array,
  mu: number,
  from: number,
  dA: Float64Array,
  dB: Float64Array,
): number {
  const n = x.length;
  lambda.fill(0);
  let sumLambda = 0;
  for (let t = n - 1; t >= from; t--) {
    if (!used[t]) continue;
    let l = 2 * e[t];
    for (let k = 0; k < bLags.length; k++) {
      const f = t + bLags[k];
      if (f < n) l -= b[bLags[k] - 1] * lambda[f];
    }
    lambda[t] = l;
    sumLambda += l;
    for (let k = 0; k < aLags.length; k++) dA[aLags[k] - 1] -= l * (x[t - aLags[k]] - mu);
    for (let k = 0; k < bLags.length; k++) {
      const f = t - bLags[k];
      if (f >= 0) dB[bLags[k] - 1] -= l * e[f];
    }
  }
  let sumA = 0;
  for (let L = 0; L < a.length; L++) sumA += a[L];
  return -(1 - sumA) * sumLambda;
}

/**
 * The MA polynomial 1 + Σ b_j B^j with every root inside the unit circle (or on it) moved to
 * modulus ≥ MIN_ROOT_MODULUS by reflection z → 1/z̄; the roots are the reciprocals of the
 * eigenvalues of a companion matrix (reciprocalRoots). The constant term stays 1 (the innovation
 * variance absorbs the rest).
 */
export function invertibleMa(b: ArrayLike<number>): Float64Array {
  const q = b.length;
  if (q === 0) return new Float64Array(0);
  if (b[q - 1] === 0) {
    const lower = invertibleMa(Array.from(b).slice(0, q - 1));
    const out = new Float64Array(q);
    out.set(lower);
    return out;
  }
  const { re, im } = reciprocalRoots(b);
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
