/**
 * Forecasts from many origins out of one filter pass agree with a filter run to each origin
 * (the reference: applyArima on the history cut at the origin, then forecastArima).
 */
import taylor from './fixtures/taylor-hourly.json';
import { applyArima, fitArima, forecastArima } from './forecast';
import { originForecaster } from './origin-forecasts';

const y = Float64Array.from((taylor.load as number[]).slice(-8 * 168));

describe.each([
  ['(1−B^168) ARMA(3,1)×(1,1)_24', { diff: [168], p: 3, q: 1, P: 1, Q: 1, period: 24 }],
  ['(1−B^24)(1−B^168) ARMA(2,2)', { diff: [24, 168], p: 2, q: 2 }],
  ['(1−B^24) ARMA(1,1)', { diff: [24], p: 1, q: 1 }],
])('origin forecasts of %s', (_name, spec) => {
  const fit = fitArima(y, spec, { computeSe: false });
  const last = y.length - 24;
  const fast = originForecaster(fit, y, last, 40);
  it.each([y.length - 28 * 24, y.length - 14 * 24 + 9, last])('from hour %i match one filter per origin', (origin) => {
    const slow = forecastArima(applyArima(fit, y.subarray(0, origin)), 40);
    const f = fast(origin, 40);
    for (let j = 0; j < 40; j++) {
      expect(Math.abs(f.mean[j] - slow.mean[j])).toBeLessThan(1e-6 * slow.mean[j]);
      expect(Math.abs(f.se[j] - slow.se[j])).toBeLessThan(1e-6 * slow.se[j]);
    }
  });
});
