/**
 * The first row of the stationary state covariance P of a large ARMA state and its derivatives
 * along k directions (given as derivatives of φ and R, row-major k×r each), from the process's
 * autocovariances, as autocovariance-covariance.ts builds P. The first state element is y_t
 * itself, so with σ² = 1, γ(h) = Cov(y_t, y_{t−h}) and ψ the MA(∞) weights,
 *   P_0j = Σ_{l=0}^{r−1−j} ( φ_{j+l+1} γ(l+1) + θ_{j+l} ψ_l ),
 * and every piece differentiates in closed form: ψ_j = θ_j + Σ_i φ_i ψ_{j−i},
 * g_k = Σ_{j≥k} θ_j ψ_{j−k}, γ(0..p) from γ(k) − Σ_i φ_i γ(|k−i|) = g_k (Brockwell & Davis 1991,
 * §3.3) — one factorisation for γ and all its derivatives, whose right-hand sides gain
 * Σ_i dφ_i γ(|k−i|) — and γ(k) = g_k + Σ_i φ_i γ(k−i) beyond p. O(k · r · p) in all, where
 * summing the series form term by term (state-space.ts) takes thousands of terms when a
 * seasonal AR root is near the unit circle. Null when the system is singular (a unit root).
 */
export function firstRowTangents(r: number, phi: Float64Array, R: Float64Array, dPhi: Float64Array, dR: Float64Array, k: number): { row: Float64Array; dRow: Float64Array } | null {
  // the orders include every index a direction moves (a coefficient may be zero where it is)
  let p = 0;
  let q = 0;
  for (let i = 0; i < r; i++) {
    let movesPhi = phi[i] !== 0;
    let movesR = i > 0 && R[i] !== 0;
    for (let h = 0; h < k; h++) {
      if (dPhi[h * r + i] !== 0) movesPhi = true;
      if (i > 0 && dR[h * r + i] !== 0) movesR = true;
    }
    if (movesPhi) p = i + 1;
    if (movesR) q = i;
  }
  const K = k + 1; // direction 0 is the value itself, 1..k the derivatives
  // ψ_0..ψ_r and their derivatives, psi[d * (r + 1) + j]
  const L = r + 1;
  const psi = new Float64Array(K * L);
  for (let j = 0; j <= r; j++) {
    let s = j < r ? R[j] : 0;
    for (let i = 1; i <= Math.min(j, p); i++) s += phi[i - 1] * psi[j - i];
    psi[j] = s;
  }
  for (let h = 0; h < k; h++) {
    const o = (h + 1) * L;
    for (let j = 0; j <= r; j++) {
      let s = j < r ? dR[h * r + j] : 0;
      for (let i = 1; i <= Math.min(j, p); i++) s += dPhi[h * r + i - 1] * psi[j - i] + phi[i - 1] * psi[o + j - i];
      psi[o + j] = s;
    }
  }
  // g_k = Σ_{j=k}^{q} θ_j ψ_{j−k} (θ_0 = 1, fixed) and derivatives
  const g = new Float64Array(K * L);
  for (let d = 0; d < K; d++) {
    const o = d * L;
    for (let kk = 0; kk <= r; kk++) {
      let s = 0;
      for (let j = kk; j <= q; j++) {
        if (d === 0) s += R[j] * psi[j - kk];
        else s += (j > 0 ? dR[(d - 1) * r + j] : 0) * psi[j - kk] + R[j] * psi[o + j - kk];
      }
      g[o + kk] = s;
    }
  }
  // γ(0..p): A γ = g, then A dγ = dg + Σ_i dφ_i γ(|k−i|)
  const m = p + 1;
  const A = new Float64Array(m * m);
  for (let kk = 0; kk <= p; kk++) {
    A[kk * m + kk] += 1;
    for (let i = 1; i <= p; i++) A[kk * m + Math.abs(kk - i)] -= phi[i - 1];
  }
  const piv = new Int32Array(m);
  if (!luFactor(A, m, piv)) return null;
  const gamma = new Float64Array(K * L);
  const b = new Float64Array(m);
  for (let kk = 0; kk <= p; kk++) b[kk] = g[kk];
  luSolve(A, m, piv, b);
  for (let kk = 0; kk <= p; kk++) gamma[kk] = b[kk];
  if (!(gamma[0] > 0) || !Number.isFinite(gamma[0])) return null;
  for (let h = 0; h < k; h++) {
    const o = (h + 1) * L;
    for (let kk = 0; kk <= p; kk++) {
      let s = g[o + kk];
      for (let i = 1; i <= p; i++) s += dPhi[h * r + i - 1] * gamma[Math.abs(kk - i)];
      b[kk] = s;
    }
    luSolve(A, m, piv, b);
    for (let kk = 0; kk <= p; kk++) gamma[o + kk] = b[kk];
  }
  for (let kk = p + 1; kk <= r; kk++) {
    let s = g[kk];
    for (let i = 1; i <= p; i++) s += phi[i - 1] * gamma[kk - i];
    gamma[kk] = s;
    for (let h = 0; h < k; h++) {
      const o = (h + 1) * L;
      let t = g[o + kk];
      for (let i = 1; i <= p; i++) t += dPhi[h * r + i - 1] * gamma[kk - i] + phi[i - 1] * gamma[o + kk - i];
      gamma[o + kk] = t;
    }
  }
  // P_0j and its derivatives
  const row = new Float64Array(r);
  const dRow = new Float64Array(k * r);
  for (let j = 0; j < r; j++) {
    let s = 0;
    for (let l = 0; j + l < r; l++) s += phi[j + l] * gamma[l + 1] + R[j + l] * psi[l];
    row[j] = s;
    for (let h = 0; h < k; h++) {
      const o = (h + 1) * L;
      let t = 0;
      for (let l = 0; j + l < r; l++) {
        t += dPhi[h * r + j + l] * gamma[l + 1] + phi[j + l] * gamma[o + l + 1] + dR[h * r + j + l] * psi[l] + R[j + l] * psi[o + l];
      }
      dRow[h * r + j] = t;
    }
  }
  return { row, dRow };
}

