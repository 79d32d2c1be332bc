/**
 * The exact gradient of the concentrated log-likelihood (the objective of fit.ts) for a complete
 * series with a known mean, at about the cost of three likelihood passes whatever the number of
 * coefficients, instead of one pass per coefficient for forward differences.
 *
 * Once the Kalman filter has reached its steady state (hour t₀ on), the rest of the series runs
 * through a fixed linear recursion, the innovations form of the ARMA model:
 *   e_t = y_t − a_{t,0},   a_{t+1,i} = c_i a_{t,0} + d_i y_t + a_{t,i+1},
 * with c_i = φ_i (1 − k_0) − k_{i+1} and d_i = φ_i k_0 + k_{i+1} from the steady gain k. Its
 * sum of squares E = Σ e_t² depends on the coefficients only through c, d and the state a_{t₀+1}
 * it starts from, and the derivatives of E with respect to all of those come from one backward
 * (adjoint) recursion, reverse-mode differentiation of the loop above (Griewank & Walther 2008,
 * ch. 3): with γ_t = ∂E/∂a_{t,0}, the shift structure gives ∂E/∂a_{t,j} = γ_{t+j}, so
 *   γ_t = −2 e_t + Σ_i c_i γ_{t+1+i},  ∂E/∂c_i = Σ_t γ_{t+1+i} a_{t,0},  ∂E/∂d_i = Σ_t γ_{t+1+i} y_t.
 * The forward half, a_{t,0}, is what the likelihood pass at the same point already computed (its
 * `trace`). What happens before t₀ (the stationary start, the time-varying gain, F_t) is
 * differentiated backwards as well, by the Chandrasekhar recursions' adjoint
 * (chandrasekhar-score.ts) started from what this pass leaves on the state at t₀ + 1
 * (startUpAdjointScore): reverse mode end to end.
 */
import { firstRowWithTangents, generalAdjoint, gradientAlong, smallAdjoint } from './chandrasekhar-score';
import { SteadyEntry } from './kalman';
import { scratch } from './scratch';
import { ArmaStateSpace } from './state-space';
import { StateSpaceTangents } from './state-space-tangents';

export interface SteadyScoreInput {
  /** the series, complete (no missing hour), mean already removed */
  x: Float64Array;
  /** the model at a vector of unconstrained values and its derivatives in them */
  model: (u: Float64Array) => StateSpaceTangents;
}

/** What the likelihood pass at u left behind: its Σ v_t²/F_t, its switch, its predictions. */
export interface SteadyPass {
  ssq: number;
  entry: SteadyEntry;
  /** a_{t,0} for the hours after the switch */
  trace: Float64Array;
}

/**
 * The steady recursion's c_i = φ_i (1 − k_0) − k_{i+1} from the AR coefficients and the steady
 * gain (the backward pass needs c only; d enters through the derivatives below).
 */
function recursionC(ss: ArmaStateSpace, k: Float64Array): Float64Array {
  const r = ss.r;
  const c = new Float64Array(r);
  for (let i = 0; i < r; i++) c[i] = ss.phi[i] * (1 - k[0]) - (i + 1 < r ? k[i + 1] : 0);
  return c;
}

/**
 * ∇ of ½ log(S/n) + ½ Σ log F_t / n at u, S = Σ v_t²/F_t (the objective of fit.ts without a
 * mean), from the pass that evaluated it at u. Null when the steady stretch is too short for
 * this to pay, or the model does not exist near u: the caller then differences the whole
 * likelihood.
 */
