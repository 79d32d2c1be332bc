/**
 * Exact maximum-likelihood estimation of ARMA(p, q) with an optional multiplicative seasonal
 * block (P, Q)_s and an optional mean (Box & Jenkins 1970; Harvey 1989):
 *  - starting values by Hannan–Rissanen (1982), or by the method of moments for MA(1) and
 *    ARMA(1,1) (moment-start.ts),
 *  - coefficients kept stationary / invertible through the partial-autocorrelation transform
 *    (Barndorff-Nielsen & Schou 1973; Jones 1980; Monahan 1984),
 *  - objective the exact Gaussian likelihood from the Kalman filter with σ² concentrated out and
 *    the mean concentrated out by GLS, initial covariance by Gardner, Harvey & Phillips (1980),
 *  - BFGS on the unconstrained values, started from the information matrix (information.ts), with
 *    the exact gradient for a complete series, with a mean by the envelope theorem (steady-score.ts, or
 *    chandrasekhar-score.ts where the filter settles late or never) and forward differences
 *    otherwise; for AR and MA orders both ≥ 2 a second search from the conditional-sum-of-squares
 *    estimate (css.ts) and, when the two end at different maxima, more: from all-zero
 *    coefficients, from an AR part and an MA part leaning opposite ways and (without a seasonal
 *    block) from an MA root at the unit circle, the highest kept; on short series (and those
 *    close to white noise) also from the CSS estimate with the MA part unconstrained
 *    (css-free-ma.ts) and from an AR root near the unit circle, and with four coefficients or
 *    more from zero with the MA coefficients searched as they are (R's "ML" search; its end is
 *    brought into the region and searched again there);
 *    a search that ends on the
 *    boundary of the stationary / invertible region (onBoundary) is searched again from the
 *    CSS estimate and from zero, the highest kept; a later search that comes close to a
 *    maximum an earlier one ended at, no higher than it, stops and reports that maximum,
 *  - standard errors from the inverse of a forward-difference Hessian of −log L in the natural
 *    parameters (with the mean as a free parameter), as the observed information.
 * Information criteria follow the usual definitions with k = number of coefficients + 1 (σ²):
 * AIC = −2 log L + 2k (Akaike 1974), AICc = AIC + 2k(k+1)/(n−k−1) (Hurvich & Tsai 1989),
 * BIC = −2 log L + k log n (Schwarz 1978).
 */
import { Matrix, inverse } from 'ml-matrix';
import { BfgsResult, minimizeBfgs } from './bfgs';
import { chandrasekharScore } from './chandrasekhar-score';
import { gapScore } from './gap-score';
import { cssStart } from './css';
import { freeMaCssStart, invertibleMa } from './css-free-ma';
import { hannanRissanen } from './hannan-rissanen';
import { hasMomentStart, momentStart } from './moment-start';
import { armaInformation, inverseSpd } from './information';
import { concentratedLogLik, FilterResult, kalmanFilter } from './kalman';
import { expandAr, expandMa, reciprocalRoots } from './polynomials';
import { armaStateSpace, ArmaStateSpace } from './state-space';
import { SteadyPass, steadyStateScore } from './steady-score';
import { stateSpaceWithTangents } from './state-space-tangents';
import { fromInvertible, fromStationary, toInvertible, toStationary, toStationaryInto } from './transform';
import { acf } from '../series/acf';
import { countFinite, meanFinite, toSeries, varianceFinite } from '../series/series';

export interface ArmaSpec {
  p: number;
  q: number;
  /** seasonal AR order */
  P?: number;
  /** seasonal MA order */
  Q?: number;
  /** seasonal period (needed when P or Q > 0) */
  period?: number;
  includeMean?: boolean;
}

export interface Coefficient {
  name: string;
  value: number;
  se: number;
}

export interface ArmaForecast {
  /** forecasts of the series for the next h steps */
  mean: Float64Array;
  /** joint covariance of the forecast errors, row-major h×h (σ² included) */
  cov: Float64Array;
}

export interface ArmaFit {
  spec: Required<ArmaSpec>;
  coefficients: Coefficient[];
  ar: Float64Array;
  ma: Float64Array;
  sar: Float64Array;
  sma: Float64Array;
  mean: number;
  sigma2: number;
  loglik: number;
  aic: number;
  aicc: number;
  bic: number;
  /** observations used in the likelihood (finite values) */
  nUsed: number;
  /** standardized one-step innovations v_t/√F_t, NaN where the series is missing */
  residuals: Float64Array;
  /** one-step predictions of every point of the series, including missing ones */
  predictions: Float64Array;
  converged: boolean;
  /** BFGS iterations of the search that was kept */
  iterations: number;
  /** likelihood evaluations of the estimation, over every start */
  evaluations: number;
  /** where the search that was kept began */
  startedFrom: 'given' | 'hannan-rissanen' | 'moments' | 'zero' | 'opposed' | 'ma-unit-root' | 'ar-unit-root' | 'css' | 'css-free-ma' | 'natural-ma' | 'seasonal-unit-root' | 'ma-circle';
  /** wall time of the estimation, ms */
  fitMs: number;
  forecast(h: number): ArmaForecast;
}

export interface FitOptions {
  computeSe?: boolean;
  maxIter?: number;
  /** starting values in the natural parameters, order ar, ma, sar, sma */
  start?: { ar?: ArrayLike<number>; ma?: ArrayLike<number>; sar?: ArrayLike<number>; sma?: ArrayLike<number> };
  /** steady-state tolerance of the filter */
  tol?: number;
  /**
   * BFGS stops when one step lowers the objective (−log L / n) by less than this relative
   * amount (default 1e-13). Order selection uses a looser value: it compares log-likelihoods
   * to about 0.01, and an overparameterised candidate on a flat ridge otherwise spends dozens of
   * iterations on the last digits.
   */
  fTol?: number;
  /**
   * Search a second time from all-zero coefficients and keep the higher likelihood. Default: on
   * when both the AR and the MA order are two or more and no `start` is given (see fitArma).
   */
  secondStart?: boolean;
  /**
   * Search again from other starts when the search ends on the boundary (onBoundary), and, with
   * a seasonal block, from the CSS estimate when that lies above where the search ended. Default
   * on; order selection turns it off for its candidates (a candidate that stops on the boundary
   * is rarely the best, and the chosen order's final fit searches again): with a seasonal block
   * each restart costs seconds on a series whose filter never reaches its steady state.
   */
  boundaryRestarts?: boolean;
  /** half-width of the box around a maximum already found that a later search stops in
   *  (default KNOWN_BASIN_RADIUS; 0 lets every search run to its end) */
  knownBasinRadius?: number;
  /** the natural-MA start where fitArma runs it (default on; off only to measure what it does) */
  naturalMaStart?: boolean;
}

/**
 * The backward Chandrasekhar score costs three to four passes and the stationary covariance's
 * tangents; forward differences cost k passes. From four coefficients on it costs no more, and
 * its exact values take the search to the maximum in fewer iterations (ARMA(0,2)(1,1)_24 on the
 * daily-differenced demand series: 69 likelihood evaluations instead of 268).
 */
const CHANDRASEKHAR_SCORE_MIN_K = 4;
/**
 * With missing values, the exact gradient through them (gap-score.ts), for a state of up to 4
 * (every order p, q ≤ 3 without a seasonal block) from this many coefficients, or with an MA
 * part of this order (it keeps P moving for long after each gap, and every hour where P moves is
 * dear to difference). It costs about four likelihood passes there, differences k. On the
 * weekly- and doubly differenced demand series with five hours taken out, measured fit by fit in
 * one process against differences (the same maxima): with four coefficients or more 0.51–0.94
 * of the time, MA(3) 0.66–0.84; the other orders of three coefficients 0.99–1.12, of one or two
 * 1.09–1.64.
 */
const GAP_SCORE_MIN_K = 4;
const GAP_SCORE_MIN_Q = 3;
/**
 * A larger state (a seasonal block at 4 or 12: 5–12) from this many coefficients: the gradient
 * costs four to six passes there. (Presidents' (3,0,2)(0,0,1)_4, six coefficients, reaches R's
 * maximum on the unit circle only with it: fit-r-sweep.spec.ts.)
 */
const GAP_SCORE_MIN_K_LARGE = 5;
/**
 * A state beyond 12 (a seasonal block at 24: 25–28) from this many coefficients. The gradient
 * costs about as much there as seven to ten likelihood passes since those passes carry the
 * deviation at its numerical rank (deviation-rank.ts); with seven hours out of the demand series,
 * measured fit by fit in one process against differences (the same maxima): five coefficients
 * 1.02–1.28 of the time, six 0.94–1.37, seven 0.93–1.22 (1.01 in all), eight 0.71–0.81.
 */
const GAP_SCORE_MIN_K_HOURLY = 7;
const GAP_SCORE_MAX_STATE = 32;

/** Orders whose likelihood commonly has several maxima (near-cancelling AR and MA roots). */
export function needsSecondStart(o: Required<ArmaSpec>): boolean {
  return o.p >= 2 && o.q >= 2;
}