/** LU with partial pivoting in place; false when singular. */
function luFactor(a: Float64Array, m: number, piv: Int32Array): boolean {
  for (let c = 0; c < m; c++) {
    let best = c;
    for (let i = c + 1; i < m; i++) if (Math.abs(a[i * m + c]) > Math.abs(a[best * m + c])) best = i;
    piv[c] = best;
    if (!(Math.abs(a[best * m + c]) > 1e-300)) return false;
    if (best !== c) {
      for (let j = 0; j < m; j++) {
        const t = a[c * m + j];
        a[c * m + j] = a[best * m + j];
        a[best * m + j] = t;
      }
    }
    const d = a[c * m + c];
    for (let i = c + 1; i < m; i++) {
      const f = a[i * m + c] / d;
      a[i * m + c] = f;
      if (f !== 0) for (let j = c + 1; j < m; j++) a[i * m + j] -= f * a[c * m + j];
    }
  }
  return true;
}

function luSolve(a: Float64Array, m: number, piv: Int32Array, b: Float64Array): void {
  // the rows were swapped whole during the factorisation: all swaps first, then L
  for (let c = 0; c < m; c++) {
    const pc = piv[c];
    if (pc !== c) {
      const t = b[c];
      b[c] = b[pc];
      b[pc] = t;
    }
  }
  for (let c = 0; c < m; c++) for (let i = c + 1; i < m; i++) b[i] -= a[i * m + c] * b[c];
  for (let i = m - 1; i >= 0; i--) {
    let s = b[i];
    for (let j = i + 1; j < m; j++) s -= a[i * m + j] * b[j];
    b[i] = s / a[i * m + i];
  }
}
