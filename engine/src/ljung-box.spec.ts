/**
 * Ljung–Box against R 4.2.2 `Box.test(type = "Ljung-Box")` on R's own arima residuals
 * (fixtures/r-arima.json from fixtures/r-arima.R), and the engine.md §8 value (typed from the
 * brief): airline model on log(AirPassengers), lag 24, fitdf 2: X² 26.446, p 0.233.
 */
import fixture from './fixtures/r-arima.json';
import { ljungBox } from './ljung-box';

const nums = (a: Array<number | null>) => a.map((v) => (v === null ? NaN : v));

describe('Ljung–Box (R Box.test)', () => {
  it.each(fixture.cases.map((c) => [c.name, c] as const))('%s residuals at lag 12', (_n, c) => {
    const r = ljungBox(nums(c.residuals as Array<number | null>), 12, c.boxTest.fitdf);
    expect(r.statistic).toBeCloseTo(c.boxTest.statistic, 9);
    expect(r.df).toBe(c.boxTest.df);
    expect(r.pValue).toBeCloseTo(c.boxTest.p, 8);
  });
  it('airline residuals at lag 24 with fitdf 2 (regenerated and engine.md §8)', () => {
    const r = ljungBox(fixture.airlineBox24.residuals, 24, 2);
    expect(r.statistic).toBeCloseTo(fixture.airlineBox24.statistic, 9);
    expect(r.pValue).toBeCloseTo(fixture.airlineBox24.p, 9);
    expect(r.statistic).toBeCloseTo(26.446, 3);
    expect(r.pValue).toBeCloseTo(0.233, 3);
  });
  it('white noise is not rejected, an AR(1) is', () => {
    let s = 7;
    const rnd = () => ((s = (s * 16807) % 2147483647) / 2147483647) - 0.5;
    const e = Array.from({ length: 2000 }, rnd);
    expect(ljungBox(e, 24).pValue).toBeGreaterThan(0.001);
    const ar = e.map((_, i, a) => a[i]);
    for (let i = 1; i < ar.length; i++) ar[i] = 0.5 * ar[i - 1] + e[i];
    expect(ljungBox(ar, 24).pValue).toBeLessThan(1e-10);
  });
});
