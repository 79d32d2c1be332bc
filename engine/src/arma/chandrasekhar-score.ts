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
 * the chain rule. About three passes' work whatever the number of coefficients.
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
  // stored per hour: a, w, p (stride s, element r the zero padding), m and 1/F
  const A = scratch('chs.a', n * s);
  const W = scratch('chs.w', n * s);
  const Pr = scratch('chs.p', n * s);
  const M = scratch('chs.m', n);
  const G = scratch('chs.g', n);
  let a = scratch('chs.a0', s);
  let w = scratch('chs.w0', s);
  let p = scratch('chs.p0', s);
  let an = scratch('chs.an', s);
  let wn = scratch('chs.wn', s);
  let pn = scratch('chs.pn', s);
  a.fill(0);
  w.fill(0);
  p.fill(0);
  an.fill(0);
  wn.fill(0);
  pn.fill(0);
  for (let i = 0; i < r; i++) p[i] = row[i];
  for (let i = 0; i < r; i++) w[i] = phi[i] * p[0] + p[i + 1];
  let m = -1 / p[0];
  let ginv = 1 / p[0];
  let ssq = 0;
  let sumLogF = 0;
  for (let t = 0; t < n; t++) {
    const o = t * s;
    for (let i = 0; i < s; i++) {
      A[o + i] = a[i];
      W[o + i] = w[i];
      Pr[o + i] = p[i];
    }
    M[t] = m;
    G[t] = ginv;
    const y = x[t];
    const v = y - a[0];
    const vf = v * ginv;
    ssq += v * vf;
    sumLogF += Math.log(p[0]);
    const zw = w[0];
    const coef = zw * ginv;
    const mz = m * zw;
    for (let i = 0; i < r; i++) {
      an[i] = phi[i] * y + a[i + 1] + p[i + 1] * vf;
      wn[i] = w[i + 1] - p[i + 1] * coef;
      pn[i] = p[i] + mz * w[i];
    }
    ginv = 1 / pn[0];
    m -= mz * mz * ginv;
    [a, an] = [an, a];
    [w, wn] = [wn, w];
    [p, pn] = [pn, p];
  }
  if (!(ssq > 0) || !Number.isFinite(ssq) || !Number.isFinite(sumLogF)) return null;
  // adjoints of the state after hour t (entering hour t + 1): ā, w̄, p̄, m̄, ḡ (of 1/F)
  const ab = scratch('chs.ab', s);
  const wb = scratch('chs.wb', s);
  const pb = scratch('chs.pb', s);
  const abn = scratch('chs.abn', s);
  const wbn = scratch('chs.wbn', s);
  const pbn = scratch('chs.pbn', s);
  ab.fill(0);
  wb.fill(0);
  pb.fill(0);
  let mb = 0;
  let gb = 0;
  const phib = new Float64Array(r);
  const ssqBar = 0.5 / ssq;
  const logBar = 0.5 / n;
  for (let t = n - 1; t >= 0; t--) {
    const o = t * s;
    const y = x[t];
    const a0 = A[o];
    const g0 = G[t];
    const m0 = M[t];
    const zw = W[o];
    const v = y - a0;
    const vf = v * g0;
    const coef = zw * g0;
    const mz = m0 * zw;
    // the new p_0 and 1/F of the next hour, as the forward step made them
    const pn0 = Pr[o] + mz * zw;
    const gn = 1 / pn0;
    // m ← m − mz² gn
    let mzb = -2 * mz * gn * mb;
    let gnb = gb - mz * mz * mb;
    let m0b = mb;
    // gn = 1/pn_0
    const pn0b = -gn * gn * gnb;
    abn.fill(0);
    wbn.fill(0);
    pbn.fill(0);
    let vfb = 0;
    let coefb = 0;
    for (let i = 0; i < r; i++) {
      // pn_i = p_i + mz w_i
      const pbi = pb[i] + (i === 0 ? pn0b : 0);
      pbn[i] += pbi;
      mzb += pbi * W[o + i];
      wbn[i] += pbi * mz;
      // wn_i = w_{i+1} − p_{i+1} coef
      const wbi = wb[i];
      wbn[i + 1] += wbi;
      pbn[i + 1] -= wbi * coef;
      coefb -= wbi * Pr[o + i + 1];
      // an_i = φ_i y + a_{i+1} + p_{i+1} vf
      const abi = ab[i];
      phib[i] += abi * y;
      abn[i + 1] += abi;
      pbn[i + 1] += abi * vf;
      vfb += abi * Pr[o + i + 1];
    }
    // mz = m zw, coef = zw g
    m0b += mzb * zw;
    let zwb = mzb * m0 + coefb * g0;
    let g0b = coefb * zw;
    wbn[0] += zwb;
    zwb = 0;
    // ssq += v vf, vf = v g
    let vb = ssqBar * vf;
    vfb += ssqBar * v;
    vb += vfb * g0;
    g0b += vfb * v;
    abn[0] -= vb;
    // sumLogF += log p_0
    pbn[0] += logBar / Pr[o];
    for (let i = 0; i < s; i++) {
      ab[i] = abn[i];
      wb[i] = wbn[i];
      pb[i] = pbn[i];
    }
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
