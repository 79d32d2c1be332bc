/**
 * The stationarity verdict in plain words. Pure functions of numbers already computed (ADF,
 * KPSS, ACF at the daily and weekly lags, weekly mean and variance), so the wording can be
 * tested alone. The rules:
 *  - unit root: ADF with a constant does not reject at 5 % (Dickey & Fuller 1979);
 *  - mean: KPSS (level) rejects a stable level at 5 % (Kwiatkowski et al. 1992), or, for the
 *    series as recorded, the weekly averages range over more than 10 % of the overall level;
 *  - variance: the largest variance of a whole week is more than 3 times the smallest (three
 *    rather than two, because the variance of 168 correlated hours is itself noisy);
 *  - daily pattern: ACF at lag 24 above 0.3;
 *  - weekly pattern: ACF at lag 168 above 0.3 and at least 0.1 above the ACF at lag 24 (a
 *    purely daily cycle also repeats every 168 hours; only the excess is weekly).
 * A clearly negative ACF at the lag a differencing removed (below −0.4) is the usual sign of a
 * seasonal moving-average term, not of a pattern left over; it is mentioned, not counted.
 */
import type { AdfOutcome, KpssOutcome, NonConstancy, SeriesCheckDto, StationarityVerdictDto } from '@morrowline/shared';

export const PATTERN_ACF = 0.3;
export const WEEKLY_EXCESS = 0.1;
export const MEAN_DRIFT = 0.1;
export const VARIANCE_RATIO = 3;
export const NEGATIVE_ECHO = -0.4;

export interface VersionStats {
  diff: number[];
  adf: AdfOutcome[];
  kpss: KpssOutcome;
  acf24: number | null;
  acf168: number | null;
  meanDrift: number | null;
  varianceRatio: number | null;
}

export interface VersionJudgement {
  problems: NonConstancy[];
  testsAgreeStationary: boolean;
  sentences: string[];
  summary: string;
}

const fmt = (v: number | null, digits = 2) => (v === null || !Number.isFinite(v) ? 'n/a' : v.toFixed(digits));
const fmtP = (p: number | null) => (p === null || !Number.isFinite(p) ? 'n/a' : p < 0.001 ? '< 0.001' : p.toFixed(3));
const finite = (v: number | null): v is number => v !== null && Number.isFinite(v);

/** "(1−B^24)(1−B^168)", or "as recorded" for no differencing. */
export function differencingLabel(diff: readonly number[]): string {
  if (diff.length === 0) return 'as recorded';
  return diff.map((s) => (s === 1 ? '(1−B)' : `(1−B^${s})`)).join('');
}

export function adfReading(a: Pick<AdfOutcome, 'regression' | 'pValue' | 'rejectsUnitRoot'>): string {
  const what = a.regression === 'ct' ? 'around a level or a straight-line trend' : 'around a fixed level';
  if (!finite(a.pValue)) return 'The ADF test could not be computed on this series.';
  return a.rejectsUnitRoot
    ? `ADF: the series keeps returning ${what} rather than wandering off (unit root rejected, p ${fmtP(a.pValue)}).`
    : `ADF: the series may wander without returning ${what} (a unit root cannot be ruled out, p ${fmtP(a.pValue)}).`;
}

export function kpssReading(k: Pick<KpssOutcome, 'statistic' | 'pValue' | 'criticalValue5' | 'rejectsStableLevel'>): string {
  if (!finite(k.statistic)) return 'The KPSS test could not be computed on this series.';
  return k.rejectsStableLevel
    ? `KPSS: the level does not stay put (statistic ${fmt(k.statistic)} above the 5 % value ${k.criticalValue5}).`
    : `KPSS: nothing speaks against a stable level (statistic ${fmt(k.statistic)} below the 5 % value ${k.criticalValue5}).`;
}

