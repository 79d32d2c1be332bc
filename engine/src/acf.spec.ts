/**
 * ACF / PACF against R 4.2.2 `acf` and `pacf` (fixtures/r-arima.json, from fixtures/r-arima.R):
 * lh (no missing values) and presidents (missing values, na.action = na.pass).
 */
import fixture from './fixtures/r-arima.json';
import { acf, pacf } from './series/acf';

const nums = (a: Array<number | null>) => a.map((v) => (v === null ? NaN : v));

describe('ACF and PACF (R acf/pacf)', () => {
  it('lh ACF to lag 10', () => {
    const r = acf(fixture.acfLh.x, 10);
    fixture.acfLh.acf.forEach((v, i) => expect(r[i]).toBeCloseTo(v, 12));
  });
  it('lh PACF (Durbin–Levinson) to lag 10', () => {
    const r = pacf(fixture.acfLh.x, 10);
    fixture.acfLh.pacf.forEach((v, i) => expect(r[i]).toBeCloseTo(v, 12));
  });
  it('presidents ACF with missing values (pairwise, as na.pass)', () => {
    const r = acf(nums(fixture.acfPresidents.x as Array<number | null>), 8);
    fixture.acfPresidents.acf.forEach((v, i) => expect(r[i]).toBeCloseTo(v, 12));
  });
});
