/**
 * A stored model forecasts as the engine's fit it was stored from: the seasonal block and the
 * calibrated bands survive the round trip through ModelVersion.parameters (the engine's own
 * forecast is the reference; its methods are checked against R in the engine's specs).
 */
import { applyArima, fitArima, forecastArima, scaleBands } from '@morrowline/engine';
import { forecastStored } from './refit';
import type { StoredModel } from '../stored-model';

// a weekly-repeating load shape with an AR(1) wobble, eight weeks (deterministic)
const hours = 8 * 168;
const values = new Float64Array(hours);
let e = 0;
for (let t = 0; t < hours; t++) {
  e = 0.7 * e + 120 * Math.sin(12.9898 * t) * Math.cos(78.233 * t);
  values[t] = 30000 + 5000 * Math.sin((2 * Math.PI * (t % 24)) / 24) - (t % 168 >= 120 ? 3000 : 0) + e;
}

describe('forecastStored', () => {
  it('carries the lag-24 seasonal block and the band scales of the stored version', () => {
    const fit = fitArima(values, { diff: [168], p: 1, q: 0, P: 1, Q: 1, period: 24, includeMean: false }, { computeSe: false });
    const a = fit.arma;
    const scale = { k80: 0.9, k95: 1.2, hours: 672 };
    const model: StoredModel = { diff: [168], p: 1, q: 0, ar: Array.from(a.ar), ma: [], sigma2: a.sigma2, mean: 0, P: 1, Q: 1, period: 24, sar: Array.from(a.sar), sma: Array.from(a.sma), bandScale: { k80: 0.9, k95: 1.2 } };
    const got = forecastStored({ values, excluded: [], horizon: 30, model }).forecast;
    const want = scaleBands(forecastArima(applyArima(fit, values), 30), scale);
    for (let i = 0; i < 30; i++) {
      expect(got.mean[i]).toBeCloseTo(want.mean[i], 6);
      expect(got.upper80[i]).toBeCloseTo(want.upper80[i], 6);
      expect(got.lower95[i]).toBeCloseTo(want.lower95[i], 6);
    }
  });

  it('a version stored before the seasonal block and calibration forecasts with plain ARMA and Gaussian bands', () => {
    const fit = fitArima(values, { diff: [168], p: 1, q: 1, includeMean: false }, { computeSe: false });
    const model: StoredModel = { diff: [168], p: 1, q: 1, ar: Array.from(fit.arma.ar), ma: Array.from(fit.arma.ma), sigma2: fit.arma.sigma2, mean: 0 };
    const got = forecastStored({ values, excluded: [], horizon: 24, model }).forecast;
    const want = forecastArima(applyArima(fit, values), 24);
    expect(got.upper95[5]).toBeCloseTo(want.upper95[5], 6);
    expect(got.mean[23]).toBeCloseTo(want.mean[23], 6);
  });
});
