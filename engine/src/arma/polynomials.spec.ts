/**
 * The seasonal expansion's derivatives. Expected values: the product (1 − 0.5B)(1 − 0.3B⁴)
 * multiplied out by hand, and the adjoint identity ⟨d, J·δ⟩ = ⟨Jᵀd, δ⟩, which ties
 * expansionAdjoint (reverse mode) to central differences of expandAr / expandMa themselves.
 */
import { expandAr, expandMa, expansionAdjoint, filledLags } from './polynomials';

const dot = (a: ArrayLike<number>, b: ArrayLike<number>) => {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
};

describe('expandAr', () => {
  it('multiplies (1 − 0.5B)(1 − 0.3B⁴) into 1 − 0.5B − 0.3B⁴ + 0.15B⁵', () => {
    // a_k are the coefficients of 1 − Σ a_k B^k
    expect(Array.from(expandAr([0.5], [0.3], 4))).toEqual([0.5, 0, 0, 0.3, -0.15]);
  });
});

describe('filledLags', () => {
  it('names the lags two coefficients and one seasonal one at 4 can fill: 1, 2, 4, 5, 6', () => {
    expect(Array.from(filledLags(2, 1, 4))).toEqual([1, 2, 4, 5, 6]);
  });
  it('is empty without coefficients', () => {
    expect(filledLags(0, 0, 12)).toHaveLength(0);
  });
});

describe('expansionAdjoint', () => {
  // pseudo-random but fixed values
  const c = [0.41, -0.27, 0.13];
  const C = [-0.36, 0.22];
  const s = 5;
  const K = c.length + C.length * s;
  const d = Array.from({ length: K }, (_, i) => Math.sin(1.7 * i + 0.3));
  const h = 1e-6;
  it.each([
    ['AR', -1 as const, expandAr],
    ['MA', 1 as const, expandMa],
  ])('%s: each factor coefficient’s derivative equals the central difference of ⟨d, expansion⟩', (_name, sign, expand) => {
    const { dc, dC } = expansionAdjoint(d, c, C, s, sign);
    const f = (cc: number[], CC: number[]) => dot(d, expand(cc, CC, s));
    for (let i = 0; i < c.length; i++) {
      const up = c.map((v, k) => (k === i ? v + h : v));
      const dn = c.map((v, k) => (k === i ? v - h : v));
      expect(dc[i]).toBeCloseTo((f(up, C) - f(dn, C)) / (2 * h), 8);
    }
    for (let j = 0; j < C.length; j++) {
      const up = C.map((v, k) => (k === j ? v + h : v));
      const dn = C.map((v, k) => (k === j ? v - h : v));
      expect(dC[j]).toBeCloseTo((f(c, up) - f(c, dn)) / (2 * h), 8);
    }
  });
});
