import type { AdfOutcome, KpssOutcome } from '@morrowline/shared';
import { describeProblems, differencingLabel, judgeVersion, overallVerdict, residualVerdict, withModelInUse, type VersionStats } from './verdict';

const adf = (pValue: number): AdfOutcome[] => [
  { regression: 'c', statistic: -3, pValue, lags: 4, criticalValue5: -2.86, rejectsUnitRoot: pValue < 0.05, reading: '' },
  { regression: 'ct', statistic: -3.5, pValue, lags: 4, criticalValue5: -3.41, rejectsUnitRoot: pValue < 0.05, reading: '' },
];
const kpss = (statistic: number): KpssOutcome => ({ statistic, pValue: statistic > 0.463 ? 0.02 : 0.1, lags: 8, criticalValue5: 0.463, rejectsStableLevel: statistic > 0.463, reading: '' });
const stats = (over: Partial<VersionStats>): VersionStats => ({ diff: [], adf: adf(0.01), kpss: kpss(0.1), acf24: 0.05, acf168: 0.02, meanDrift: 0.02, varianceRatio: 1.4, ...over });

describe('stationarity verdict wording', () => {
  it('finds nothing wrong with a flat, uncorrelated series', () => {
    const j = judgeVersion(stats({}));
    expect(j.problems).toEqual([]);
    expect(j.testsAgreeStationary).toBe(true);
    expect(j.summary).toBe('As recorded, the load already looks stationary: no differencing needed.');
  });

  it('names a daily pattern from the ACF at 24 h, and a weekly one only for the excess at 168 h', () => {
    const dailyOnly = judgeVersion(stats({ acf24: 0.8, acf168: 0.82 }));
    expect(dailyOnly.problems).toEqual(['daily']);
    expect(dailyOnly.sentences[0]).toBe('A daily pattern: each hour resembles the same hour the day before (ACF at 24 h = 0.80).');
    const both = judgeVersion(stats({ acf24: 0.6, acf168: 0.9 }));
    expect(both.problems).toEqual(['daily', 'weekly']);
    expect(both.summary).toBe('As recorded, not stationary: a daily pattern and a weekly pattern.');
  });

  it('names a wandering level from ADF and a moving mean from KPSS or the weekly averages', () => {
    expect(judgeVersion(stats({ adf: adf(0.4) })).problems).toEqual(['unit-root']);
    expect(judgeVersion(stats({ kpss: kpss(1.2) })).sentences[0]).toMatch(/^The average level is not constant: the KPSS test rejects a stable level \(statistic 1.20\)/);
    expect(judgeVersion(stats({ meanDrift: 0.25 })).sentences[0]).toMatch(/weekly averages range over 25 % of the overall level/);
    // after differencing the level is near zero: the relative drift says nothing there
    expect(judgeVersion(stats({ diff: [168], meanDrift: 3 })).problems).toEqual([]);
  });

  it('names a changing spread only beyond three times', () => {
    expect(judgeVersion(stats({ varianceRatio: 2.9 })).problems).toEqual([]);
    expect(judgeVersion(stats({ varianceRatio: 4.2 })).sentences[0]).toBe('The spread changes from week to week: the most variable week varies 4.2 times as much as the calmest.');
  });

  it('tells a negative echo after differencing apart from a pattern left over', () => {
    const j = judgeVersion(stats({ diff: [168], acf168: -0.48 }));
    expect(j.problems).toEqual([]);
    expect(j.sentences[0]).toMatch(/negative echo at 168 h \(ACF -0.48\)/);
    expect(j.summary).toBe(
      'After (1−B^168) nothing is left to remove: ADF and KPSS agree the result is stationary and no daily or weekly pattern remains, so no further differencing is needed.',
    );
  });

  it('recommends the simplest differencing that leaves nothing to remove', () => {
    const v = overallVerdict([
      { diff: [], problems: ['daily', 'weekly'] },
      { diff: [24], problems: ['weekly'] },
      { diff: [168], problems: [] },
      { diff: [24, 168], problems: [] },
    ]);
    expect(v.recommended).toEqual([168]);
    expect(v.headline).toMatch(/^As recorded, the load is not stationary: a daily pattern and a weekly pattern\. \(1−B\^168\) removes it/);
    expect(overallVerdict([{ diff: [], problems: ['daily'] }, { diff: [24], problems: [] }, { diff: [168], problems: [] }]).recommended).toEqual([24]);
  });

  it('says so when no candidate removes everything, and when nothing needs removing', () => {
    const none = overallVerdict([{ diff: [], problems: ['variance'] }, { diff: [24], problems: ['variance'] }]);
    expect(none.recommended).toBeNull();
    expect(none.headline).toMatch(/None of the candidate differencings removes all of it/);
    expect(overallVerdict([{ diff: [], problems: [] }]).recommended).toEqual([]);
  });

  it('lists problems in plain words', () => {
    expect(describeProblems(['mean'])).toBe('the average level moves');
    expect(describeProblems(['unit-root', 'variance', 'daily'])).toBe('it wanders without a fixed level, the spread changes and a daily pattern');
    expect(differencingLabel([24, 168])).toBe('(1−B^24)(1−B^168)');
    expect(differencingLabel([])).toBe('as recorded');
  });

  it('reads the Ljung–Box results of the residuals', () => {
    expect(residualVerdict([{ lag: 24, pValue: 0.4 }, { lag: 48, pValue: 0.2 }])).toEqual({ white: true, text: expect.stringMatching(/looks like random noise.*up to 48 hours \(p 0.400, 0.200\)/) });
    const bad = residualVerdict([{ lag: 24, pValue: 0.03 }, { lag: 48, pValue: 0.0001 }]);
    expect(bad.white).toBe(false);
    expect(bad.text).toMatch(/at 48 hours rejects random noise \(p < 0.001\)/);
  });
});

describe('the suggested differencing is the one the model in service uses', () => {
  const tests = overallVerdict([{ diff: [], problems: ['daily', 'weekly'] }, { diff: [24], problems: ['weekly'] }, { diff: [168], problems: ['variance'] }, { diff: [24, 168], problems: [] }]);

  it('marks the model\'s (1−B^168) even where the tests alone pick (1−B^24)(1−B^168), and says so', () => {
    expect(tests.recommended).toEqual([24, 168]);
    const v = withModelInUse(tests, { versionId: 41, diff: [168] });
    expect(v).toMatchObject({ recommended: [168], recommendedLabel: '(1−B^168)', recommendedBy: 'model', inUse: { versionId: 41, diff: [168], label: '(1−B^168)' }, testsPick: [24, 168] });
    expect(v.headline).toMatch(/The model in service \(version 41\) uses \(1−B\^168\), chosen by its day-ahead error over the last days; the stationarity tests alone would call \(1−B\^24\)\(1−B\^168\) enough/);
  });

  it('keeps the tests\' pick when the zone has no model in service', () => {
    expect(withModelInUse(tests, null)).toMatchObject({ recommended: [24, 168], recommendedBy: 'tests', inUse: null, testsPick: [24, 168] });
  });
});
