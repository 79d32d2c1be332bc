/**
 * The method-of-moments start (Box & Jenkins 1970, §6.3.2–6.3.3). Expected values are the
 * models the series were simulated from: the moment estimators are consistent, so on 200,000
 * values they land within a few hundredths of them. ρ₁ = θ/(1 + θ²) gives 0.4 for θ = 0.5.
 */
import { hasMomentStart, momentStart } from './moment-start';

/** Park–Miller uniforms and Box–Muller normals: deterministic innovations. */
function normals(n: number, seed: number): Float64Array {
  let s = seed;
  const u = () => (s = (s * 16807) % 2147483647) / 2147483647;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
  return out;
}

/** x_t = φ x_{t−1} + e_t + θ e_{t−1} */
function arma11(n: number, phi: number, theta: number, seed: number): Float64Array {
  const e = normals(n + 100, seed);
  const x = new Float64Array(n + 100);
  for (let t = 1; t < x.length; t++) x[t] = phi * x[t - 1] + e[t] + theta * e[t - 1];
  return x.subarray(100);
}

describe('method-of-moments start', () => {
  it('covers MA(1) and ARMA(1,1) without a seasonal block only', () => {
    expect(hasMomentStart(0, 1, 0, 0)).toBe(true);
    expect(hasMomentStart(1, 1, 0, 0)).toBe(true);
    expect(hasMomentStart(1, 0, 0, 0)).toBe(false);
    expect(hasMomentStart(0, 2, 0, 0)).toBe(false);
    expect(hasMomentStart(0, 1, 0, 1)).toBe(false);
  });

  it.each([
    [0.5, 1],
    [-0.7, 2],
    [0.9, 3],
  ])('MA(1) θ = %p is recovered, the invertible root', (theta, seed) => {
    const s = momentStart(arma11(200_000, 0, theta, seed), 0);
    expect(s?.ar.length).toBe(0);
    expect(s?.ma[0]).toBeCloseTo(theta, 1);
  });

  it.each([
    [0.5, 0.3, 4],
    [0.9, -0.4, 5],
    [-0.6, 0.2, 6],
  ])('ARMA(1,1) φ = %p, θ = %p is recovered', (phi, theta, seed) => {
    const s = momentStart(arma11(200_000, phi, theta, seed), 1);
    expect(s?.ar[0]).toBeCloseTo(phi, 1);
    expect(s?.ma[0]).toBeCloseTo(theta, 1);
  });

  it('puts an MA(1) start just inside the region when |ρ₁| ≥ ½ (no MA(1) has it)', () => {
    // an alternating series: ρ₁ close to −1
    const x = Float64Array.from({ length: 500 }, (_, t) => (t % 2 === 0 ? 1 : -1));
    expect(momentStart(x, 0)?.ma[0]).toBe(-0.95);
  });

  it('starts white noise at zero (ρ₁ within ±2/√n) and refuses a constant series', () => {
    const s = momentStart(normals(200_000, 7), 1);
    expect(s?.ar[0]).toBe(0);
    expect(s?.ma[0]).toBe(0);
    expect(momentStart(new Float64Array(50).fill(3), 0)).toBeNull();
  });
});