/** What is not constant in one version of the series, and the sentences that say so. */
export function judgeVersion(s: VersionStats): VersionJudgement {
  const problems: NonConstancy[] = [];
  const sentences: string[] = [];
  const raw = s.diff.length === 0;
  const adfC = s.adf.find((a) => a.regression === 'c') ?? s.adf[0];
  if (adfC && finite(adfC.pValue) && !adfC.rejectsUnitRoot) {
    problems.push('unit-root');
    sentences.push(`It wanders without a fixed level to return to: the ADF test cannot rule out a unit root (p ${fmtP(adfC.pValue)}).`);
  }
  const driftTooBig = raw && finite(s.meanDrift) && s.meanDrift > MEAN_DRIFT;
  if (s.kpss.rejectsStableLevel || driftTooBig) {
    problems.push('mean');
    const parts: string[] = [];
    if (driftTooBig) parts.push(`the weekly averages range over ${(100 * (s.meanDrift as number)).toFixed(0)} % of the overall level`);
    if (s.kpss.rejectsStableLevel) parts.push(`the KPSS test rejects a stable level (statistic ${fmt(s.kpss.statistic)})`);
    sentences.push(`The average level is not constant: ${parts.join('; ')}.`);
  }
  if (finite(s.varianceRatio) && s.varianceRatio > VARIANCE_RATIO) {
    problems.push('variance');
    sentences.push(`The spread changes from week to week: the most variable week varies ${fmt(s.varianceRatio, 1)} times as much as the calmest.`);
  }
  if (finite(s.acf24) && s.acf24 > PATTERN_ACF) {
    problems.push('daily');
    sentences.push(`A daily pattern: each hour resembles the same hour the day before (ACF at 24 h = ${fmt(s.acf24)}).`);
  }
  if (finite(s.acf168) && s.acf168 > PATTERN_ACF && s.acf168 - (finite(s.acf24) ? s.acf24 : 0) >= WEEKLY_EXCESS) {
    problems.push('weekly');
    sentences.push(
      `A weekly pattern: each hour resembles the same hour a week before more than the day before (ACF at 168 h = ${fmt(s.acf168)}, at 24 h = ${fmt(s.acf24)}).`,
    );
  }
  for (const lag of s.diff) {
    const r = lag === 24 ? s.acf24 : lag === 168 ? s.acf168 : null;
    if (finite(r) && r < NEGATIVE_ECHO) {
      sentences.push(
        `The differencing leaves a negative echo at ${lag} h (ACF ${fmt(r)}): normal after removing a pattern, and handled by a moving-average term in the model.`,
      );
    }
  }
  const testsAgreeStationary = !!adfC && adfC.rejectsUnitRoot && !s.kpss.rejectsStableLevel;
  let summary: string;
  if (problems.length === 0) {
    summary = raw
      ? 'As recorded, the load already looks stationary: no differencing needed.'
      : `After ${differencingLabel(s.diff)} nothing is left to remove: ADF and KPSS agree the result is stationary and no daily or weekly pattern remains, so no further differencing is needed.`;
  } else {
    const name = raw ? 'As recorded' : `After ${differencingLabel(s.diff)}`;
    summary = `${name}, not stationary: ${describeProblems(problems)}.`;
  }
  return { problems, testsAgreeStationary, sentences, summary };
}

const PROBLEM_WORDS: Record<NonConstancy, string> = {
  'unit-root': 'it wanders without a fixed level',
  mean: 'the average level moves',
  variance: 'the spread changes',
  daily: 'a daily pattern',
  weekly: 'a weekly pattern',
};

