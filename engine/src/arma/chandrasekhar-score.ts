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
import { stationaryCovarianceTangents } from './state-space';
import { StateSpaceTangents } from './state-space-tangents';
import { scratch } from './scratch';

export function chandrasekharScore(x: Float64Array, model: StateSpaceTangents, k: number): Float64Array | null {
  const { ss, dPhi, dR } = model;
  const { r, phi } = ss;
  const n = x.length;
  if (n === 0) return null;
  const { row, dRow } = (r > 12 ? firstRowTangents(r, phi, ss.R, dPhi, dR, k) : null) ?? stationaryCovarianceTangents(ss, dPhi, dR, k);
  if (!(row[0] > 0)) return null;
  const s = r + 1;
  // a, w, p before each hour t at offset t·s (element r the zero padding), then m and 1/F: the
  // recursion writes each hour's state straight after the previous one, nothing is copied
  const A = scratch('chs.a', (n + 1) * s);
  const W = scratch('chs.w', (n + 1) * s);
  const Pr = scratch('chs.p', (n + 1) * s);
  const M = scratch('chs.m', n);
  const G = scratch('chs.g', n);
  for (let i = 0; i < s; i++) {
    A[i] = 0;
    Pr[i] = i < r ? row[i] : 0;
  }
  for (let i = 0; i < r; i++) W[i] = phi[i] * Pr[0] + Pr[i + 1];
  W[r] = 0;
  let m = -1 / Pr[0];
  let ginv = 1 / Pr[0];
  let ssq = 0;
  let sumLogF = 0;
  for (let t = 0; t < n; t++) {
    const o = t * s;
    const on = o + s;
    M[t] = m;
    G[t] = ginv;
    const y = x[t];
    const v = y - A[o];
    const vf = v * ginv;
    ssq += v * vf;
    sumLogF += Math.log(Pr[o]);
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
  if (!(ssq > 0) || !Number.isFinite(ssq) || !Number.isFinite(sumLogF)) return null;
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
  const ssqBar = 0.5 / ssq;
  const logBar = 0.5 / n;
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
  const grad = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    const o = j * r;
    let g = 0;
    for (let i = 0; i < r; i++) g += phib[i] * dPhi[o + i] + rowb[i] * dRow[o + i];
    grad[j] = g;
  }
  return grad.every(Number.isFinite) ? grad : null;
}
