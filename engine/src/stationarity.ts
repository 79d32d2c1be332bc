/**
 * The stationarity report of the workbench: ADF (constant) and KPSS (level) on the series and on
 * each candidate differencing, the autocorrelation at the daily and weekly lags, rolling mean and
 * variance drift, and a verdict in plain words. A series is called stationary when ADF rejects a
 * unit root at 5 % and KPSS does not reject stationarity at 5 % (the confirmatory reading of
 * both tests, e.g. Maddala & Kim 1998, §4.5); a daily or weekly pattern is reported when the ACF
 * at lag 24 or 168 exceeds 0.3.
 */
import { acf } from './series/acf';
import { adfTest, AdfResult } from './adf';
import { describeDifferencing, difference } from './differencing';
import { kpssTest, KpssResult } from './kpss';
import { rollingStats } from './rolling';
import { meanFinite } from './series/series';

export interface SeriesCheck {
  label: string;
  diff: number[];
  adf: AdfResult;
  kpss: KpssResult;
  acf24: number;
  acf168: number;
  stationary: boolean;
}

export interface StationarityReport {
  checks: SeriesCheck[];
  meanDrift: number;
  varianceRatio: number;
  findings: string[];
  verdict: string;
  recommended: number[] | null;
}

function check(x: ArrayLike<number>, diff: number[]): SeriesCheck {
  const adf = adfTest(x, { regression: 'c', maxLag: Math.min(48, Math.ceil(12 * Math.pow(x.length / 100, 0.25))) });
  const kpss = kpssTest(x, { type: 'level' });
  const r = acf(x, Math.min(168, x.length - 1));
  return {
    label: describeDifferencing(diff),
    diff,
    adf,
    kpss,
    acf24: r[24] ?? NaN,
    acf168: r[168] ?? NaN,
    stationary: adf.pValue < 0.05 && kpss.pValue > 0.05,
  };
}

export function stationarityReport(y: ArrayLike<number>, candidates: number[][] = [[24], [168], [24, 168]]): StationarityReport {
  const checks = [check(y, []), ...candidates.map((d) => check(difference(y, d), d))];
  const base = checks[0];
  const week = rollingStats(y, 168);
  const means = Array.from(week.mean).filter(Number.isFinite);
  const vars = Array.from(week.variance).filter(Number.isFinite);
  const overall = meanFinite(y);
  const meanDrift = means.length ? (Math.max(...means) - Math.min(...means)) / Math.abs(overall || 1) : NaN;
  const varianceRatio = vars.length ? Math.max(...vars) / Math.max(Math.min(...vars), 1e-12) : NaN;
  const findings: string[] = [];
  if (meanDrift > 0.1) findings.push(`the weekly average load moves by ${(100 * meanDrift).toFixed(0)} % over the history, so the mean is not constant`);
  if (varianceRatio > 2) findings.push(`the spread of the load changes from week to week (largest weekly variance ${varianceRatio.toFixed(1)} times the smallest)`);
  if (base.acf24 > 0.3) findings.push(`a strong daily pattern: the load is correlated with the same hour yesterday (ACF at 24 h = ${base.acf24.toFixed(2)})`);
  if (base.acf168 > 0.3) findings.push(`a weekly pattern: correlated with the same hour last week (ACF at 168 h = ${base.acf168.toFixed(2)})`);
  if (base.adf.pValue >= 0.05) findings.push(`the ADF test cannot rule out a unit root (p = ${base.adf.pValue.toFixed(3)})`);
  if (base.kpss.pValue <= 0.05) findings.push(`the KPSS test rejects a stable level (statistic ${base.kpss.statistic.toFixed(2)} above the 5 % value 0.463)`);
  const ok = checks.slice(1).filter((c) => c.stationary);
  const recommendedCheck = ok.length ? ok.reduce((a, b) => (Math.abs(b.acf24) + Math.abs(b.acf168) < Math.abs(a.acf24) + Math.abs(a.acf168) ? b : a)) : null;
  let verdict: string;
  if (base.stationary && base.acf24 <= 0.3 && base.acf168 <= 0.3) verdict = 'The series already looks stationary: no differencing is needed.';
  else if (recommendedCheck) {
    verdict = `The series is not stationary as it stands. After ${recommendedCheck.label} the ADF and KPSS tests both agree the result is stationary, so that differencing removes the problem (the backtest makes the final choice).`;
  } else verdict = 'None of the candidate differencings makes both tests agree on stationarity; the backtest decides, and the model should be checked with care.';
  return { checks, meanDrift, varianceRatio, findings, verdict, recommended: recommendedCheck ? recommendedCheck.diff : base.stationary ? [] : null };
}