/** "a daily pattern and a weekly pattern" */
export function describeProblems(problems: readonly NonConstancy[]): string {
  const words = problems.map((p) => PROBLEM_WORDS[p]);
  if (words.length <= 1) return words[0] ?? 'nothing';
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/**
 * The headline over all versions: what is not constant as recorded, and the simplest candidate
 * differencing (fewest factors, then the shorter lag) after which nothing is left to remove.
 */
export function overallVerdict(checks: readonly Pick<SeriesCheckDto, 'diff' | 'problems'>[]): StationarityVerdictDto {
  const raw = checks.find((c) => c.diff.length === 0);
  const problems = raw ? [...raw.problems] : [];
  if (raw && problems.length === 0) {
    return { headline: 'The load already looks stationary as recorded: its level, spread and correlations stay the same over the history, so no differencing is needed.', problems, recommended: [], recommendedLabel: differencingLabel([]) };
  }
  const clean = checks
    .filter((c) => c.diff.length > 0 && c.problems.length === 0)
    .sort((a, b) => a.diff.length - b.diff.length || a.diff.reduce((s, x) => s + x, 0) - b.diff.reduce((s, x) => s + x, 0));
  const best = clean[0];
  const start = `As recorded, the load is not stationary: ${describeProblems(problems)}.`;
  if (!best) {
    return {
      headline: `${start} None of the candidate differencings removes all of it; the backtest decides which to use, and the model needs a careful look.`,
      problems,
      recommended: null,
      recommendedLabel: null,
    };
  }
  const label = differencingLabel(best.diff);
  return {
    headline: `${start} ${label} removes it: afterwards ADF and KPSS agree the series is stationary and no daily or weekly pattern is left, so nothing more needs removing.`,
    problems,
    recommended: [...best.diff],
    recommendedLabel: label,
  };
}

const sameLags = (a: readonly number[], b: readonly number[]) => a.length === b.length && a.every((v, i) => v === b[i]);

/**
 * The verdict with the differencing the zone's model in service uses as the suggestion: the refit
 * chooses the differencing by the day-ahead error of each candidate (a rolling-origin test,
 * Tashman 2000), which is what the forecasts depend on, so the workbench marks that one and says
 * where the stationarity tests alone would have stopped. Without a model the tests' pick stands.
 */
export function withModelInUse(verdict: StationarityVerdictDto, inUse: { versionId: number; diff: number[] } | null): StationarityVerdictDto {
  const testsPick = verdict.recommended;
  if (!inUse) return { ...verdict, recommendedBy: 'tests', inUse: null, testsPick };
  const label = differencingLabel(inUse.diff);
  const agree = testsPick !== null && sameLags(testsPick, inUse.diff);
  const tests = agree
    ? 'the stationarity tests agree.'
    : testsPick === null
      ? 'the stationarity tests alone find no candidate that removes everything.'
      : `the stationarity tests alone would call ${differencingLabel(testsPick)} enough, but the refit goes by the forecast error, not by the tests.`;
  return {
    ...verdict,
    headline: `${verdict.headline} The model in service (version ${inUse.versionId}) uses ${label}, chosen by its day-ahead error over the last days; ${tests}`,
    recommended: [...inUse.diff],
    recommendedLabel: label,
    recommendedBy: 'model',
    inUse: { versionId: inUse.versionId, diff: [...inUse.diff], label },
    testsPick,
  };
}

/** Plain words on the residual checks of a fitted model (Ljung–Box at 24 and 48 h). */
export function residualVerdict(ljungBox: readonly { lag: number; pValue: number }[]): { text: string; white: boolean } {
  const bad = ljungBox.filter((l) => Number.isFinite(l.pValue) && l.pValue < 0.05);
  if (ljungBox.length === 0) return { text: 'The residual checks could not be computed.', white: false };
  if (bad.length === 0) {
    return { text: `What the model leaves over looks like random noise: the Ljung–Box test finds no correlation up to ${Math.max(...ljungBox.map((l) => l.lag))} hours (p ${ljungBox.map((l) => fmtP(l.pValue)).join(', ')}).`, white: true };
  }
  const worst = bad.reduce((a, b) => (b.pValue < a.pValue ? b : a));
  return {
    text: `What the model leaves over is still correlated: the Ljung–Box test at ${worst.lag} hours rejects random noise (p ${fmtP(worst.pValue)}). The forecast may miss a pattern; its bands may be too narrow.`,
    white: false,
  };
}