/**
 * Partial autocorrelations (|tanh u|) within this distance of 1 mark a search that ended on the
 * boundary of the stationary or invertible region (a root on the unit circle to three digits).
 */
export const BOUNDARY_MARGIN = 1e-3;

/**
 * The longest series searched from the free-MA CSS start as well unless close to white noise,
 * and from the CSS estimate and zero whatever the order (see fitArma): a short series, where one
 * more search costs little beside R's fit (the demand series and their windows are longer).
 */
const FREE_MA_START_MAX_LENGTH = 1000;
/**
 * Close to white noise: the first ten autocorrelations' squares sum to less than this. The four
 * EuStockMarkets log returns give 0.003–0.016; of the long series of the bench, the demand series
 * differenced by (1 − B)(1 − B¹⁶⁸) gives 0.086 and treering 0.090, the others 3–9.
 */
const NEAR_WHITE_NOISE = 0.03;

/**
 * The orders searched from the free-MA CSS start as well: without a seasonal block, p, q ≥ 1 and
 * p + q ≥ 3 (ARMA(1,1) and the pure orders had one maximum in every case of the sweep); with one,
 * any MA part and three coefficients or more.
 */
function wantsFreeMaStart(o: Required<ArmaSpec>): boolean {
  if (o.P + o.Q === 0) return o.p >= 1 && o.q >= 1 && o.p + o.q >= 3;
  return o.q + o.Q >= 1 && o.p + o.q + o.P + o.Q >= 3;
}

function nearWhiteNoise(x: Float64Array): boolean {
  const rho = acf(x, 10);
  let s = 0;
  for (let k = 1; k <= 10; k++) s += rho[k] * rho[k];
  return s < NEAR_WHITE_NOISE;
}
/** The first partial autocorrelation of the AR-unit-root start (see fitArma): a root at 1/0.95 ≈ 1.05. */
const AR_UNIT_ROOT_START = 0.95;

/**
 * The fewest coefficients (AR, MA and seasonal) a fit with a seasonal block has for the
 * natural-MA start to run (see fitArma). Six at first (every fit that gained over the sweeps of
 * fixtures/r-arima-sweep.R had six or more); four since a fourth round of series the starts were
 * not tuned on (fixtures/r-arima-further.R): UKgas (1 − B)(1 − B⁴) (1,0,1)(1,0,1)_4 ended 2.4
 * below R's "ML", which reaches a seasonal AR root near 1 nearly cancelled by a seasonal MA
 * root (0.98 against −0.93) where every search in the region slid onto SMA = +1; from here it
 * gets there, and (1,0,2)(1,0,1)_4 rises 2.5. Over the sweeps and those series (3,180 fits) no
 * fit went below R's best, two on a boundary where seasonal AR and MA cancel exactly (ldeaths
 * (0,0,2)(1,0,1)_12 and (1,0,2)(1,0,1)_12, both above R's) ended 1.1 and 2.4 lower, and the
 * seasonal fits of short series cost 3–13 % more evaluations (long series do not run this start
 * unless close to white noise). From three coefficients: nothing more gained.
 */
const NATURAL_MA_START_MIN_COEFFICIENTS = 4;
/** The natural-MA start's iterations: a start, refined in the region afterwards (see fitArma). */
const NATURAL_MA_START_ITERATIONS = 20;
/**
 * The same for an order without a seasonal block: from four coefficients, with 40 iterations.
 * On series outside the sweeps the start was tuned on (fixtures/r-arima-further.R), nottem
 * (1 − B¹²) ARMA(2,2) ended 4.2 below R's "ML", which has an MA pair on the circle at the
 * six-month period (one of the roots the seasonal difference brings); from here it reaches it,
 * with 25 iterations or more. (UKDriverDeaths (1 − B¹²) ARMA(3,1), 6.0 below with its MA root at
 * −1, is reached from here and from zero.) Over the three sweeps of fixtures/r-arima-sweep.R no
 * maximum moved, for 6 % more evaluations.
 */
const NATURAL_MA_START_MIN_COEFFICIENTS_PLAIN = 4;
const NATURAL_MA_START_ITERATIONS_PLAIN = 40;

/** See `maxima` in fitArma: the half-width of the box around a known maximum that a later search stops in. */
export const KNOWN_BASIN_RADIUS = 0.2;
/**
 * Iterations in a row a search stays in that box before it is taken to have joined the maximum.
 * One step can pass through the box on its way elsewhere: on co2 (1 − B¹²) with a mean,
 * (0,0,0)(1,0,1)_12's search from zero landed 0.1 from the Hannan–Rissanen maximum at its first
 * iteration and was stopped there, where it goes on to a maximum 6.5 higher (R's "CSS-ML"
 * reaches it). Over the demand orders of `npm run bench` it costs 0–3 evaluations a fit.
 */
const KNOWN_BASIN_STAY = 2;

/** Whether every value of u lies within r of the same value of c. */
function withinBox(u: ArrayLike<number>, c: ArrayLike<number>, r: number): boolean {
  for (let i = 0; i < u.length; i++) if (!(Math.abs(u[i] - c[i]) < r)) return false;
  return true;
}

/** Whether unconstrained values lie on the boundary (see BOUNDARY_MARGIN). */
export function onBoundary(u: ArrayLike<number>): boolean {
  for (let i = 0; i < u.length; i++) if (!(Math.abs(Math.tanh(u[i])) < 1 - BOUNDARY_MARGIN)) return true;
  return false;
}

export function normalizeSpec(spec: ArmaSpec): Required<ArmaSpec> {
  const P = spec.P ?? 0;
  const Q = spec.Q ?? 0;
  const period = spec.period ?? 0;
  if (P + Q > 0 && !(period > 1)) throw new Error('a seasonal block needs a period > 1');
  for (const [k, v] of Object.entries({ p: spec.p, q: spec.q, P, Q })) {
    if (!Number.isInteger(v) || v < 0) throw new Error(`order ${k} must be a non-negative integer`);
  }
  return { p: spec.p, q: spec.q, P, Q, period: P + Q > 0 ? period : 0, includeMean: spec.includeMean ?? true };
}

interface Natural {
  ar: Float64Array;
  ma: Float64Array;
  sar: Float64Array;
  sma: Float64Array;
}

function stateSpaceOf(nat: Natural, s: number): ArmaStateSpace {
  const a = expandAr(nat.ar, nat.sar, s || 1);
  const b = expandMa(nat.ma, nat.sma, s || 1);
  return armaStateSpace(a, b);
}

function splitNatural(v: ArrayLike<number>, o: Required<ArmaSpec>): Natural {
  let k = 0;
  const take = (m: number): Float64Array => {
    const out = new Float64Array(m);
    for (let i = 0; i < m; i++) out[i] = v[k++];
    return out;
  };
  const ar = take(o.p);
  const ma = take(o.q);
  const sar = take(o.P);
  const sma = take(o.Q);
  return { ar, ma, sar, sma };
}

function fromUnconstrained(u: Float64Array, o: Required<ArmaSpec>): Natural {
  const raw = splitNatural(u, o);
  return { ar: toStationary(raw.ar), ma: toInvertible(raw.ma), sar: toStationary(raw.sar), sma: toInvertible(raw.sma) };
}

/** u of the natural-MA start (AR values transformed, MA values as they are) as coefficients. */
function naturalMaOf(u: Float64Array, o: Required<ArmaSpec>): Natural {
  const raw = splitNatural(u, o);
  return { ar: toStationary(raw.ar), ma: raw.ma, sar: toStationary(raw.sar), sma: raw.sma };
}

/**
 * The end of the natural-MA search in the transform's values: MA roots inside the unit circle
 * reflected out (the same likelihood; css-free-ma.ts), roots on it moved just outside.
 */
function intoRegion(u: Float64Array, o: Required<ArmaSpec>): Float64Array | null {
  const raw = splitNatural(u, o);
  const out = toUnconstrained({ ar: toStationary(raw.ar), ma: invertibleMa(raw.ma), sar: toStationary(raw.sar), sma: invertibleMa(raw.sma) });
  return out && out.every(Number.isFinite) ? out : null;
}

function toUnconstrained(nat: Natural): Float64Array | null {
  const parts = [fromStationary(nat.ar), fromInvertible(nat.ma), fromStationary(nat.sar), fromInvertible(nat.sma)];
  if (parts.some((p) => p === null)) return null;
  const out: number[] = [];
  for (const p of parts) out.push(...(p as Float64Array));
  return Float64Array.from(out);
}