export function steadyStateScore(input: SteadyScoreInput, u: Float64Array, pass: SteadyPass): Float64Array | null {
  const { x, model } = input;
  const n = x.length;
  const entry = pass.entry;
  const t0 = entry.steadyAt;
  const k = u.length;
  // The start-up's backward pass costs about three filter steps an hour of it whatever k, and
  // the steady stretch's one step an hour: never dearer than the Chandrasekhar score (three to
  // four passes without the steady stop), and about three passes where differences take k.
  // (Until 4 December 2026 the start-up was differentiated forwards, by tangents along each
  // coefficient, about k steps an hour; past 3n/k hours of start-up the Chandrasekhar score
  // took over.)
  if (t0 < 0) return null;
  const { ss, dPhi, dR } = model(u);
  const r = ss.r;
  const c = recursionC(ss, entry.gain);
  const first = t0 + 1;
  const gc = scratch('score.gc', r);
  const gd = scratch('score.gd', r);
  // ∂E/∂a_{t₀+1}: γ_{t₀+1+i}
  const ga = scratch('score.ga', r);
  if (r <= 3 || (r === 4 && lastStateFixed(ss, dPhi, k))) adjointSmall(x, first, c, pass.trace, ga, gc, gd);
  else adjointGeneral(x, first, c, pass.trace, ga, gc, gd);
  const F = entry.F;
  // E = Σ e_t² over the steady stretch, where the pass divided by the constant F
  const E = (pass.ssq - entry.ssq) * F;
  try {
    return startUpAdjointScore(x, ss, dPhi, dR, k, entry, { S: pass.ssq, E, m: n - first, ga, gc, gd });
  } catch {
    // no stationary covariance near u
    return null;
  }
}

/** What the backward pass over the steady stretch leaves for the start-up's. */
interface SteadyAdjoints {
  /** the whole Σ v²/F, the steady stretch's Σ e², and its number of hours */
  S: number;
  E: number;
  m: number;
  /** ∂E/∂a_{t₀+1}, ∂E/∂c, ∂E/∂d */
  ga: Float64Array;
  gc: Float64Array;
  gd: Float64Array;
}

/**
 * The gradient with the start-up differentiated backwards too: the adjoints the steady stretch
 * leaves on the state after hour t₀ (its predicted state a, its gain p/p₀ and its F = p₀, where
 * p is the first row of P) seed the Chandrasekhar adjoint (chandrasekhar-score.ts) run over
 * hours 0..t₀ only, which carries them back to φ and to the first row of the stationary
 * covariance. About three start-up passes whatever k, where forward tangents cost about one
 * per coefficient: on the weekly-differenced demand series they were a quarter of ARMA(3,3)'s
 * time and two thirds of ARMA(3,3)×(1,1)_24's.
 *
 * With the objective ½ log(S/n) + ½ Σ log F / n, S = S₀ + E/F, Σ log F = L₀ + m log F, and
 * c_i = φ_i (1 − k₀) − k_{i+1}, d_i = φ_i k₀ + k_{i+1}, k_j = p_j / p₀:
 *   ∂E/∂k₀ = Σ_i φ_i (∂E/∂d_i − ∂E/∂c_i),  ∂E/∂k_j = ∂E/∂d_{j−1} − ∂E/∂c_{j−1} (j ≥ 1),
 *   ∂E/∂φ_i (held gain) = ∂E/∂c_i (1 − k₀) + ∂E/∂d_i k₀,
 * and the quotient rule carries ∂E/∂k to p.
 */
function startUpAdjointScore(x: Float64Array, ss: ArmaStateSpace, dPhi: Float64Array, dR: Float64Array, k: number, entry: SteadyEntry, st: SteadyAdjoints): Float64Array | null {
  const { r, phi } = ss;
  const { S, E, m, ga, gc, gd } = st;
  const F = entry.F;
  const gain = entry.gain;
  const k0 = gain[0];
  const n = x.length;
  const ssqBar = 0.5 / S;
  const logBar = 0.5 / n;
  // the objective reads E through ½ (E/F) / S
  const scale = ssqBar / F;
  // zeroed, and zero beyond r (smallAdjoint reads four)
  const size = Math.max(r, 4);
  const kb = scratch('score.kb', size);
  for (let i = 0; i < r; i++) kb[0] += phi[i] * (gd[i] - gc[i]);
  for (let j = 1; j < r; j++) kb[j] = gd[j - 1] - gc[j - 1];
  const a = scratch('score.seed.a', size);
  const p = scratch('score.seed.p', size);
  const phiSeed = scratch('score.seed.phi', size);
  let kbGain = 0;
  for (let j = 0; j < r; j++) {
    a[j] = scale * ga[j];
    phiSeed[j] = scale * (gc[j] * (1 - k0) + gd[j] * k0);
    p[j] = (scale * kb[j]) / F;
    kbGain += kb[j] * gain[j];
  }
  // p₀ is F as well: in E/F, in m log F, and in every k_j = p_j / p₀
  p[0] += (-scale * kbGain) / F - (ssqBar * E) / (F * F) + (logBar * m) / F;
  const { row, dRow } = firstRowWithTangents(ss, dPhi, dR, k);
  const seed = { hours: entry.steadyAt + 1, ssqBar, logBar, a, p, phi: phiSeed };
  const adj = r <= 4 ? smallAdjoint(x, phi, row, r, seed) : generalAdjoint(x, phi, row, r, seed);
  return adj ? gradientAlong(adj, dPhi, dRow, r, k) : null;
}

