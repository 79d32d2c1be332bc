import { reduceDeviationRank } from './deviation-rank';

/**
 * The deviation W M W' brought down to its numerical rank: the product is unchanged (to
 * round-off) and the rank is that of the product, checked on products built with a known rank
 * (columns made as combinations of fewer directions, or as many: nothing to drop) and one with an
 * indefinite M. Expected values come from the construction, not from the code under test.
 */
describe('reduceDeviationRank', () => {
  const r = 9;
  const s = r + 1;
  // a deterministic pseudo-random stream (a linear congruential generator) for the test data
  let seed = 12345;
  const next = () => {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    return seed / 2147483648 - 0.5;
  };

  function product(W: Float64Array, M: Float64Array, g: number, ms: number): number[][] {
    const D = Array.from({ length: r }, () => new Array<number>(r).fill(0));
    for (let i = 0; i < r; i++)
      for (let j = 0; j < r; j++)
        for (let k = 0; k < g; k++) for (let l = 0; l < g; l++) D[i][j] += W[k * s + i] * M[k * ms + l] * W[l * s + j];
    return D;
  }

  function build(g: number, rank: number, ms: number) {
    // rank directions, each column of W a combination of them; M = B B' with B g × g
    const dirs = Array.from({ length: rank }, () => Array.from({ length: r }, next));
    const W = new Float64Array(s * ms);
    for (let k = 0; k < g; k++) {
      const mix = Array.from({ length: rank }, next);
      for (let i = 0; i < r; i++) W[k * s + i] = dirs.reduce((sum, d, m) => sum + mix[m] * d[i], 0);
    }
    const B = Array.from({ length: g }, () => Array.from({ length: g }, next));
    const M = new Float64Array(ms * ms);
    for (let k = 0; k < g; k++) for (let l = 0; l < g; l++) M[k * ms + l] = B[k].reduce((sum, b, m) => sum + b * B[l][m], 0);
    return { W, M };
  }

  const maxDiff = (a: number[][], b: number[][]) => Math.max(...a.flatMap((row, i) => row.map((v, j) => Math.abs(v - b[i][j]))));

  it.each([
    [6, 2, 8],
    [7, 4, 8],
    [8, 1, 8],
    [5, 5, 5],
  ])('%i columns spanning %i directions (M of stride %i): brought down to that rank, the same product', (g, rank, ms) => {
    const { W, M } = build(g, rank, ms);
    const before = product(W, M, g, ms);
    const kept = reduceDeviationRank(W, M, r, s, g, ms, 1e-12);
    expect(kept).toBe(rank);
    expect(maxDiff(product(W, M, kept, ms), before)).toBeLessThan(1e-12);
    // the new M is diagonal, the new columns orthonormal, the padding element zero
    for (let k = 0; k < kept; k++) {
      for (let l = 0; l < kept; l++) {
        if (k !== l) expect(M[k * ms + l]).toBe(0);
        let dot = 0;
        for (let i = 0; i < r; i++) dot += W[k * s + i] * W[l * s + i];
        expect(Math.abs(dot - (k === l ? 1 : 0))).toBeLessThan(1e-12);
      }
      expect(W[k * s + r]).toBe(0);
    }
  });

  it('keeps a negative eigenvalue (an indefinite M) and drops only what is below the threshold', () => {
    // W = [e0, e1, e0 + 1e-9 e2], M = diag(2, −1, 0): W M W' = 2 e0 e0' − e1 e1'
    const g = 3;
    const W = new Float64Array(s * g);
    W[0] = 1;
    W[s + 1] = 1;
    W[2 * s] = 1;
    W[2 * s + 2] = 1e-9;
    const M = new Float64Array([2, 0, 0, 0, -1, 0, 0, 0, 0]);
    const kept = reduceDeviationRank(W, M, r, s, g, g, 1e-12);
    expect(kept).toBe(2);
    const eig = [M[0], M[4]].sort((a, b) => a - b);
    expect(eig[0]).toBeCloseTo(-1, 12);
    expect(eig[1]).toBeCloseTo(2, 12);
  });

  it('leaves a deviation that is no longer finite as it is', () => {
    const g = 2;
    const W = new Float64Array(s * g);
    W[0] = 1;
    W[s + 1] = NaN;
    const M = new Float64Array([1, 0, 0, 1]);
    expect(reduceDeviationRank(W, M, r, s, g, g, 1e-12)).toBe(2);
    expect(W[s + 1]).toBeNaN();
  });

  it('returns zero for an empty deviation', () => {
    expect(reduceDeviationRank(new Float64Array(s), new Float64Array(1), r, s, 0, 1, 1e-12)).toBe(0);
  });
});