export function fitArma(series: ArrayLike<number>, specIn: ArmaSpec, opts: FitOptions = {}): ArmaFit {
  const t0 = performance.now();
  const o = normalizeSpec(specIn);
  const x = toSeries(series);
  const nFinite = countFinite(x);
  const k = o.p + o.q + o.P + o.Q;
  const nCoef = k + (o.includeMean ? 1 : 0);
  if (nFinite < nCoef + 3) throw new Error(`too few observations (${nFinite}) for ${nCoef} coefficients`);
  const tol = opts.tol ?? 1e-10;
  const s = o.period;

  // starting values
  const m0 = o.includeMean ? meanFinite(x) : 0;
  let centred = x;
  if (o.includeMean) {
    centred = new Float64Array(x.length);
    for (let t = 0; t < x.length; t++) centred[t] = x[t] - m0;
  }
  const st = opts.start;
  // a start given in full (the hourly update, a selected order's final fit) needs no regression
  const none = new Float64Array(0);
  const moments = !st && hasMomentStart(o.p, o.q, o.P, o.Q) ? momentStart(centred, o.p as 0 | 1) : null;
  const hr =
    st?.ar && st.ma && st.sar && st.sma
      ? { ar: none, ma: none, sar: none, sma: none }
      : moments
        ? { ...moments, sar: none, sma: none }
        : hannanRissanen(centred, { p: o.p, q: o.q, P: o.P, Q: o.Q, period: s || 1 });
  const startNat: Natural = {
    ar: st?.ar ? Float64Array.from(st.ar) : hr.ar,
    ma: st?.ma ? Float64Array.from(st.ma) : hr.ma,
    sar: st?.sar ? Float64Array.from(st.sar) : hr.sar,
    sma: st?.sma ? Float64Array.from(st.sma) : hr.sma,
  };
  const startInRegion = toUnconstrained(startNat);
  const u0 = startInRegion ?? new Float64Array(k);

  const complete = nFinite === x.length;
  const model = s === 0 ? nonSeasonalModel(o.p, o.q) : (u: Float64Array): ArmaStateSpace => stateSpaceOf(fromUnconstrained(u, o), s);
  const step = 1e-6;
  // A complete series: the likelihood's gradient exactly, by a backward pass over the steady
  // stretch joined to one over the start-up (steady-score.ts), which pays from three
  // coefficients on; otherwise the whole likelihood is forward-differenced. With a mean the
  // objective is the
  // likelihood profiled over it (its GLS estimate μ̂(u) at each u), and by the envelope theorem
  // its gradient is the gradient at the mean held at μ̂(u) (the derivative through μ̂ vanishes
  // at the minimum over the mean; Magnus & Neudecker 1999, ch. 7): the score of the known-mean
  // likelihood of x − μ̂, whose predictions the profiled pass leaves as well (kalman.ts, traceOnes).
  const withMean = o.includeMean;
  // The coordinates the searches run in: the transform's (every search) or, for the natural-MA
  // start only, the MA coefficients as they are (see there).
  let naturalMa = false;
  const naturalModel = (u: Float64Array): ArmaStateSpace => stateSpaceOf(naturalMaOf(u, o), s);
  // With missing values the gradient comes from the filter through them run backwards
  // (gap-score.ts) where that pays (GAP_SCORE_MIN_K and the constants beside it).
  const stateSize = Math.max(o.p + o.P * s, o.q + o.Q * s + 1);
  const gapScored = !complete && stateSize <= GAP_SCORE_MAX_STATE && (stateSize > 12 ? k >= GAP_SCORE_MIN_K_HOURLY : stateSize > 4 ? k >= GAP_SCORE_MIN_K_LARGE : k >= GAP_SCORE_MIN_K || o.q >= GAP_SCORE_MIN_Q);
  const scoreInput = (complete && k >= 3) || gapScored ? { x: withMean ? new Float64Array(x.length) : x, model: (u: Float64Array) => stateSpaceWithTangents(u, o, naturalMa) } : null;
  // the last evaluation's point and what its filter left for the steady-state score there
  const lastU = new Float64Array(k);
  let lastValid = false;
  let lastPass: SteadyPass | null = null;
  let lastSteadyAt = -1;
  let lastMean = 0;
  const trace = scoreInput && complete ? new Float64Array(x.length) : undefined;
  const traceOnes = trace && withMean ? new Float64Array(x.length) : undefined;
  // with a mean: whether lastPass has been carried to x − μ̂ yet (atMean)
  let lastAtMean = false;
  const objective = (u: Float64Array): number => {
    const ss = naturalMa ? naturalModel(u) : model(u);
    let f: FilterResult;
    lastValid = false;
    try {
      f = kalmanFilter(x, ss, { profileMean: withMean, tol, complete, trace, traceOnes });
    } catch {
      // a root on the unit circle to machine precision (the transform's tanh saturates far out):
      // no stationary covariance there, so no likelihood; the line search steps back
      return Infinity;
    }
    if (!(f.ssq > 0)) return Infinity;
    lastU.set(u);
    lastValid = true;
    lastPass = f.entry && trace ? { ssq: f.ssq, entry: f.entry, trace } : null;
    lastSteadyAt = f.steadyAt;
    lastMean = f.mean;
    lastAtMean = false;
    return 0.5 * Math.log(f.ssq / f.nUsed) + (0.5 * f.sumLogF) / f.nUsed;
  };
  /**
   * With a mean: the last pass carried to x − μ̂(u), what the steady-state score reads. The
   * profiled pass filtered the column of ones beside the data with the same gains, so the
   * predictions of x − μ̂ are a − μ̂ c and the start-up's sum of squares is
   * Σ v²/F − 2μ̂ Σ v v₁/F + μ̂² Σ v₁²/F (kalman.ts, traceOnes): no second pass.
   */
  const atMean = (xc: Float64Array): void => {
    subtractInto(x, lastMean, xc);
    if (lastAtMean) return;
    lastAtMean = true;
    const e = lastPass?.entry;
    if (!lastPass || !e?.ones || !traceOnes) {
      lastPass = null;
      return;
    }
    const mu = lastMean;
    removeMultiple(lastPass.trace, traceOnes, mu, e.steadyAt + 1);
    const a = new Float64Array(e.a.length);
    for (let i = 0; i < a.length; i++) a[i] = e.a[i] - mu * e.ones.c[i];
    lastPass = { ssq: lastPass.ssq, trace: lastPass.trace, entry: { ...e, ssq: e.ssq - 2 * mu * e.ones.sxy + mu * mu * e.ones.sxx, a, ones: undefined } };
  };
  // Where the filter settles late or never (a seasonal MA part near the unit circle), the
  // steady-state score has nothing to work on; the gradient then comes from the Chandrasekhar
  // recursions run backwards (chandrasekhar-score.ts), three to four passes' work instead of k.
  const gradient = scoreInput
    ? (u: Float64Array): Float64Array | null => {
        if (!lastValid || !sameValues(lastU, u)) return null;
        if (gapScored) {
          if (withMean) subtractInto(x, lastMean, scoreInput.x);
          try {
            return gapScore(scoreInput.x, scoreInput.model(u), k, tol);
          } catch {
            return null;
          }
        }
        if (withMean) atMean(scoreInput.x);
        const steady = lastPass ? steadyStateScore(scoreInput, u, lastPass) : null;
        if (steady || k < CHANDRASEKHAR_SCORE_MIN_K) return steady;
        // the steady score declined a filter that settles (its start-up's derivatives failed):
        // differences cost k passes that stop where the filter settles; the backward score
        // three to four passes over the whole series without that stop
        if (lastSteadyAt >= 0 && k * (lastSteadyAt + 1) < 3 * x.length) return null;
        try {
          return chandrasekharScore(scoreInput.x, scoreInput.model(u), k);
        } catch {
          return null;
        }
      }
    : undefined;
  // The maxima the searches of this fit have ended at. A later search that comes within
  // KNOWN_BASIN_RADIUS of one of them (in every unconstrained value) without having got higher
  // than it has fallen into its basin and would only climb to it: it stops there and reports
  // that maximum (`joined`). On the demand series and R's datasets the second, third and fourth
  // starts mostly end at a maximum an earlier one found, and the last third to half of their
  // evaluations were that climb (weekly-differenced ARMA(3,3): the opposed start entered the
  // zero start's basin at its 55th of 70 iterations). It must stay there for KNOWN_BASIN_STAY
  // iterations in a row.
  const maxima: BfgsResult[] = [];
  // searches stopped on their slide onto the boundary, with the start each began from
  const slideStops: Array<{ r: BfgsResult; from: ArmaFit['startedFrom'] }> = [];
  let searchingFrom: ArmaFit['startedFrom'] = 'given';
  const basinRadius = opts.knownBasinRadius ?? KNOWN_BASIN_RADIUS;
  const search = (from: Float64Array, stopWhen?: (u: Float64Array) => boolean): BfgsResult => {
    let joined: BfgsResult | null = null;
    let inBox = 0;
    let near: BfgsResult | null = null;
    const stop = (u: Float64Array, fu: number): boolean => {
      if (stopWhen?.(u)) return true;
      const m = maxima.find((m) => fu >= m.f && withinBox(u, m.x, basinRadius)) ?? null;
      if (m && m === near) inBox++;
      else inBox = m ? 1 : 0;
      near = m;
      if (inBox >= KNOWN_BASIN_STAY) joined = m;
      return joined !== null;
    };
    const r = minimizeBfgs(objective, from, {
      maxIter: opts.maxIter ?? 200,
      gradTol: 1e-7,
      fTol: opts.fTol ?? 1e-13,
      step,
      gradient,
      inverseHessian: startingInverseHessian(from, o, Math.min(x.length, Math.max(2000, 20 * s))) ?? undefined,
      stopWhen: stop,
    });
    const known = joined as BfgsResult | null;
    if (known) return { ...known, x: Float64Array.from(known.x), iterations: r.iterations, evaluations: r.evaluations, joined: true };
    if (!r.stopped) maxima.push(r);
    else if (onBoundary(r.x)) slideStops.push({ r, from: searchingFrom });
    return r;
  };
  const restarts = opts.boundaryRestarts ?? true;
  // A search that takes two steps in a row on the boundary is sliding onto it: on real series
  // with long cycles that is a lower maximum where a unit AR root and an MA root near −1
  // cancel, the filter never settles and every step costs several passes (sunspot.month
  // ARMA(2,1) with a mean: 60 of the Hannan–Rissanen search's 67 evaluations were on that
  // slide, and the CSS restart below found the maximum in 5). Every search from a start of our
  // own is stopped there (one given by the caller is not: the hourly update starts from the
  // model in service, which may sit on the boundary by right); the restarts below run as for a
  // search that ended on the boundary, and the best point stopped this way is taken up again
  // from where it stopped only when no other search found a higher one. Over the 96 demand
  // orders and R's 22 dataset fits no maximum changed; nottem (3,0,3)(1,1,1)_12 went from 532
  // to 359 evaluations, LakeHuron ARMA(3,3) from 224 to 190.
  const slide = (): ((u: Float64Array) => boolean) | undefined => {
    if (!restarts || st) return undefined;
    let onEdge = 0;
    return (u) => (onBoundary(u) ? ++onEdge >= 2 : ((onEdge = 0), false));
  };
  // the objective at a given start, so that a start that is already the maximum comes back
  // unchanged (see keptStart below)
  const fAtStart = st && startInRegion ? objective(u0) : Infinity;
  searchingFrom = st ? 'given' : moments ? 'moments' : 'hannan-rissanen';
  let opt = search(u0, slide());
  let startedFrom: ArmaFit['startedFrom'] = st ? 'given' : moments ? 'moments' : 'hannan-rissanen';
  let evaluations = opt.evaluations;
  /**
   * A search from another start (stopped on its slide onto the boundary unless told otherwise),
   * kept when it ends higher than the best so far by more than round-off (1e-9 of −log L / n):
   * on a tie the earlier start stands.
   */
  const tryStart = (from: Float64Array, label: ArmaFit['startedFrom'], stopWhen = slide()): BfgsResult => {
    searchingFrom = label;
    const r = search(from, stopWhen);
    evaluations += r.evaluations;
    if (r.f < opt.f - 1e-9) {
      opt = r;
      startedFrom = label;
    }
    return r;
  };
  let cssTried = false;
  let zeroTried = false;
  let arRootTried = false;
  let maRootTried = false;
  if (!st && (opts.secondStart ?? needsSecondStart(o))) {
    // With AR and MA orders of two or more, roots of the two polynomials can nearly cancel and
    // the likelihood has several maxima; the Hannan–Rissanen start then often lands on a lower
    // one. Next comes the conditional-sum-of-squares estimate, the start R's default "CSS-ML"
    // refines: on the daily-differenced demand series ARMA(2,3) the Hannan–Rissanen, zero and
    // opposed starts all reached a maximum 2.4 below the one it leads to.
    const hrEnd = opt;
    const css = cssStart(centred, { p: o.p, q: o.q, P: o.P, Q: o.Q, period: s || 1 });
    let agree = false;
    if (css) {
      cssTried = true;
      agree = sameMaximum(hrEnd, tryStart(css, 'css'));
    }
    // Two starts built in unrelated ways (a long-AR regression and a conditional least-squares
    // fit) that end at the same maximum mark the one a search from these data reaches; the
    // other two starts are for when they part. On the open demand series (96 orders and
    // differencings, `npm run bench`) and on R's real series with long cycles and near-unit
    // roots (fixtures/r-arima-real.R), no order where the two agreed had a higher maximum from
    // the starts below; each of those costs as much as a search, several times the fit of a
    // seasonal order (its filter never settles there).
    if (!agree) {
      // the all-zero start (the one R's arima begins its conditional sum of squares from)
      zeroTried = true;
      tryStart(new Float64Array(k), 'zero');
      // A start on the other side of the cancellation ridge: a persistent AR part (every
      // unconstrained AR value +0.5, partial autocorrelations 0.46) against an MA part leaning
      // the other way (−0.5). On real series with long cycles (sunspots, LakeHuron ARMA(3,3))
      // the Hannan–Rissanen and zero starts both reached lower maxima that this one avoids.
      tryStart(opposedStart(o, k), 'opposed');
      // A start at an MA unit root: no AR part and θ₁ = 0.99 (a root near B = −1), the rest
      // zero. Where a series is differenced once too often the exact likelihood can rise to a
      // maximum with an MA root on the unit circle (Davis & Dunsmuir 1996) that the starts above,
      // all inside the region, walk away from: on weeks 1–8 of the open demand series
      // differenced by (1 − B²⁴)(1 − B¹⁶⁸), ARMA(3,2) ended 2.9 below R's "ML" (which leaves the
      // MA part unconstrained and reached θ = (1.061, 0.063)); from this start the search
      // reaches it. Without a seasonal block only: with one, the seasonal MA's own unit-root
      // search below covers the over-differenced case, and another search there costs a
      // seasonal fit's worth (ARMA(3,3)×(1,1)_24 on (1−B)(1−B¹⁶⁸): 335 ms became 509 ms).
      if (o.P + o.Q === 0) {
        maRootTried = true;
        tryStart(maUnitRootStart(o, k), 'ma-unit-root');
      }
    } else if (!complete && o.p > 0 && o.P + o.Q === 0) {
      // With missing values both starts come from the same holes handled crudely (the
      // regression and the conditional sum of squares drop what a gap touches), so their
      // agreement says less, and the start near an AR unit root (below) runs too, the one that
      // begins where neither of them looks. On the weekly-differenced demand series with seven
      // hours taken out, ARMA(3,3) from both ended 3.0 below R's maximum (AR roots near the
      // circle, φ = (0.685, 0.990, −0.680)), which this start reaches and the zero, opposed and
      // MA-unit-root starts do not (`npm run bench -- --gaps-only`). Not with a seasonal block:
      // there a search costs 100 times as much, and the seasonal probe below looks elsewhere.
      arRootTried = true;
      tryStart(arUnitRootStart(k), 'ar-unit-root');
    }
  }
  if (!st && restarts && !maRootTried && needsSecondStart(o) && o.P + o.Q === 0 && hasMaRootNearOne(fromUnconstrained(opt.x, o).ma)) {
    // The Hannan–Rissanen and CSS starts agreed on a maximum whose MA part has a real root close
    // to +1, a factor near (1 − B): the mark of a series differenced once too often (Plosser &
    // Schwert 1977), where the exact likelihood's highest value can lie with that root on the
    // unit circle (Davis & Dunsmuir 1996), a maximum a search inside the region need not reach.
    // So the MA-unit-root start runs here as well. Values 4,001–6,000 of treering differenced
    // once, ARMA(2,2): both starts ended at θ = (−0.198, −0.786), a root at 1.009, 5.4 below R's
    // "ML" (a root at 1.000); from this start the search ends 2.6 above it (a fourth round of
    // series the starts were not tuned on). It ran for none of the demand orders of `npm run
    // bench`, complete or with missing hours, nor for their eight-week windows; on the sweeps of
    // fixtures/r-arima-sweep.R and fixtures/r-arima-further.R it ran twice and moved no maximum.
    tryStart(maUnitRootStart(o, k), 'ma-unit-root');
  }
  if (!st && restarts && wantsFreeMaStart(o) && (x.length <= FREE_MA_START_MAX_LENGTH || nearWhiteNoise(x))) {
    // The CSS estimate searched as R's arima searches it (MA part unconstrained, the mean a
    // parameter; css-free-ma.ts): where the CSS surface has several minima the two
    // parametrisations can end in different ones, each leading the exact likelihood to its own
    // maximum. Over 25 of R's datasets (fixtures/r-arima-sweep.R, every ARMA(p, q) with
    // p, q ≤ 3 but (0,0)) 11 of 375 fits ended 0.02–0.75 below R's best without it, 2 with it:
    // beaver2's ARMA(3,1) had ended 0.64 below, Seatbelts' ARMA(1,3) 0.41, WWWusage's ARMA(3,2)
    // 0.24, SMI's log returns' ARMA(1,3) 0.20. With a seasonal block, over every
    // (p,0,q)(P,0,Q)_s with p, q ≤ 2, P, Q ≤ 1 on 14 seasonal series, 4 of 378 ended 0.006–0.18
    // below R's best without it, 1 with it. Which orders: wantsFreeMaStart. Long series that
    // are not close to white noise are left out: there the start costs a CSS search over the
    // whole series (on the demand series 0.6–6.5 ms, and those orders became 1.2–4.4 times
    // slower), while on its 128 fits and 384 eight-week windows (`npm run bench`) it raised one
    // maximum (a window's ARMA(2,2), by 7.4)
    // and lowered none. Close to white noise (the stock-index returns), every ARMA(p, q) with
    // p, q ≥ 1 nearly has a common factor, the likelihood is flat along the ridge where AR and
    // MA roots cancel, and the maxima are many (parameter redundancy; Box & Jenkins 1970).
    const free = freeMaCssStart(x, { p: o.p, q: o.q, P: o.P, Q: o.Q, period: s || 1 }, o.includeMean);
    if (free) tryStart(free, 'css-free-ma');
    // A start near an AR unit root: φ₁ = AR_UNIT_ROOT_START, everything else zero. Where a
    // series still wants one more difference (a seasonally differenced series with a trend left
    // in it, or one whose level wanders), the exact likelihood rises towards a unit AR root and
    // its highest value lies on that edge of the stationary region; R's "ML" search from zero
    // climbs there and the starts above, which all begin well inside, stop at interior maxima
    // below it. ldeaths (1 − B¹²) (1,0,3)(1,0,1)_12 ended 4.0 below R's "ML" (φ₁ = 1.0000) and
    // reaches it from here. Over the three sweeps of fixtures/r-arima-sweep.R (1,256 fits) the
    // fits below R's best went from 2 + 1 + 11 to 1 + 0 + 4, 74 more ended higher than before
    // (by up to 8.5; most were at or above R already), and two ended lower than before but still
    // above R (fdeaths (3,0,2)(1,0,1)_12, 3.3 lower: a stopped slide that had gone on to a higher
    // boundary is no longer taken up, since this search ends above where it stopped). Starts at
    // φ₁ = 0.90, 0.97, 0.98 or 0.99 each left 6 below R, against 5. It shares the free-MA start's
    // gate: on the demand series and its windows nothing changes; on R's datasets no maximum
    // moved and the short ones cost more (log10(lynx) ARMA(3,3) 28 → 73 evaluations, 1.4 → 2.1 ms).
    if (o.p > 0 && !arRootTried) {
      arRootTried = true;
      tryStart(arUnitRootStart(k), 'ar-unit-root');
    }
    // (without a seasonal block from fewer coefficients: NATURAL_MA_START_MIN_COEFFICIENTS_PLAIN)
    const plain = o.P + o.Q === 0;
    if (o.q + o.Q > 0 && k >= (plain ? NATURAL_MA_START_MIN_COEFFICIENTS_PLAIN : NATURAL_MA_START_MIN_COEFFICIENTS) && (opts.naturalMaStart ?? true)) {
      // The exact likelihood searched from zero with the MA coefficients as they are, the AR
      // part through the transform: R's "ML" search. Free to cross the unit circle, the MA part
      // can walk to a maximum on it (an MA root at modulus 1, or an AR and an MA root nearly
      // cancelling there) that a search inside the region, where the transform's tanh flattens
      // towards the edge, does not head for. Its end, with MA roots inside the circle reflected
      // out (the same likelihood), is searched once more in the region. Over the three sweeps of
      // fixtures/r-arima-sweep.R it freed three of the four fits that ended below R's best
      // (presidents (3,0,2)(0,0,1)_4 by 1.84, mdeaths (3,0,3)(1,0,0)_12 by 0.43, ldeaths
      // (3,0,3)(0,0,1)_12 by 0.07) and raised four more already above R (by 0.06–1.75); one
      // ended 3.0 lower but still above R (fdeaths (1,0,3)(1,0,1)_12: a stopped slide no longer
      // taken up). For 9.7 % more evaluations over the sweeps: every fit that gained there has six
      // coefficients or more; a later round of series brought the threshold down to four
      // (NATURAL_MA_START_MIN_COEFFICIENTS, NATURAL_MA_START_MIN_COEFFICIENTS_PLAIN).
      // With NATURAL_MA_START_ITERATIONS iterations it frees the same three fits as with 40 or
      // 80 (which move a few others' maxima either way, all above R), with 10 only two.
      naturalMa = true;
      lastValid = false;
      const nat = minimizeBfgs(objective, new Float64Array(k), { maxIter: plain ? NATURAL_MA_START_ITERATIONS_PLAIN : NATURAL_MA_START_ITERATIONS, gradTol: 1e-7, fTol: opts.fTol ?? 1e-13, step, gradient });
      naturalMa = false;
      lastValid = false;
      evaluations += nat.evaluations;
      const from = Number.isFinite(nat.f) ? intoRegion(nat.x, o) : null;
      if (from) tryStart(from, 'natural-ma');
    }
  }
  if (!st && restarts && !arRootTried && !zeroTried && needsSecondStart(o) && o.P + o.Q === 0 && hasArRootNearCircle(fromUnconstrained(opt.x, o).ar)) {
    // The same for an AR root: where the Hannan–Rissanen and CSS starts agreed (on a series
    // longer than the short-series starts above are for) on a maximum with an AR root within
    // AR_ROOT_NEAR_CIRCLE of the circle, the likelihood there is a ridge (most often that root
    // nearly cancelled by an MA root) along which other maxima lie, and the AR-unit-root start
    // runs as well. On the first 2,000 values of sunspot.month differenced once, ARMA(3,3): both
    // ended with AR and MA roots at −1.002 and −1.004, 1.4 below R's "ML"; from this start the
    // search ends 0.02 above it. It ran for none of the demand orders of `npm run bench`,
    // complete or with missing hours, nor for R's datasets of its second table; for five of the
    // 36 eight-week window fits with p, q ≥ 2 (the weekly-differenced ones, 2.5 % more
    // evaluations), moving no maximum; over the sweeps of fixtures/r-arima-sweep.R and
    // fixtures/r-arima-further.R it moved only that one.
    tryStart(arUnitRootStart(k), 'ar-unit-root');
  }
  const short = x.length <= FREE_MA_START_MAX_LENGTH;
  if (!st && !cssTried && (o.P + o.Q > 0 || short) && restarts) {
    // A search that ends below a point we already know is at a lower local maximum: with a
    // seasonal block the conditional-sum-of-squares estimate costs little beside the fit (one
    // CSS search and one likelihood pass) to look at. On the daily-differenced demand series
    // ARMA(0,3)×(1,1)_24 from Hannan–Rissanen ended 240 below R's maximum, inside the region;
    // the CSS estimate was above that end, and the search from it reaches R's maximum. (Without
    // a seasonal block the CSS search costs more than the fit of a small order on the demand
    // series, 1.4–3.8 times its time, and orders with p, q ≥ 2 search from the CSS estimate
    // anyway; on a short series it is looked at for every order: co2 (1 − B) MA(3) with a mean
    // ended 90 below R's maximum, and 64 below its own MA(2), from a Hannan–Rissanen start that
    // truncates the series' slowly decaying ψ weights; the search from the CSS estimate
    // reaches R's.)
    const css = cssStart(centred, { p: o.p, q: o.q, P: o.P, Q: o.Q, period: s || 1 });
    if (css) {
      cssTried = true;
      const fCss = objective(css);
      evaluations++;
      if (fCss < opt.f) tryStart(css, 'css');
    }
  }
  if (!st && restarts && !zeroTried && k > 0 && short) {
    // On a short series every order is searched from all-zero coefficients as well (R's own
    // start), where that has not been done yet. AirPassengers (1 − B¹²) ARMA(2,3) with a mean
    // ended 1.3 below R's "CSS-ML" although the Hannan–Rissanen and CSS starts agreed, and the
    // zero start reaches it; so does co2 (1 − B¹²)'s (0,0,0)(1,0,1)_12, 6.5 below. Over the three
    // sweeps of fixtures/r-arima-sweep.R and those of fixtures/r-arima-further.R (2,120 fits),
    // with the CSS look above and KNOWN_BASIN_STAY, 29 maxima rose (by up to 90) and one fell by
    // 0.27 (Seatbelts drivers (1 − B)(1 − B¹²) ARMA(1,2), still above R's), for 21 % more
    // evaluations; on R's short datasets of `npm run bench` up to twice as many (log10(lynx)
    // ARMA(3,3) 111 → 212).
    zeroTried = true;
    tryStart(new Float64Array(k), 'zero');
  }
  let probed = false;
  const seasonalProbe = (): void => {
    probed = true;
    // A seasonal MA root at the unit circle, (1 − B^s) in the MA part, is where an over-
    // differenced series has its highest likelihood (the exact likelihood of an MA part piles up
    // at a unit root; Davis & Dunsmuir 1996), and a search from the other starts can stop at an
    // interior maximum below it: on eight-week windows of the open demand series differenced by
    // (1 − B²⁴)(1 − B¹⁶⁸), ARMA(0,0)×(1,1)_24 ended 8.6 and 10.3 below R's "ML" (SMA −0.77
    // against R's −0.99998), and daily-differenced ARMA(0,2)×(1,1)_24 128 below R's "CSS-ML"
    // (SMA +0.91 against R's −0.98). So every fit with a seasonal MA part searches once more
    // from its own estimate with the seasonal MA put at −0.99, and the higher maximum is kept
    // (`npm run bench` shows what it costs).
    const from = opt.x;
    const probe = Float64Array.from(from);
    const first = o.p + o.q + o.P;
    for (let i = first; i < k; i++) probe[i] = i === first ? Math.atanh(0.99) : 0;
    // A probe that walks back to within 0.2 (in every unconstrained value) of the estimate it
    // started from has fallen into that estimate's basin and is stopped there: it would only
    // climb to the same maximum (on the doubly differenced demand series that was most of
    // the probe's cost).
    const sliding = slide();
    const back = (u: Float64Array): boolean => {
      for (let i = 0; i < k; i++) if (Math.abs(u[i] - from[i]) >= 0.2) return false;
      return true;
    };
    tryStart(probe, 'seasonal-unit-root', (u) => (sliding?.(u) ?? false) || back(u));
  };
  if (!st && restarts && o.Q > 0 && !onBoundary(opt.x)) seasonalProbe();
  if (!st && restarts && !zeroTried && o.q >= 2 && nearUnitCircle(opt.x, o.p, o.q)) {
    // An MA part of order two or more with a root close to the unit circle (a partial
    // autocorrelation beyond ±0.95) is where the exact likelihood has several maxima close
    // together (Davis & Dunsmuir 1996): on weeks 5–12 of the open demand series differenced by
    // (1 − B²⁴), MA(2) from Hannan–Rissanen stopped at θ = (1.389, 0.954), 24.9 below the
    // maximum R's arima reaches, θ = (1.619, 0.868); the search from all-zero coefficients (R's
    // own start) reaches it. So such an estimate is searched again from zero.
    tryStart(new Float64Array(k), 'zero');
  }
  if (restarts && onBoundary(opt.x)) {
    // The search ended where a partial autocorrelation is ±1 to three digits: a unit AR root
    // (often cancelled by an MA root near −1) or an MA root on the unit circle. On real series
    // with long cycles that is commonly a saddle or a lower maximum the search slid onto, so
    // search again from the conditional-sum-of-squares estimate and from zero (those not tried yet),
    // and keep the highest likelihood (a true boundary maximum is kept when nothing beats it).
    const starts: Array<[Float64Array | null, ArmaFit['startedFrom']]> = cssTried ? [] : [[cssStart(centred, { p: o.p, q: o.q, P: o.P, Q: o.Q, period: s || 1 }), 'css']];
    if (st || !(opts.secondStart ?? needsSecondStart(o))) starts.push([new Float64Array(k), 'zero']);
    for (const [from, label] of starts) {
      // a restart that already left the boundary for a higher maximum inside the region is the
      // answer this rule looks for; the zero start is for when it did not (on sunspot.month
      // ARMA(2,1) the CSS restart reaches R's maximum in 5 evaluations, the zero one in 33 more)
      if (!from || !onBoundary(opt.x)) continue;
      tryStart(from, label);
    }
    // A restart that left the boundary has an interior estimate, which the seasonal probe
    // above (it starts from one) has not seen: on the daily-differenced demand series with seven hours
    // taken out, ARMA(0,2)×(1,1)_24's first search slid onto the boundary, the zero restart
    // ended at SMA +0.94, 191 below R's maximum at SMA −0.97, which the probe from there reaches.
    if (!probed && !st && o.Q > 0 && !onBoundary(opt.x)) seasonalProbe();
  }
  const best = !st && restarts && short && o.q > 0 ? fromUnconstrained(opt.x, o) : null;
  if (best && hasMaRootNearCircle(best.ma, o.P + o.Q > 0 ? MA_ROOT_NEAR_CIRCLE_SEASONAL : MA_ROOT_NEAR_CIRCLE)) {
    // A short series whose best maximum so far has an MA root within MA_ROOT_NEAR_CIRCLE of the
    // unit circle: the likelihood of an MA part piles up on the circle (Davis & Dunsmuir 1996),
    // where a series differenced once too often, or seasonally differenced with a fixed seasonal
    // pattern, has a zero in its spectrum, and there it has several maxima, one or more along
    // each stretch of the circle; a search from inside the region reaches the one its start
    // leads to. So the search runs again from MA roots just inside the circle at four points
    // around it (maCircleStart: a root near +1, pairs at a sixth and a third of a cycle, a root
    // near −1; an MA(1) the two real ones), no AR part, the seasonal part the best maximum's, and
    // the highest end is kept. (With the seasonal part at zero instead, one fewer is freed:
    // UKDriverDeaths' logs differenced once, (3,0,2)(1,0,1)_12, 1.6 below R, whose maximum has
    // SAR 0.997 and SMA −0.89; and one fit ended 2.2 lower than before.) In the fifth
    // round of hold-outs (fixtures/r-arima-packages.R) four fits ended below R's best, each at a
    // maximum with an MA root on or within 0.01 of the circle; this start frees three of them
    // (log(gas) (1 − B)(1 − B¹²) ARMA(3,3), 1.94 below R's "ML" before, now 1.48 above it from the
    // pair at a third of a cycle), and over the sweeps and the four rounds before six more
    // (austres MA(2), mdeaths (1 − B¹²) ARMA(2,3), ldeaths (1 − B) (3,0,2)(0,0,1)_12, nottem
    // (1 − B¹²) (3,0,2)(1,0,0)_12, UKDriverDeaths (1 − B¹²) (3,0,3)(0,0,1)_12 and its logs
    // differenced once, (3,0,2)(1,0,1)_12), lowering none, for about a third more
    // evaluations there. Long series are left out (the demand series: a search there costs a
    // fit). With a seasonal part the gate is wider, MA_ROOT_NEAR_CIRCLE_SEASONAL: over the sweeps
    // and the five rounds (4,824 fits) that frees woolyrnq (3,0,3)(1,0,1)_4 (0.85 below R's best
    // before, now at it) and takes 20 more seasonal fits higher, by up to 1.5 (each at or above
    // R's best already), lowering none, for 3–8 % more evaluations on the seasonal sweeps;
    // gates of 1.10, 1.15 and 1.25 raised 10, 17 and 28 fits for 1.5, 2.2 and 3.4 % more
    // evaluations over all the sweeps (1.18: 2.6 %). The same gate without a seasonal part would
    // run for R's long-cycle levels (lynx, LakeHuron, Nile, sunspot.year), doubling their fits;
    // R's seasonal datasets of `npm run bench` do not reach it.
    for (const angle of MA_CIRCLE_ANGLES) {
      const from = maCircleStart(o, angle, best);
      if (from) tryStart(from, 'ma-circle');
    }
  }
  // Searches each stopped slide again, in order of the point it stopped at, but one whose stop
  // lies in the box of a point in takenUp (the same slide), keeping the highest end.
  const takeUpSlides = (takenUp: Float64Array[]): void => {
    for (const other of [...slideStops].sort((a, b) => a.r.f - b.r.f)) {
      if (takenUp.some((x) => withinBox(other.r.x, x, basinRadius))) continue;
      takenUp.push(other.r.x);
      searchingFrom = other.from;
      const more = search(other.r.x);
      evaluations += more.evaluations;
      if (more.f < opt.f - 1e-9) {
        opt = more;
        startedFrom = other.from;
      }
    }
  };
  if (opt.stopped) {
    // nothing found above the slide: the boundary it was sliding onto may be the maximum after
    // all (an over-differenced series' MA root at −1), so the stopped search goes on from there
    const first = opt;
    const on = search(opt.x);
    evaluations += on.evaluations;
    if (on.f <= opt.f) opt = on;
    // and so does every other slide stopped elsewhere (one whose stop lies in the box of one
    // taken up already is the same slide): where every start slid, the highest stop need not
    // lead to the highest boundary. On the first 2,000 values of treering differenced once,
    // ARMA(2,2) and ARMA(3,2) each ended on the slide of the Hannan–Rissanen start, 2.9 and 7.3
    // below R's "ML" (an MA root at +1, θ = (−1.85, 0.85): the series differenced once too
    // often), while the slide of the zero start, stopped lower, goes on to 6.4 above R's and to
    // R's; so did ldeaths (1 − B) (2,0,2)(0,0,1)_12's AR-unit-root slide, 1.1 below before. On
    // the demand orders of `npm run bench` no maximum moved and the seasonal fits of
    // (1−B)(1−B¹⁶⁸) cost up to a quarter more evaluations; on R's short seasonal series up to
    // 40 % more.
    takeUpSlides([first.x]);
  } else if (restarts && !st && needsSecondStart(o) && o.P + o.Q === 0 && slideStops.length > 0) {
    // Another start found a higher point than where the slide was stopped, but the slide had
    // not ended: with AR and MA orders of two or more, where the likelihood has several maxima,
    // it can climb on to a maximum above every other start's. On sunspot.month ARMA(3,3) with a
    // mean it went from 71.9 below the best start's maximum to 70.9 above it (R 4.2.2
    // stats::arima gives −13206.42 at those coefficients, 75 above its own fit), on weeks 3–10
    // of the weekly-differenced demand series ARMA(3,3) to R's "CSS-ML" maximum, 2.7 above the
    // other starts'. With one order below two the slide is the unit-AR-root / MA-root-at-−1
    // cancellation that stopping it is for (sunspot.month ARMA(2,1): taken up again it ended
    // 215 below the maximum), so it is not; nor with a seasonal block, where on the demand
    // series six such slides cost 53–188 evaluations each and all ended 190 or more below.
    // Every slide apart from the others is taken up, not only the highest stop: on beaver1's
    // temperatures differenced once, ARMA(2,2) ended 0.05 below R's "CSS-ML" (an AR pair at
    // modulus 0.9996 nearly cancelled by an MA pair), where the CSS start's slide, stopped lower
    // than the opposed start's, goes on to 0.02 above it. Over the sweeps of
    // fixtures/r-arima-sweep.R and fixtures/r-arima-further.R (3,180 fits) two more rose (the
    // FTSE's log returns' ARMA(2,2) by 0.55, beaver1's ARMA(3,3) by 0.36), none fell, for 0.5–2 %
    // more evaluations; the demand orders of `npm run bench`, complete and with missing hours,
    // did not change, its eight-week windows' ARMA(p ≥ 2, q ≥ 2) took 6 % more evaluations.
    takeUpSlides([]);
  }
  // A given start the search could not improve on by more than round-off (1e-10 of −log L / n)
  // is returned exactly as given, not through the transform's round trip: re-estimating a model
  // on the data it was fitted to then reproduces it to the last bit, so the hourly update can
  // tell "nothing changed" by equality, while any changed reading still moves σ² and the forecast.
  const keptStart = st !== undefined && Number.isFinite(fAtStart) && !(opt.f < fAtStart - 1e-10);
  const nat = keptStart ? startNat : fromUnconstrained(opt.x, o);
  const ss = stateSpaceOf(nat, s);
  // the GLS mean at the estimate (a pass of its own only when there is a mean)
  const mean = o.includeMean ? kalmanFilter(x, ss, { profileMean: true, tol }).mean : 0;
  const residuals = new Float64Array(x.length);
  const predictions = new Float64Array(x.length);
  const final = kalmanFilter(x, ss, { mean, tol, residuals, predictions, keepState: true });
  const loglik = concentratedLogLik(final);
  const n = final.nUsed;
  const sigma2 = final.ssq / n;
  const kk = nCoef + 1;
  const aic = -2 * loglik + 2 * kk;
  const aicc = n - kk - 1 > 0 ? aic + (2 * kk * (kk + 1)) / (n - kk - 1) : Infinity;
  const bic = -2 * loglik + kk * Math.log(n);

  const names: string[] = [];
  const values: number[] = [];
  nat.ar.forEach((v, i) => (names.push(`ar${i + 1}`), values.push(v)));
  nat.ma.forEach((v, i) => (names.push(`ma${i + 1}`), values.push(v)));
  nat.sar.forEach((v, i) => (names.push(`sar${i + 1}`), values.push(v)));
  nat.sma.forEach((v, i) => (names.push(`sma${i + 1}`), values.push(v)));
  if (o.includeMean) {
    names.push('intercept');
    values.push(mean);
  }
  let se = values.map(() => NaN);
  if (opts.computeSe ?? true) {
    const sdx = Math.sqrt(varianceFinite(x)) || 1;
    se = hessianStandardErrors(x, o, values, tol, sdx);
  }
  const coefficients = names.map((name, i) => ({ name, value: values[i], se: se[i] }));
  const aEnd = final.aPred as Float64Array;
  const PEnd = final.PPred as Float64Array;
  const fit: ArmaFit = {
    spec: o,
    coefficients,
    ar: nat.ar,
    ma: nat.ma,
    sar: nat.sar,
    sma: nat.sma,
    mean,
    sigma2,
    loglik,
    aic,
    aicc,
    bic,
    nUsed: n,
    residuals,
    predictions,
    converged: opt.converged,
    iterations: opt.iterations,
    evaluations,
    startedFrom,
    fitMs: 0,
    forecast: (h: number) => forecastState(ss, aEnd, PEnd, sigma2, mean, h),
  };
  fit.fitMs = performance.now() - t0;
  return fit;
}

