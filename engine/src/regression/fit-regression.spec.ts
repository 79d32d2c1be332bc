/**
 * The estimator's own properties (expected values from the plain ARMA fit, from the model's
 * definition, or from the data by construction): without regressors it is the engine's ARIMA
 * fit; a missing regressor value makes that hour missing; the extra-variance hook adds to the
 * forecast variance; re-running the fitted model over its own history reproduces its forecast;
 * and what cannot be estimated is refused by name. Data: the open hourly demand series
 * (fixtures/taylor-hourly.json; forecast's taylor, hourly means).
 */
import taylor from '../fixtures/taylor-hourly.json';
import { fitArima, forecastArima, IntervalForecast, Z80 as ARIMA_Z80, Z95 as ARIMA_Z95 } from '../forecast';
import { Z80, Z95 } from './forecast-regression';
import { applyRegression, fitRegression } from './fit-regression';
import type { Regressor, RegressionForecast } from './types';

const load = Float64Array.from((taylor as { load: number[] }).load.slice(0, 1344));
const hours = load.length;
const daily = (f: (h: number) => number, n = hours): Float64Array => Float64Array.from({ length: n }, (_, t) => f(t));
const sin24: Regressor = { name: 'sin24', values: daily((t) => Math.sin((2 * Math.PI * t) / 24)) };
const cos24: Regressor = { name: 'cos24', values: daily((t) => Math.cos((2 * Math.PI * t) / 24)) };
// a weekly shape that a daily differencing leaves alive (weekend hours)
const weekendValues = daily((t) => (Math.floor(t / 24) % 7 >= 5 ? 1 : 0));
const weekend: Regressor = { name: 'weekend', values: weekendValues };

