/**
 * ADF and KPSS against tseries and urca (fixtures/r-stationarity.json from
 * fixtures/r-stationarity.R) and statsmodels 0.13.5 (fixtures/statsmodels-stationarity.json from
 * fixtures/statsmodels-stationarity.py), on Nile, lh and log(AirPassengers) and its differences;
 * MacKinnon p-values and critical values against statsmodels' mackinnonp / mackinnoncrit;
 * plus the engine.md §2 and §8 values typed from the brief.
 */
import rfx from './fixtures/r-stationarity.json';
import sfx from './fixtures/statsmodels-stationarity.json';
import { adfTest } from './adf';
import { kpssTest } from './kpss';
import { mackinnonCritical, mackinnonP, AdfRegression } from './mackinnon';

const R = rfx.series;
const S = sfx.series;

describe.each(R.map((s, i) => [s.name, s, S[i]] as const))('stationarity tests on %s', (_n, r, s) => {
  it('tseries adf.test: constant + trend, lag trunc((n−1)^{1/3})', () => {
    const k = Math.trunc(Math.pow(r.x.length - 1, 1 / 3));
    expect(k).toBe(r.tseriesAdf.lag);
    expect(adfTest(r.x, { regression: 'ct', lags: k }).statistic).toBeCloseTo(r.tseriesAdf.statistic, 8);
  });
  it('urca ur.df with 2 fixed lags, none / drift / trend', () => {
    const map: Record<string, AdfRegression> = { none: 'n', drift: 'c', trend: 'ct' };
    for (const u of r.urcaDf) expect(adfTest(r.x, { regression: map[u.type], lags: 2 }).statistic).toBeCloseTo(u.tau, 8);
  });
  it('statsmodels adfuller: AIC lag choice and fixed lags, p-values', () => {
    for (const a of s.adf) {
      const res = a.autolag ? adfTest(r.x, { regression: a.regression as AdfRegression }) : adfTest(r.x, { regression: a.regression as AdfRegression, lags: 3 });
      expect(res.lags).toBe(a.lags);
      expect(res.nobs).toBe(a.nobs);
      expect(res.statistic).toBeCloseTo(a.statistic, 8);
      expect(res.pValue).toBeCloseTo(a.p, 8);
      expect(res.criticalValues['5%']).toBeCloseTo(a.crit['5%'], 8);
    }
  });
  it('tseries kpss.test and urca ur.kpss (short lag), level and trend', () => {
    const lv = kpssTest(r.x, { type: 'level' });
    expect(lv.lags).toBe(r.tseriesKpssLevel.lag);
    expect(lv.statistic).toBeCloseTo(r.tseriesKpssLevel.statistic, 8);
    expect(lv.pValue).toBeCloseTo(r.tseriesKpssLevel.p, 8);
    const tr = kpssTest(r.x, { type: 'trend' });
    expect(tr.statistic).toBeCloseTo(r.tseriesKpssTrend.statistic, 8);
    expect(kpssTest(r.x, { type: 'level' }).statistic).toBeCloseTo(r.urcaKpss[0].stat, 8);
    expect(kpssTest(r.x, { type: 'trend' }).statistic).toBeCloseTo(r.urcaKpss[1].stat, 8);
  });
  it('statsmodels kpss, nlags legacy and 4', () => {
    for (const k of s.kpss) {
      const res = kpssTest(r.x, { type: k.regression === 'c' ? 'level' : 'trend', lags: k.nlags === 'legacy' ? 'long' : (k.nlags as number) });
      expect(res.lags).toBe(k.lags);
      expect(res.statistic).toBeCloseTo(k.statistic, 8);
      expect(res.pValue).toBeCloseTo(k.p, 8);
    }
  });
});

describe('MacKinnon response surfaces (statsmodels mackinnonp / mackinnoncrit)', () => {
  it.each(sfx.mackinnon.map((m) => [JSON.stringify(m).slice(0, 60), m] as const))('%s', (_l, m) => {
    const reg = m.regression as AdfRegression;
    if ('p' in m && m.p !== undefined) expect(mackinnonP(m.stat as number, reg)).toBeCloseTo(m.p as number, 10);
    else {
      const c = mackinnonCritical(reg, (m.nobs as number | null) ?? undefined);
      const crit = m.crit as number[];
      expect([c['1%'], c['5%'], c['10%']].map((v, i) => v - crit[i]).every((d) => Math.abs(d) < 1e-10)).toBe(true);
    }
  });
});

describe('engine.md values (typed from the brief)', () => {
  const nile = R[0].x;
  it('MacKinnon (2010) asymptotic critical values', () => {
    const c = (r: AdfRegression) => Object.values(mackinnonCritical(r));
    expect(c('n')).toEqual([-2.56574, -1.941, -1.61682]);
    expect(c('c')).toEqual([-3.43035, -2.86154, -2.56677]);
    expect(c('ct')).toEqual([-3.95877, -3.41049, -3.12705]);
  });
  it('Nile: tseries KPSS 0.96543 (lag 4), ADF −3.3657 (lag 4); statsmodels KPSS 0.5497 (12 lags), ADF −4.0487, p 0.00118, 1 lag', () => {
    const k = kpssTest(nile);
    expect(k.lags).toBe(4);
    expect(k.statistic).toBeCloseTo(0.96543, 5);
    expect(adfTest(nile, { regression: 'ct', lags: 4 }).statistic).toBeCloseTo(-3.3657, 4);
    const kl = kpssTest(nile, { lags: 'long' });
    expect(kl.lags).toBe(12);
    expect(kl.statistic).toBeCloseTo(0.5497, 4);
    const a = adfTest(nile, { regression: 'c' });
    expect(a.statistic).toBeCloseTo(-4.0487, 4);
    expect(a.pValue).toBeCloseTo(0.00118, 5);
    expect(a.lags).toBe(1);
  });
  it('KPSS Table 1 critical values', () => {
    expect(Object.values(kpssTest(nile).criticalValues)).toEqual([0.347, 0.463, 0.574, 0.739]);
    expect(Object.values(kpssTest(nile, { type: 'trend' }).criticalValues)).toEqual([0.119, 0.146, 0.176, 0.216]);
  });
});