/** The start near an AR unit root: φ₁ = AR_UNIT_ROOT_START, everything else zero. */
function arUnitRootStart(k: number): Float64Array {
  const u = new Float64Array(k);
  u[0] = Math.atanh(AR_UNIT_ROOT_START);
  return u;
}

/** The start across the cancellation ridge: every unconstrained AR value +0.5, every MA value −0.5. */
function opposedStart(o: Required<ArmaSpec>, k: number): Float64Array {
  const u = new Float64Array(k);
  for (let i = 0; i < o.p; i++) u[i] = 0.5;
  for (let i = o.p; i < o.p + o.q; i++) u[i] = -0.5;
  return u;
}

/**
 * The MA-unit-root start: no AR part and θ₁ = 0.99 (a root near B = −1), the rest zero, in the
 * transform's values (see fitArma).
 */
function maUnitRootStart(o: Required<ArmaSpec>, k: number): Float64Array {
  const u = new Float64Array(k);
  u[o.p] = Math.atanh(-0.99);
  return u;
}

/** A real MA root in (0, MA_ROOT_NEAR_ONE]: a factor close to (1 − B) (see fitArma). */
export const MA_ROOT_NEAR_ONE = 1.02;
/** An AR root of modulus up to this: on the ridge by the unit circle (see fitArma). */
export const AR_ROOT_NEAR_CIRCLE = 1.01;

