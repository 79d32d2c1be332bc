import { minimizeBfgs } from './bfgs';
import { normalizeSpec } from './fit';
import { armaInformation, inverseSpd } from './information';

const f64 = (v: number[]) => Float64Array.from(v);

describe('armaInformation (asymptotic information per observation, units of σ²)', () => {
  it('AR(1) and MA(1): 1 / (1 − c²) (Box & Jenkins 1970, §7.2.6)', () => {
    const ar = armaInformation({ ar: f64([0.7]), ma: f64([]), sar: f64([]), sma: f64([]) }, normalizeSpec({ p: 1, q: 0 }), 2000);
    expect(ar[0]).toBeCloseTo(1 / (1 - 0.49), 10);
    const ma = armaInformation({ ar: f64([]), ma: f64([-0.4]), sar: f64([]), sma: f64([]) }, normalizeSpec({ p: 0, q: 1 }), 2000);
    expect(ma[0]).toBeCloseTo(1 / (1 - 0.16), 10);
  });

  it('ARMA(1,1): its inverse is the asymptotic covariance of Brockwell & Davis (1991), Example 8.8.3 (formula from memory)', () => {
    // X_t − φ X_{t−1} = Z_t + θ Z_{t−1}: n·Var(φ̂, θ̂) = (1 + φθ)/(φ + θ)² ·
    //   [[(1 − φ²)(1 + φθ), −(1 − θ²)(1 − φ²)], [−(1 − θ²)(1 − φ²), (1 − θ²)(1 + φθ)]]
    const phi = 0.6;
    const theta = 0.3;
    const info = armaInformation({ ar: f64([phi]), ma: f64([theta]), sar: f64([]), sma: f64([]) }, normalizeSpec({ p: 1, q: 1 }), 4000);
    const inv = inverseSpd(info, 2, 0) as Float64Array;
    const c = (1 + phi * theta) / (phi + theta) ** 2;
    expect(inv[0]).toBeCloseTo(c * (1 - phi * phi) * (1 + phi * theta), 8);
    expect(inv[1]).toBeCloseTo(-c * (1 - theta * theta) * (1 - phi * phi), 8);
    expect(inv[3]).toBeCloseTo(c * (1 - theta * theta) * (1 + phi * theta), 8);
  });

  it('a seasonal AR(1) at period 24 has the same information as an AR(1), and none shared with a lag-1 AR', () => {
    const spec = normalizeSpec({ p: 1, q: 0, P: 1, Q: 0, period: 24 });
    const info = armaInformation({ ar: f64([0.5]), ma: f64([]), sar: f64([0.8]), sma: f64([]) }, spec, 24 * 400);
    expect(info[0]).toBeCloseTo(1 / (1 - 0.25), 8);
    expect(info[3]).toBeCloseTo(1 / (1 - 0.64), 8);
    // cross term Σ_k 0.5^{24k+24}·0.8^k… is tiny but positive
    expect(info[1]).toBeGreaterThan(0);
    expect(info[1]).toBeLessThan(1e-6);
  });
});

describe('inverseSpd', () => {
  it('inverts a symmetric positive definite matrix', () => {
    const A = f64([4, 1, 0.5, 1, 3, 0.2, 0.5, 0.2, 2]);
    const inv = inverseSpd(A, 3, 0) as Float64Array;
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) {
        let s = 0;
        for (let m = 0; m < 3; m++) s += A[i * 3 + m] * inv[m * 3 + j];
        expect(s).toBeCloseTo(i === j ? 1 : 0, 12);
      }
    }
  });

  it('refuses a matrix that is not positive definite', () => {
    expect(inverseSpd(f64([1, 2, 2, 1]), 2, 0)).toBeNull();
  });
});

describe('minimizeBfgs with a starting inverse Hessian', () => {
  it('takes the Newton step on a quadratic when given its exact inverse Hessian', () => {
    // f(x) = ½ x'Ax − b'x, minimum at A⁻¹b = (1, 2) for the values below
    const A = f64([3, 1, 1, 2]);
    const b = [5, 5];
    const f = (x: Float64Array) => 0.5 * (A[0] * x[0] * x[0] + 2 * A[1] * x[0] * x[1] + A[3] * x[1] * x[1]) - b[0] * x[0] - b[1] * x[1];
    const plain = minimizeBfgs(f, [0, 0], { gradTol: 1e-6 });
    const newton = minimizeBfgs(f, [0, 0], { gradTol: 1e-6, inverseHessian: inverseSpd(A, 2, 0) as Float64Array });
    expect(newton.x[0]).toBeCloseTo(1, 4);
    expect(newton.x[1]).toBeCloseTo(2, 4);
    expect(newton.iterations).toBeLessThanOrEqual(2);
    expect(newton.evaluations).toBeLessThan(plain.evaluations);
  });
});