describe('regression with ARMA errors: the estimator', () => {
  it('without regressors it is the ARIMA fit (same likelihood, the intercept is its mean)', () => {
    const a = fitArima(load, { diff: [], p: 2, q: 1 }, { computeSe: false });
    const r = fitRegression(load, [], { diff: [], p: 2, q: 1 }, { computeSe: false });
    expect(r.loglik).toBeCloseTo(a.arma.loglik, 4);
    expect(r.beta.map((b) => b.name)).toEqual(['intercept']);
    expect(Math.abs(r.beta[0].value - a.arma.mean)).toBeLessThan(0.5);
    const d = fitArima(load, { diff: [24], p: 1, q: 1 }, { computeSe: false });
    const rd = fitRegression(load, [], { diff: [24], p: 1, q: 1 }, { computeSe: false });
    expect(rd.loglik).toBeCloseTo(d.arma.loglik, 4);
    expect(rd.beta).toEqual([]);
    const fa = forecastArima(d, 24);
    const fr = rd.forecast([], { horizon: 24 });
    for (let i = 0; i < 24; i++) {
      expect(Math.abs(fr.mean[i] - fa.mean[i])).toBeLessThan(1e-3 * fa.se[i]);
      expect(fr.se[i] / fa.se[i]).toBeCloseTo(1, 3);
    }
  });

  it('a missing regressor value makes that hour missing, as a missing load would', () => {
    const gapX = Float64Array.from(weekend.values);
    gapX[300] = NaN;
    gapX[301] = NaN;
    const gapY = Float64Array.from(load);
    gapY[300] = NaN;
    gapY[301] = NaN;
    const a = fitRegression(load, [{ name: 'weekend', values: gapX }], { diff: [24], p: 1, q: 1 }, { computeSe: false });
    const b = fitRegression(gapY, [weekend], { diff: [24], p: 1, q: 1 }, { computeSe: false });
    expect(a.loglik).toBe(b.loglik);
    expect(a.beta[0].value).toBe(b.beta[0].value);
    // eight weeks of hours are too long for the diffuse form: the differenced form loses the
    // four daily differences that touch the two missing hours
    expect(a.likelihood).toBe('differenced');
    expect(a.nUsed).toBe(hours - 24 - 4);
    expect(Number.isNaN(a.errors[300])).toBe(true);
  });

  it("uses the daily differencing on the regressors too: a weekend term's coefficient in MW, with a standard error", () => {
    const fit = fitRegression(load, [weekend], { diff: [24], p: 2, q: 1 });
    const w = fit.beta[0];
    expect(w.name).toBe('weekend');
    // weekend load in England & Wales is lower than weekday load (common practice: weekly profile)
    expect(w.value).toBeLessThan(0);
    expect(w.se).toBeGreaterThan(0);
    expect(Math.abs(w.value / w.se)).toBeGreaterThan(2);
    expect(fit.nParams).toBe(2 + 1 + 1 + 1);
  });

  it('the extra variance per step adds to the forecast variance and leaves the mean alone', () => {
    const fit = fitRegression(load, [sin24, cos24], { diff: [], p: 2, q: 0 }, { computeSe: false });
    const future = [
      { name: 'cos24', values: daily((t) => Math.cos((2 * Math.PI * (hours + t)) / 24), 6) },
      { name: 'sin24', values: daily((t) => Math.sin((2 * Math.PI * (hours + t)) / 24), 6) },
    ];
    const plain = fit.forecast(future);
    const extra = [0, 1e4, 4e4, 9e4, 1.6e5, 2.5e5];
    const wide = fit.forecast(future, { extraVariance: extra });
    expect(wide.mean).toEqual(plain.mean);
    expect(wide.modelSe).toEqual(plain.se);
    for (let i = 0; i < 6; i++) expect(wide.se[i] ** 2).toBeCloseTo(plain.se[i] ** 2 + extra[i], 4);
    // the regression part is x'β with the intercept
    const b = Object.fromEntries(fit.beta.map((k) => [k.name, k.value]));
    expect(plain.regression[0]).toBeCloseTo(b.intercept + b.sin24 * future[1].values[0] + b.cos24 * future[0].values[0], 6);
  });

  it('re-running the fitted model over its own history reproduces its forecast; over a longer one it starts later', () => {
    const fit = fitRegression(load, [weekend], { diff: [24], p: 1, q: 1 }, { computeSe: false });
    const next = { name: 'weekend', values: daily((t) => (Math.floor((hours + t) / 24) % 7 >= 5 ? 1 : 0), 24) };
    const again = applyRegression(fit, load, [weekend]);
    expect(again.forecast([next]).mean).toEqual(fit.forecast([next]).mean);
    const shorter = applyRegression(fit, load.slice(0, hours - 24), [{ name: 'weekend', values: weekendValues.slice(0, hours - 24) }]);
    const day = shorter.forecast([{ name: 'weekend', values: weekendValues.slice(hours - 24) }]);
    expect(shorter.hours).toBe(hours - 24);
    expect(shorter.loglik).toBe(fit.loglik);
    // a day-ahead forecast of the last day is close to it (within its 95 % band nearly everywhere)
    let inside = 0;
    for (let i = 0; i < 24; i++) if (load[hours - 24 + i] >= day.lower95[i] && load[hours - 24 + i] <= day.upper95[i]) inside++;
    expect(inside).toBeGreaterThanOrEqual(20);
  });

  describe('refuses what cannot be estimated, by name', () => {
    const spec = { diff: [] as number[], p: 1, q: 0 };
    it.each([
      ['a wrong length', [{ name: 'x', values: new Float64Array(10) }], 'fit: regressor "x" has 10 values for 1344 hours'],
      ['a repeated name', [sin24, sin24], 'fit: regressor "sin24" is given twice'],
      ['the reserved name', [{ name: 'intercept', values: sin24.values }], '"intercept" is reserved'],
      ['an empty name', [{ name: ' ', values: sin24.values }], 'fit: a regressor has an empty name'],
      ['a constant beside the intercept', [{ name: 'flat', values: daily(() => 3) }], 'regressor "flat" is (nearly) a combination of the ones before it'],
    ])('%s', (_what, regs, message) => {
      expect(() => fitRegression(load, regs as Regressor[], spec)).toThrow(message);
    });
    it('a daily shape under a daily differencing (it vanishes)', () => {
      expect(() => fitRegression(load, [sin24], { diff: [24], p: 1, q: 0 })).toThrow('regressor "sin24" is zero on every hour used after the differencing');
    });
    it('an intercept with a differencing', () => {
      expect(() => fitRegression(load, [weekend], { diff: [24], p: 1, q: 0, includeMean: true })).toThrow('a constant vanishes after differencing');
    });
    it.each([
      ['a missing name', [], 'forecast: future values of "weekend" are needed'],
      ['an unknown name', [{ name: 'other', values: [1] }], 'forecast: regressor "other" is not in the fitted model (weekend)'],
      ['a non-finite value', [{ name: 'weekend', values: [0, NaN] }], 'forecast: future value 2 of "weekend" is not a finite number'],
      ['no steps', [{ name: 'weekend', values: [] }], 'forecast: the horizon must be at least one hour'],
    ])('a forecast with %s', (_what, future, message) => {
      const fit = fitRegression(load, [weekend], { diff: [24], p: 1, q: 0 }, { computeSe: false });
      expect(() => fit.forecast(future as Regressor[])).toThrow(message);
    });
    it('an extra variance of the wrong length or negative', () => {
      const fit = fitRegression(load, [weekend], { diff: [24], p: 1, q: 0 }, { computeSe: false });
      const future = [{ name: 'weekend', values: [0, 0] }];
      expect(() => fit.forecast(future, { extraVariance: [1] })).toThrow('forecast: extraVariance has 1 values for 2 steps');
      expect(() => fit.forecast(future, { extraVariance: [1, -1] })).toThrow('forecast: extraVariance 2 must be a finite variance ≥ 0, got -1');
    });
  });

  it("bands on the ARIMA forecast's normal quantiles, in its shape", () => {
    expect(Z80).toBeCloseTo(ARIMA_Z80, 14);
    expect(Z95).toBeCloseTo(ARIMA_Z95, 14);
    const fit = fitRegression(load, [weekend], { diff: [24], p: 1, q: 0 }, { computeSe: false });
    const f: RegressionForecast = fit.forecast([{ name: 'weekend', values: [0] }]);
    const asArima: IntervalForecast = f;
    expect(asArima.upper95[0] - asArima.mean[0]).toBeCloseTo(Z95 * f.se[0], 9);
  });
});