/** Whether 1 + θ₁B + … + θ_qB^q has a real root in (0, MA_ROOT_NEAR_ONE]. */
export function hasMaRootNearOne(theta: ArrayLike<number>): boolean {
  const { re, im } = reciprocalRoots(theta);
  return re.some((r, i) => im[i] === 0 && r >= 1 / MA_ROOT_NEAR_ONE);
}

/** Whether 1 − φ₁B − … − φ_pB^p has a root of modulus up to AR_ROOT_NEAR_CIRCLE. */
export function hasArRootNearCircle(phi: ArrayLike<number>): boolean {
  const { re, im } = reciprocalRoots(Array.from(phi, (v) => -v));
  return re.some((r, i) => Math.hypot(r, im[i]) >= 1 / AR_ROOT_NEAR_CIRCLE);
}

/** An MA root of modulus up to this: near the unit circle, where the MA-circle starts run (see fitArma). */
export const MA_ROOT_NEAR_CIRCLE = 1.05;

/** The same gate for a fit with a seasonal part (see fitArma). */
export const MA_ROOT_NEAR_CIRCLE_SEASONAL = 1.18;

/** Whether 1 + θ₁B + … + θ_qB^q has a root of modulus up to `gate` (MA_ROOT_NEAR_CIRCLE unless given). */
export function hasMaRootNearCircle(theta: ArrayLike<number>, gate = MA_ROOT_NEAR_CIRCLE): boolean {
  if (theta.length === 0) return false;
  const { re, im } = reciprocalRoots(theta);
  return re.some((r, i) => Math.hypot(r, im[i]) >= 1 / gate);
}

