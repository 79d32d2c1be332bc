/** PACF transform (Barndorff-Nielsen & Schou 1973; Monahan 1984): round trip and stationarity. */
import fc from 'fast-check';
import { fromStationary, isStationary, pacfToAr, toInvertible, toStationary, fromInvertible, arToPacf } from './transform';
import { gardnerCovariance, seriesCovariance, armaStateSpace } from './state-space';

describe('partial-autocorrelation transform', () => {
  it('maps every real vector to a stationary AR and back', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -3, max: 3, noNaN: true }), { minLength: 1, maxLength: 5 }), (x) => {
        const phi = toStationary(x);
        const back = fromStationary(phi) as Float64Array;
        expect(back).not.toBeNull();
        x.forEach((v, i) => expect(back[i]).toBeCloseTo(v, 6));
        const th = toInvertible(x);
        const back2 = fromInvertible(th) as Float64Array;
        x.forEach((v, i) => expect(back2[i]).toBeCloseTo(v, 6));
      }),
    );
  });
  it('AR(2) stationarity triangle', () => {
    expect(isStationary([0.5, 0.3])).toBe(true);
    expect(isStationary([0.5, 0.6])).toBe(false); // φ1 + φ2 > 1
    expect(isStationary([0.2, -1.1])).toBe(false); // φ2 < −1
    expect(Array.from(pacfToAr([0.5, 0.2]))).toEqual([0.5 - 0.2 * 0.5, 0.2].map((v) => expect.closeTo(v, 12)));
    expect(arToPacf([1.2])).toBeNull();
  });
  it('Gardner–Harvey–Phillips covariance equals the series solution', () => {
    const ss = armaStateSpace([0.6, -0.2, 0.1], [0.4, 0.3, -0.2, 0.1]);
    const a = gardnerCovariance(ss);
    const b = seriesCovariance(ss);
    for (let i = 0; i < a.length; i++) expect(a[i]).toBeCloseTo(b[i], 9);
    // AR(1): γ(0)/σ² = 1/(1−φ²)
    expect(gardnerCovariance(armaStateSpace([0.8], []))[0]).toBeCloseTo(1 / (1 - 0.64), 12);
  });
});
