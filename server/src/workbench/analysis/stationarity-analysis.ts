/**
 * The workbench's stationarity analysis of one hourly series (pure; runs in the compute pool):
 * rolling mean and variance over a day and a week, and for the series as recorded and after
 * each candidate differencing: ADF with a constant and with constant + trend (lag length by AIC
 * up to 12·(n/100)^{1/4}, Schwert 1989), KPSS (level), ACF and PACF with ±1.96/√n bands, the
 * weekly mean and variance drift, and the plain-words verdict of ./verdict.
 */
import type { Correlogram, SeriesCheckDto, StationarityVerdictDto } from '@morrowline/shared';
import { acf, acfBand, adfTest, countFinite, difference, kpssTest, meanFinite, pacfFromAcf, rollingStats, varianceFinite } from '@morrowline/engine';
import { DESK_CANDIDATES } from '../../models/analysis/refit';
import { adfReading, differencingLabel, judgeVersion, kpssReading, overallVerdict } from './verdict';

/** The differencings the tests look at: those the desk's refits choose among, so that the one in service is always among them. */
export const STATIONARITY_CANDIDATES: number[][] = DESK_CANDIDATES;

export interface StationarityInput {
  /** hourly MW, oldest first; NaN for a missing or excluded hour */
  values: Float64Array;
  maxLag: number;
}

export interface StationarityOutput {
  rolling: {
    day: { mean: (number | null)[]; variance: (number | null)[] };
    week: { mean: (number | null)[]; variance: (number | null)[] };
  };
  checks: SeriesCheckDto[];
  verdict: StationarityVerdictDto;
}

/** NaN and ±Infinity become null (JSON has no NaN); values are rounded to keep payloads small. */
export function toWire(values: ArrayLike<number>, digits = 4): (number | null)[] {
  const f = 10 ** digits;
  return Array.from(values, (v) => (Number.isFinite(v) ? Math.round(v * f) / f : null));
}

export function num(v: number): number | null {
  return Number.isFinite(v) ? v : null;
}

/** Range of the weekly means relative to the overall level, and largest / smallest weekly variance, over whole weeks. */
export function weeklyDrift(x: ArrayLike<number>): { meanDrift: number | null; varianceRatio: number | null } {
  const means: number[] = [];
  const vars: number[] = [];
  // whole weeks counted back from the end (the latest week is complete)
  for (let end = x.length; end - 168 >= 0; end -= 168) {
    const week = Array.prototype.slice.call(x, end - 168, end) as number[];
    if (countFinite(week) < 84) continue;
    means.push(meanFinite(week));
    vars.push(varianceFinite(week));
  }
  if (means.length < 2) return { meanDrift: null, varianceRatio: null };
  const level = Math.abs(meanFinite(x)) || 1;
  return {
    meanDrift: num((Math.max(...means) - Math.min(...means)) / level),
    varianceRatio: num(Math.max(...vars) / Math.max(Math.min(...vars), 1e-12)),
  };
}

function correlogram(r: ArrayLike<number>, band: number): Correlogram {
  return { values: toWire(r, 4), band: Math.round(band * 1e4) / 1e4 };
}

/** A test that cannot be computed (e.g. a singular regression on a degenerate series) is reported as such, not thrown. */
function attempt<T>(f: () => T): T | null {
  try {
    return f();
  } catch {
    return null;
  }
}

export function checkVersion(y: Float64Array, diff: number[], maxLag: number): SeriesCheckDto {
  const x = diff.length ? difference(y, diff) : y;
  const n = countFinite(x);
  const lag = Math.min(maxLag, Math.max(1, x.length - 2));
  const maxAdfLag = Math.min(48, Math.ceil(12 * Math.pow(n / 100, 0.25)));
  const adf = (['c', 'ct'] as const).map((regression) => {
    const r = attempt(() => adfTest(x, { regression, maxLag: maxAdfLag }));
    const pValue = r ? num(r.pValue) : null;
    const rejectsUnitRoot = pValue !== null && pValue < 0.05;
    return {
      regression,
      statistic: r ? num(r.statistic) : null,
      pValue,
      lags: r?.lags ?? 0,
      criticalValue5: r ? num(r.criticalValues['5%']) : null,
      rejectsUnitRoot,
      reading: adfReading({ regression, pValue, rejectsUnitRoot }),
    };
  });
  const k = attempt(() => kpssTest(x, { type: 'level' }));
  const kStat = k ? num(k.statistic) : null;
  const kp = k ? num(k.pValue) : null;
  const rejectsStableLevel = kp !== null && kp <= 0.05;
  const kpss = { statistic: kStat, pValue: kp, lags: k?.lags ?? 0, criticalValue5: k?.criticalValues['5%'] ?? 0.463, rejectsStableLevel, reading: '' };
  kpss.reading = kpssReading(kpss);
  const rho = acf(x, lag);
  const band = acfBand(n);
  const acf24 = num(rho[24] ?? NaN);
  const acf168 = num(rho[168] ?? NaN);
  const { meanDrift, varianceRatio } = weeklyDrift(x);
  const judged = judgeVersion({ diff, adf, kpss, acf24, acf168, meanDrift, varianceRatio });
  return {
    diff,
    label: differencingLabel(diff),
    hours: n,
    adf,
    kpss,
    acf: correlogram(rho.subarray(1), band),
    pacf: correlogram(pacfFromAcf(rho, lag), band),
    acf24,
    acf168,
    meanDrift,
    varianceRatio,
    ...judged,
  };
}

export function analyseStationarity(input: StationarityInput): StationarityOutput {
  const y = input.values;
  const day = rollingStats(y, 24);
  const week = rollingStats(y, 168);
  const checks = [checkVersion(y, [], input.maxLag), ...STATIONARITY_CANDIDATES.map((d) => checkVersion(y, d, input.maxLag))];
  return {
    rolling: {
      day: { mean: toWire(day.mean, 2), variance: toWire(day.variance, 2) },
      week: { mean: toWire(week.mean, 2), variance: toWire(week.variance, 2) },
    },
    checks,
    verdict: overallVerdict(checks),
  };
}