/** Where on the unit circle the MA-circle starts put their roots: frequencies 0, 1/6, 1/3 and 1/2 cycle per step. */
export const MA_CIRCLE_ANGLES = [0, Math.PI / 3, (2 * Math.PI) / 3, Math.PI];

/**
 * The MA-circle start at an angle ω of MA_CIRCLE_ANGLES, in the transform's values: no AR part,
 * the MA part (1 − 0.99 e^{iω} B)(1 − 0.99 e^{−iω} B) = 1 − 1.98 cos ω B + 0.9801 B² (roots at
 * modulus 1/0.99, angle ±ω), or 1 ∓ 0.99 B at ω = 0 and π, its other coefficients zero, the
 * seasonal part that of `seasonal` (the best maximum so far); null for a pair an MA(1) cannot
 * hold.
 */
export function maCircleStart(o: Required<ArmaSpec>, angle: number, seasonal: { sar: ArrayLike<number>; sma: ArrayLike<number> }): Float64Array | null {
  const rho = 0.99;
  const ma = new Float64Array(o.q);
  if (angle === 0 || angle === Math.PI) ma[0] = angle === 0 ? -rho : rho;
  else if (o.q >= 2) {
    ma[0] = -2 * rho * Math.cos(angle);
    ma[1] = rho * rho;
  } else return null;
  return toUnconstrained({ ar: new Float64Array(o.p), ma, sar: Float64Array.from(seasonal.sar), sma: Float64Array.from(seasonal.sma) });
}