describe('regression with ARMA errors: the diffuse form', () => {
  it("a gap switches a differenced series to the diffuse form, which agrees with the differenced form where both apply", () => {
    const y = load.slice(0, 600);
    const x = [{ name: 'weekend', values: weekendValues.slice(0, 600) }];
    const a = fitRegression(y, x, { diff: [24], p: 1, q: 1 }, { computeSe: false });
    expect(a.likelihood).toBe('differenced');
    // one hour missing at the very end changes little, and switches the form (600 hours under
    // (1 − B^24) ARMA(1,1): a state of 26, within the diffuse form's reach)
    const yGap = Float64Array.from(y);
    yGap[599] = NaN;
    const b = fitRegression(yGap, x, { diff: [24], p: 1, q: 1 }, { computeSe: false });
    expect(b.likelihood).toBe('diffuse');
    expect(b.nUsed).toBe(600 - 1 - 24);
    const c = fitRegression(y.slice(0, 599), [{ name: 'weekend', values: weekendValues.slice(0, 599) }], { diff: [24], p: 1, q: 1 }, { computeSe: false });
    // the last hour missing is the same as the series ending an hour earlier, up to R's finite
    // κ = 10⁶ for the 24 diffuse levels (a few thousandths of log L on loads of 30,000 MW)
    expect(Math.abs(b.loglik - c.loglik)).toBeLessThan(0.01);
    expect(Math.abs(b.beta[0].value / c.beta[0].value - 1)).toBeLessThan(1e-4);
    // re-run over its own history the diffuse fit reproduces its forecast
    const next = [{ name: 'weekend', values: weekendValues.slice(600, 624) }];
    expect(applyRegression(b, yGap, x).forecast(next).mean).toEqual(b.forecast(next).mean);
    // and it runs on over a longer history in the form it was estimated in
    const later = applyRegression(b, load.slice(0, 624), [{ name: 'weekend', values: weekendValues.slice(0, 624) }]);
    expect(later.likelihood).toBe('diffuse');
    expect(later.hours).toBe(624);
  });
});