/**
 * Whether φ_{r−1} is zero with all its derivatives (fewer AR coefficients than states, as in
 * ARMA(p, q) with q ≥ p): then c_{r−1} = d_{r−1} = 0 along every direction and the last state
 * only passes values on, which lets the four-state adjoint keep three of everything.
 */
function lastStateFixed(ss: ArmaStateSpace, dPhi: Float64Array, k: number): boolean {
  const r = ss.r;
  if (ss.phi[r - 1] !== 0) return false;
  for (let j = 0; j < k; j++) if (dPhi[j * r + r - 1] !== 0) return false;
  return true;
}

/**
 * The backward recursion γ_t = −2 e_t + Σ_i c_i γ_{t+1+i} over the steady stretch, zero past
 * the end (a_n and later feed nothing), with ∂E/∂c and ∂E/∂d accumulated; e_t = y_t − a_{t,0}
 * from the pass's predictions. Writes γ_first … γ_{first+r−1} to ga.
 */
function adjointGeneral(x: Float64Array, first: number, c: Float64Array, a0s: Float64Array, ga: Float64Array, gc: Float64Array, gd: Float64Array): void {
  const n = x.length;
  const r = c.length;
  const gamma = scratch('score.gamma', n + r + 1);
  for (let t = n - 1; t >= first; t--) {
    const y = x[t];
    const a0 = a0s[t];
    let g = 2 * (a0 - y);
    for (let i = 0; i < r; i++) {
      const gi = gamma[t + 1 + i];
      g += c[i] * gi;
      gc[i] += gi * a0;
      gd[i] += gi * y;
    }
    gamma[t] = g;
  }
  for (let i = 0; i < r; i++) ga[i] = gamma[first + i];
}

/**
 * The same in scalars for up to three states, or four whose last has c_3 = d_3 = 0 with all
 * derivatives (lastStateFixed): then γ needs three lags and ∂E/∂c_3, ∂E/∂d_3 and ∂E/∂a_3 are
 * never used (written as zero). Fewer live values than the general four-state form, which
 * spilled registers.
 */
function adjointSmall(x: Float64Array, first: number, c: Float64Array, a0s: Float64Array, ga: Float64Array, gc: Float64Array, gd: Float64Array): void {
  const n = x.length;
  const r = c.length;
  const c0 = c[0];
  const c1 = r > 1 ? c[1] : 0;
  const c2 = r > 2 ? c[2] : 0;
  // γ_{t+1} … γ_{t+3}
  let g1 = 0;
  let g2 = 0;
  let g3 = 0;
  let sc0 = 0;
  let sc1 = 0;
  let sc2 = 0;
  let sd0 = 0;
  let sd1 = 0;
  let sd2 = 0;
  for (let t = n - 1; t >= first; t--) {
    const y = x[t];
    const a = a0s[t];
    sc0 += g1 * a;
    sc1 += g2 * a;
    sc2 += g3 * a;
    sd0 += g1 * y;
    sd1 += g2 * y;
    sd2 += g3 * y;
    // grouped so that the next γ waits on one multiply-add of the last, not on three
    const g = c0 * g1 + (2 * (a - y) + (c1 * g2 + c2 * g3));
    g3 = g2;
    g2 = g1;
    g1 = g;
  }
  // γ_first … γ_{first+2}: what the start-up state's derivative is taken against
  const g = [g1, g2, g3, 0];
  const sc = [sc0, sc1, sc2, 0];
  const sd = [sd0, sd1, sd2, 0];
  for (let i = 0; i < r; i++) {
    ga[i] = g[i];
    gc[i] = sc[i];
    gd[i] = sd[i];
  }
}