/** Whether a partial autocorrelation of the unconstrained values u[from, from + m) lies beyond ±0.95. */
function nearUnitCircle(u: ArrayLike<number>, from: number, m: number): boolean {
  for (let i = from; i < from + m; i++) if (Math.abs(Math.tanh(u[i])) > 0.95) return true;
  return false;
}

/**
 * The objective's state space without a seasonal block, written into one object reused for
 * every evaluation (the filter copies what it keeps): φ, and R = (1, θ).
 */
function nonSeasonalModel(p: number, q: number): (u: Float64Array) => ArmaStateSpace {
  const r = Math.max(p, q + 1, 1);
  const ss: ArmaStateSpace = { r, phi: new Float64Array(r), R: new Float64Array(r) };
  const theta = new Float64Array(q);
  const work = new Float64Array(Math.max(p, q));
  ss.R[0] = 1;
  return (u) => {
    toStationaryInto(u, 0, p, ss.phi, work, 1);
    toStationaryInto(u, p, q, theta, work, -1);
    for (let i = 0; i < q; i++) ss.R[i + 1] = theta[i];
    return ss;
  };
}

/**
 * Whether two searches ended at the same maximum: objectives (−log L / n) within 1e-9, about
 * 0.002 of a log-likelihood on 2,000 hours, and every unconstrained value within 1e-3.
 */
