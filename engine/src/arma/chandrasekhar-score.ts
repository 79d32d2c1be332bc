/**
 * The exact gradient of the fit's objective, ½ log(S/n) + ½ Σ log F_t / n with S = Σ v_t²/F_t
 * (complete series, known mean), where the filter settles late or never: a seasonal MA part
 * near the unit circle keeps the Riccati recursion moving over the whole series, so the
 * steady-state score (steady-score.ts) has no steady stretch to work on and the search fell back
 * to differencing the likelihood, k + 1 passes per gradient.
 *
 * The likelihood pass runs the Chandrasekhar recursions (Morf, Sidhu & Kailath 1974; kalman.ts's
 * quickStartUp): with p the first row of P, w and the scalar m carrying the rank-one change of P,
 *   F = p_0, v = y_t − a_0,
 *   a_i ← φ_i y_t + a_{i+1} + p_{i+1} v/F,  w_i ← w_{i+1} − p_{i+1} w_0/F,
 *   p_i ← p_i + m w_0 w_i,  m ← m − (m w_0)² / p_0 (the new p_0),
 * from a = 0, p = the first row of the stationary covariance, w_i = φ_i p_0 + p_{i+1},
 * m = −1/p_0. This runs them once more storing a, w, p, m and 1/F for every hour, then
 * backwards (reverse-mode differentiation, Griewank & Walther 2008, ch. 3) for the derivatives
 * with respect to φ and to the starting row p; the row's derivatives along each coefficient
 * (first-row-tangents.ts for a large state, state-space.ts otherwise) and φ's (state-space-tangents.ts) join them by
 * the chain rule. Three to four passes' work whatever the number of coefficients (measured).
 */
import { firstRowTangents } from './first-row-tangents';
import { ArmaStateSpace, stationaryCovarianceTangents } from './state-space';
import { StateSpaceTangents } from './state-space-tangents';
import { scratch, scratchAtLeast } from './scratch';

export function chandrasekharScore(x: Float64Array, model: StateSpaceTangents, k: number): Float64Array | null {
  const { ss, dPhi, dR } = model;
  const { r, phi } = ss;
  const n = x.length;
  if (n === 0) return null;
  const { row, dRow } = firstRowWithTangents(ss, dPhi, dR, k);
  if (!(row[0] > 0)) return null;
  const adj = r <= 4 ? smallAdjoint(x, phi, row, r) : generalAdjoint(x, phi, row, r);
  return adj ? gradientAlong(adj, dPhi, dRow, r, k) : null;
}

/**
 * The first row of the stationary covariance and its derivatives along the k directions: through
 * the autocovariances for a large state (first-row-tangents.ts), Gardner's system otherwise.
 */
export function firstRowWithTangents(ss: ArmaStateSpace, dPhi: Float64Array, dR: Float64Array, k: number): { row: Float64Array; dRow: Float64Array } {
  return (ss.r > 12 ? firstRowTangents(ss.r, ss.phi, ss.R, dPhi, dR, k) : null) ?? stationaryCovarianceTangents(ss, dPhi, dR, k);
}

/** The gradient in the k directions from the adjoints of φ and of the starting row (chain rule); null where not finite. */
export function gradientAlong(adj: Adjoint, dPhi: Float64Array, dRow: Float64Array, r: number, k: number): Float64Array | null {
  const { phib, rowb } = adj;
  const grad = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    const o = j * r;
    let g = 0;
    for (let i = 0; i < r; i++) g += phib[i] * dPhi[o + i] + rowb[i] * dRow[o + i];
    grad[j] = g;
  }
  return grad.every(Number.isFinite) ? grad : null;
}

/** The adjoints of the objective with respect to φ and to the starting row p, r states. */
export interface Adjoint {
  phib: Float64Array;
  rowb: Float64Array;
}

/**
 * The forward pass storing the state of every hour, then the backward one, for any number of
 * states. Every element of the stored arrays is written before it is read, so they are not
 * cleared between calls (not clearing them made the slow demand fits of `npm run bench` 4–17 %
 * faster, before smallAdjoint took the small states).
 */