function sameMaximum(a: { f: number; x: Float64Array }, b: { f: number; x: Float64Array }): boolean {
  if (!(Math.abs(a.f - b.f) <= 1e-9)) return false;
  for (let i = 0; i < a.x.length; i++) if (!(Math.abs(a.x[i] - b.x[i]) < 1e-3)) return false;
  return true;
}

/** tr[t] −= m·ones[t] for t ≥ from, in a function of its own (see subtractInto). */
function removeMultiple(tr: Float64Array, ones: Float64Array, m: number, from: number): void {
  for (let t = from; t < tr.length; t++) tr[t] -= m * ones[t];
}

/** out = x − m, in a function of its own (inside the fit's closure the loop ran several times slower). */
function subtractInto(x: Float64Array, m: number, out: Float64Array): void {
  for (let t = 0; t < x.length; t++) out[t] = x[t] - m;
}

function sameValues(a: Float64Array, b: Float64Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/**
 * The same model (coefficients, mean, σ²) run over another series — typically the history
 * extended by new hours — without re-estimating: only the Kalman filter runs, so residuals,
 * predictions and the forecast state follow the new data. Used for the hourly forecast update
 * with fixed coefficients and inside backtests.
 */
export function applyArma(fit: ArmaFit, series: ArrayLike<number>, tol = 1e-10): ArmaFit {
  const x = toSeries(series);
  const ss = stateSpaceOf({ ar: fit.ar, ma: fit.ma, sar: fit.sar, sma: fit.sma }, fit.spec.period);
  const residuals = new Float64Array(x.length);
  const predictions = new Float64Array(x.length);
  const f = kalmanFilter(x, ss, { mean: fit.mean, tol, residuals, predictions, keepState: true });
  const aEnd = f.aPred as Float64Array;
  const PEnd = f.PPred as Float64Array;
  const sigma2 = fit.sigma2;
  return { ...fit, residuals, predictions, forecast: (h: number) => forecastState(ss, aEnd, PEnd, sigma2, fit.mean, h) };
}

/**
 * The inverse of the information matrix carried to the unconstrained values, H_u = J' I J with
 * J = ∂(natural)/∂(unconstrained) by central differences of the transform (no filtering
 * involved), as the quasi-Newton search's starting inverse Hessian. Null when it is not usable.
 */
function startingInverseHessian(u: Float64Array, o: Required<ArmaSpec>, length: number): Float64Array | null {
  const k = u.length;
  if (k === 0) return null;
  const flat = (nat: Natural): Float64Array => {
    const out = new Float64Array(k);
    out.set(nat.ar, 0);
    out.set(nat.ma, o.p);
    out.set(nat.sar, o.p + o.q);
    out.set(nat.sma, o.p + o.q + o.P);
    return out;
  };
  const info = armaInformation(fromUnconstrained(u, o), o, length);
  const J = new Float64Array(k * k);
  const h = 1e-6;
  const probe = Float64Array.from(u);
  for (let j = 0; j < k; j++) {
    probe[j] = u[j] + h;
    const up = flat(fromUnconstrained(probe, o));
    probe[j] = u[j] - h;
    const down = flat(fromUnconstrained(probe, o));
    probe[j] = u[j];
    for (let i = 0; i < k; i++) J[i * k + j] = (up[i] - down[i]) / (2 * h);
  }
  const Hu = new Float64Array(k * k);
  for (let a = 0; a < k; a++) {
    for (let b = a; b < k; b++) {
      let v = 0;
      for (let i = 0; i < k; i++) {
        const Jia = J[i * k + a];
        if (Jia === 0) continue;
        for (let j = 0; j < k; j++) v += Jia * info[i * k + j] * J[j * k + b];
      }
      Hu[a * k + b] = v;
      Hu[b * k + a] = v;
    }
  }
  const inv = inverseSpd(Hu, k, 1e-6);
  return inv && inv.every(Number.isFinite) ? inv : null;
}

/** −log L in the natural parameters (mean explicit), for the Hessian. */
function negLogLik(x: Float64Array, o: Required<ArmaSpec>, v: ArrayLike<number>, tol: number, complete: boolean): number {
  const nat = splitNatural(v, o);
  const mean = o.includeMean ? v[v.length - 1] : 0;
  let ss: ArmaStateSpace;
  try {
    ss = stateSpaceOf(nat, o.period);
    const f: FilterResult = kalmanFilter(x, ss, { mean, tol, complete });
    const ll = concentratedLogLik(f);
    return Number.isFinite(ll) ? -ll : NaN;
  } catch {
    return NaN;
  }
}

function hessianStandardErrors(x: Float64Array, o: Required<ArmaSpec>, values: number[], tol: number, sdx: number): number[] {
  const m = values.length;
  if (m === 0) return [];
  // Forward differences: H_ij ≈ [f(v + h_i e_i + h_j e_j) − f(v + h_i e_i) − f(v + h_j e_j) + f(v)] / (h_i h_j),
  // 1 + m + m(m+1)/2 likelihood passes instead of the 1 + 2m² of central differences. The error
  // is O(h) instead of O(h²); with h = 1e-5 that is far below the 2 % the standard errors are
  // checked to, and round-off (about 1e-12 of a log-likelihood in the thousands, over h²) stays
  // negligible beside curvatures of the order of n.
  const hs = values.map((v, i) => (o.includeMean && i === m - 1 ? 1e-4 * sdx : 1e-5));
  const complete = countFinite(x) === x.length;
  const f = (vv: number[]): number => negLogLik(x, o, vv, tol, complete);
  const f0 = f(values);
  const at = (i: number, j: number): number => {
    const vv = values.slice();
    vv[i] += hs[i];
    if (j >= 0) vv[j] += hs[j];
    return f(vv);
  };
  const fi = values.map((_, i) => at(i, -1));
  const H = new Matrix(m, m);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j <= i; j++) {
      const v = (at(i, j) - fi[i] - fi[j] + f0) / (hs[i] * hs[j]);
      H.set(i, j, v);
      H.set(j, i, v);
    }
  }
  try {
    const V = inverse(H);
    return values.map((_, i) => {
      const d = V.get(i, i);
      return d > 0 && Number.isFinite(d) ? Math.sqrt(d) : NaN;
    });
  } catch {
    return values.map(() => NaN);
  }
}

/**
 * h-step forecasts from the final predicted state, and the joint covariance of their errors:
 * Cov(e_{n+i}, e_{n+j}) = σ² Z T^{j−i} P_{n+i|n} Z' for j ≥ i (Harvey 1989, §3.5).
 */
export function forecastState(ss: ArmaStateSpace, aEnd: Float64Array, PEnd: Float64Array, sigma2: number, mean: number, h: number): ArmaForecast {
  const { r, phi, R } = ss;
  const out = new Float64Array(h);
  const cov = new Float64Array(h * h);
  let a = Float64Array.from(aEnd);
  let P = Float64Array.from(PEnd);
  const an = new Float64Array(r);
  const Pn = new Float64Array(r * r);
  const u = new Float64Array(r);
  const un = new Float64Array(r);
  for (let i = 0; i < h; i++) {
    out[i] = a[0] + mean;
    for (let k = 0; k < r; k++) u[k] = P[k * r];
    for (let j = i; j < h; j++) {
      const c = u[0] * sigma2;
      cov[i * h + j] = c;
      cov[j * h + i] = c;
      const u0 = u[0];
      for (let k = 0; k < r - 1; k++) un[k] = phi[k] * u0 + u[k + 1];
      un[r - 1] = phi[r - 1] * u0;
      u.set(un);
    }
    // a = T a, P = T P T' + R R'
    const a0 = a[0];
    for (let k = 0; k < r - 1; k++) an[k] = phi[k] * a0 + a[k + 1];
    an[r - 1] = phi[r - 1] * a0;
    const p00 = P[0];
    for (let k = 0; k < r; k++) {
      for (let l = 0; l < r; l++) {
        let s = phi[k] * phi[l] * p00 + R[k] * R[l];
        if (l + 1 < r) s += phi[k] * P[l + 1];
        if (k + 1 < r) s += phi[l] * P[(k + 1) * r];
        if (k + 1 < r && l + 1 < r) s += P[(k + 1) * r + l + 1];
        Pn[k * r + l] = s;
      }
    }
    a = Float64Array.from(an);
    P = Float64Array.from(Pn);
  }
  return { mean: out, cov };
}

/** For the regression with ARMA errors (../regression), which searches the same ARMA parameters. */
export { fromUnconstrained, toUnconstrained, splitNatural, stateSpaceOf, type Natural };