export function generalAdjoint(x: Float64Array, phi: Float64Array, row: Float64Array, r: number, seed?: AdjointSeed): Adjoint | null {
  const n = seed ? seed.hours : x.length;
  const s = r + 1;
  // a, w, p before each hour t at offset t·s (element r the zero padding), then m and 1/F: the
  // recursion writes each hour's state straight after the previous one, nothing is copied
  const A = scratchAtLeast('chs.a', (n + 1) * s);
  const W = scratchAtLeast('chs.w', (n + 1) * s);
  const Pr = scratchAtLeast('chs.p', (n + 1) * s);
  const M = scratchAtLeast('chs.m', n);
  const G = scratchAtLeast('chs.g', n);
  for (let i = 0; i < s; i++) {
    A[i] = 0;
    Pr[i] = i < r ? row[i] : 0;
  }
  for (let i = 0; i < r; i++) W[i] = phi[i] * Pr[0] + Pr[i + 1];
  W[r] = 0;
  let m = -1 / Pr[0];
  let ginv = 1 / Pr[0];
  let ssq = 0;
  // every F positive and finite, as in smallAdjoint
  let positive = true;
  for (let t = 0; t < n; t++) {
    const o = t * s;
    const on = o + s;
    M[t] = m;
    G[t] = ginv;
    const y = x[t];
    const v = y - A[o];
    const vf = v * ginv;
    ssq += v * vf;
    if (!(Pr[o] > 0 && Pr[o] < Infinity)) positive = false;
    const zw = W[o];
    const coef = zw * ginv;
    const mz = m * zw;
    for (let i = 0; i < r; i++) {
      const p1 = Pr[o + i + 1];
      A[on + i] = phi[i] * y + A[o + i + 1] + p1 * vf;
      W[on + i] = W[o + i + 1] - p1 * coef;
      Pr[on + i] = Pr[o + i] + mz * W[o + i];
    }
    A[on + r] = 0;
    W[on + r] = 0;
    Pr[on + r] = 0;
    ginv = 1 / Pr[on];
    m -= mz * mz * ginv;
  }
  if (!positive || !Number.isFinite(ssq) || !(seed ? seed.ssqBar > 0 : ssq > 0)) return null;
  // adjoints of the state after hour t (entering hour t + 1): ā, w̄, p̄, m̄, ḡ (of 1/F); each
  // hour writes those of the state before it into the other buffers (element r stays zero)
  let ab = scratch('chs.ab', s);
  let wb = scratch('chs.wb', s);
  let pb = scratch('chs.pb', s);
  let abn = scratch('chs.abn', s);
  let wbn = scratch('chs.wbn', s);
  let pbn = scratch('chs.pbn', s);
  ab.fill(0);
  wb.fill(0);
  pb.fill(0);
  abn.fill(0);
  wbn.fill(0);
  pbn.fill(0);
  let mb = 0;
  let gb = 0;
  const phib = new Float64Array(r);
  if (seed) {
    for (let i = 0; i < r; i++) {
      ab[i] = seed.a[i];
      pb[i] = seed.p[i];
      phib[i] = seed.phi[i];
    }
  }
  const ssqBar = seed ? seed.ssqBar : 0.5 / ssq;
  const logBar = seed ? seed.logBar : 0.5 / n;
  for (let t = n - 1; t >= 0; t--) {
    const o = t * s;
    const y = x[t];
    const g0 = G[t];
    const m0 = M[t];
    const zw = W[o];
    const v = y - A[o];
    const vf = v * g0;
    const coef = zw * g0;
    const mz = m0 * zw;
    // 1/F of the next hour, as the forward step made it: m ← m − mz² gn, gn = 1/p'_0
    const gn = 1 / Pr[o + s];
    let mzb = -2 * mz * gn * mb;
    const gnb = gb - mz * mz * mb;
    let m0b = mb;
    const pn0b = -gn * gn * gnb;
    let vfb = 0;
    let coefb = 0;
    // p'_i = p_i + mz w_i; w'_i = w_{i+1} − p_{i+1} coef; a'_i = φ_i y + a_{i+1} + p_{i+1} vf
    for (let i = 0; i < r; i++) {
      const pbi = pb[i] + (i === 0 ? pn0b : 0);
      mzb += pbi * W[o + i];
      const p1 = Pr[o + i + 1];
      coefb -= wb[i] * p1;
      const abi = ab[i];
      phib[i] += abi * y;
      vfb += abi * p1;
    }
    // mz = m zw, coef = zw g; ssq += v vf, vf = v g
    m0b += mzb * zw;
    const zwb = mzb * m0 + coefb * g0;
    let g0b = coefb * zw;
    let vb = ssqBar * vf;
    vfb += ssqBar * v;
    vb += vfb * g0;
    g0b += vfb * v;
    // the state before the hour: each element's adjoint from the three updates above
    for (let j = 0; j < r; j++) {
      const pbj = pb[j] + (j === 0 ? pn0b : 0);
      let pv = pbj;
      let wv = pbj * mz;
      let av = 0;
      if (j > 0) {
        pv += ab[j - 1] * vf - wb[j - 1] * coef;
        wv += wb[j - 1];
        av = ab[j - 1];
      }
      pbn[j] = pv;
      wbn[j] = wv;
      abn[j] = av;
    }
    // a_0 in v, w_0 in zw, p_0 in log F
    abn[0] -= vb;
    wbn[0] += zwb;
    pbn[0] += logBar / Pr[o];
    let tmp = ab;
    ab = abn;
    abn = tmp;
    tmp = wb;
    wb = wbn;
    wbn = tmp;
    tmp = pb;
    pb = pbn;
    pbn = tmp;
    mb = m0b;
    gb = g0b;
  }
  // the start: w_i = φ_i p_0 + p_{i+1}, m = −1/p_0, 1/F = 1/p_0, a = 0
  const rowb = new Float64Array(r);
  for (let i = 0; i < r; i++) rowb[i] = pb[i];
  const p0 = row[0];
  for (let i = 0; i < r; i++) {
    phib[i] += wb[i] * p0;
    rowb[0] += wb[i] * phi[i];
    if (i + 1 < r) rowb[i + 1] += wb[i];
  }
  rowb[0] += mb / (p0 * p0) - gb / (p0 * p0);
  return { phib, rowb };
}

/**
 * An adjoint pass that ends early: the steady-state score (steady-score.ts) runs smallAdjoint
 * over the filter's start-up only, hours 0 … hours − 1, from the adjoints of the state after
 * the last of them that its own backward pass over the steady stretch gave, with the whole
 * objective's ½/S and ½/n; generalAdjoint likewise for a longer state. Arrays of the state
 * size at least (smallAdjoint reads four, zero beyond the state size).
 */
export interface AdjointSeed {
  hours: number;
  ssqBar: number;
  logBar: number;
  /** adjoints of a and of p (the first row of P) after the last hour, and of φ so far */
  a: ArrayLike<number>;
  p: ArrayLike<number>;
  phi: ArrayLike<number>;
}

/** Values of the forward recursion the backward one reads, per hour (smallAdjoint). */
const HOUR = 11;

/**
 * generalAdjoint for up to four states, the state in scalars: the states beyond r stay exactly
 * zero (φ_i = 0 and p_i = 0 there), and their adjoints reach the others only multiplied by those
 * zeros, so one four-state body serves r = 1…4 with the same sums in the same order, and the
 * forward pass keeps eleven values an hour instead of the general one's three (r + 1)-vectors.
 * On the weekly-differenced demand series' ARMA(3,3) the general one was a fifth of the fit's
 * time. With a seed it runs over the filter's start-up only (AdjointSeed). Its forward step is
 * the scalar Chandrasekhar step of kalman.ts again, kept apart on purpose: shared, it would put a
 * call or an array store into every hour of those passes (DEVELOPERS.md, engine hot paths).
 */
export function smallAdjoint(x: Float64Array, phi: Float64Array, row: Float64Array, r: number, seed?: AdjointSeed): Adjoint | null {
  const n = seed ? seed.hours : x.length;
  const ph0 = phi[0];
  const ph1 = r > 1 ? phi[1] : 0;
  const ph2 = r > 2 ? phi[2] : 0;
  const ph3 = r > 3 ? phi[3] : 0;
  const p00 = row[0];
  let p0 = p00;
  let p1 = r > 1 ? row[1] : 0;
  let p2 = r > 2 ? row[2] : 0;
  let p3 = r > 3 ? row[3] : 0;
  let w0 = ph0 * p0 + p1;
  let w1 = ph1 * p0 + p2;
  let w2 = ph2 * p0 + p3;
  let w3 = ph3 * p0;
  let a0 = 0;
  let a1 = 0;
  let a2 = 0;
  let a3 = 0;
  let m = -1 / p0;
  let ginv = 1 / p0;
  let ssq = 0;
  // every F positive and finite (what a finite Σ log F says, without a logarithm an hour: the
  // backward pass needs only 1/F)
  let positive = true;
  // per hour: a₀, w₀…w₃, p₀…p₃, m, 1/F before it; hour n holds p₀ after the last one
  const T = scratchAtLeast('chs.small', (n + 1) * HOUR);
  for (let t = 0; t < n; t++) {
    const o = t * HOUR;
    T[o] = a0;
    T[o + 1] = w0;
    T[o + 2] = w1;
    T[o + 3] = w2;
    T[o + 4] = w3;
    T[o + 5] = p0;
    T[o + 6] = p1;
    T[o + 7] = p2;
    T[o + 8] = p3;
    T[o + 9] = m;
    T[o + 10] = ginv;
    const y = x[t];
    const v = y - a0;
    const vf = v * ginv;
    ssq += v * vf;
    if (!(p0 > 0 && p0 < Infinity)) positive = false;
    const coef = w0 * ginv;
    const mz = m * w0;
    a0 = ph0 * y + a1 + p1 * vf;
    a1 = ph1 * y + a2 + p2 * vf;
    a2 = ph2 * y + a3 + p3 * vf;
    a3 = ph3 * y;
    const nw0 = w1 - p1 * coef;
    const nw1 = w2 - p2 * coef;
    const nw2 = w3 - p3 * coef;
    p0 += mz * w0;
    p1 += mz * w1;
    p2 += mz * w2;
    p3 += mz * w3;
    w0 = nw0;
    w1 = nw1;
    w2 = nw2;
    w3 = 0;
    ginv = 1 / p0;
    m -= mz * mz * ginv;
  }
  T[n * HOUR + 5] = p0;
  if (!positive || !Number.isFinite(ssq) || !(seed ? seed.ssqBar > 0 : ssq > 0)) return null;
  // adjoints of the state after hour t (see generalAdjoint), after the last hour the seed's
  let ab0 = seed ? seed.a[0] : 0;
  let ab1 = seed ? seed.a[1] : 0;
  let ab2 = seed ? seed.a[2] : 0;
  let ab3 = seed ? seed.a[3] : 0;
  let wb0 = 0;
  let wb1 = 0;
  let wb2 = 0;
  let wb3 = 0;
  let pb0 = seed ? seed.p[0] : 0;
  let pb1 = seed ? seed.p[1] : 0;
  let pb2 = seed ? seed.p[2] : 0;
  let pb3 = seed ? seed.p[3] : 0;
  let mb = 0;
  let gb = 0;
  let phib0 = seed ? seed.phi[0] : 0;
  let phib1 = seed ? seed.phi[1] : 0;
  let phib2 = seed ? seed.phi[2] : 0;
  let phib3 = seed ? seed.phi[3] : 0;
  const ssqBar = seed ? seed.ssqBar : 0.5 / ssq;
  const logBar = seed ? seed.logBar : 0.5 / n;
  for (let t = n - 1; t >= 0; t--) {
    const o = t * HOUR;
    const y = x[t];
    const q0 = T[o + 5];
    const q1 = T[o + 6];
    const q2 = T[o + 7];
    const q3 = T[o + 8];
    const z0 = T[o + 1];
    const z1 = T[o + 2];
    const z2 = T[o + 3];
    const z3 = T[o + 4];
    const m0 = T[o + 9];
    const g0 = T[o + 10];
    const v = y - T[o];
    const vf = v * g0;
    const coef = z0 * g0;
    const mz = m0 * z0;
    const gn = 1 / T[o + HOUR + 5];
    let mzb = -2 * mz * gn * mb;
    const gnb = gb - mz * mz * mb;
    let m0b = mb;
    const pn0b = -gn * gn * gnb;
    const pbi0 = pb0 + pn0b;
    mzb += pbi0 * z0;
    mzb += pb1 * z1;
    mzb += pb2 * z2;
    mzb += pb3 * z3;
    const coefb = -wb0 * q1 - wb1 * q2 - wb2 * q3;
    phib0 += ab0 * y;
    phib1 += ab1 * y;
    phib2 += ab2 * y;
    phib3 += ab3 * y;
    let vfb = ab0 * q1 + ab1 * q2 + ab2 * q3;
    m0b += mzb * z0;
    const zwb = mzb * m0 + coefb * g0;
    let g0b = coefb * z0;
    let vb = ssqBar * vf;
    vfb += ssqBar * v;
    vb += vfb * g0;
    g0b += vfb * v;
    const npb0 = pbi0 + logBar / q0;
    const npb1 = pb1 + (ab0 * vf - wb0 * coef);
    const npb2 = pb2 + (ab1 * vf - wb1 * coef);
    const npb3 = pb3 + (ab2 * vf - wb2 * coef);
    const nwb0 = pbi0 * mz + zwb;
    const nwb1 = pb1 * mz + wb0;
    const nwb2 = pb2 * mz + wb1;
    const nwb3 = pb3 * mz + wb2;
    ab3 = ab2;
    ab2 = ab1;
    ab1 = ab0;
    ab0 = -vb;
    pb0 = npb0;
    pb1 = npb1;
    pb2 = npb2;
    pb3 = npb3;
    wb0 = nwb0;
    wb1 = nwb1;
    wb2 = nwb2;
    wb3 = nwb3;
    mb = m0b;
    gb = g0b;
  }
  // the start, as in generalAdjoint
  const phib = Float64Array.of(phib0, phib1, phib2, phib3).subarray(0, r);
  const rowb = Float64Array.of(pb0, pb1, pb2, pb3).subarray(0, r);
  const wb = [wb0, wb1, wb2, wb3];
  for (let i = 0; i < r; i++) {
    phib[i] += wb[i] * p00;
    rowb[0] += wb[i] * phi[i];
    if (i + 1 < r) rowb[i + 1] += wb[i];
  }
  rowb[0] += mb / (p00 * p00) - gb / (p00 * p00);
  return { phib, rowb };
}
