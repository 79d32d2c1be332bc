import type { AccuracyDayDto, AccuracyHourDto, AccuracyScore } from '@morrowline/shared';
import { adjustmentVerdict } from '@morrowline/shared';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { biasWords, dailyMapeData, dayStatus, defaultRange, hourlyData, rangeProblem, signedMw, summaryRows } from './accuracy-data';

const score = (mape: number | null, extra: Partial<AccuracyScore> = {}): AccuracyScore => ({ hours: 24, mape, mae: 10, bias: 5, peakErrorMw: -3, peakErrorPct: -1.5, ...extra });
const day = (operatingDay: string, over: Partial<AccuracyDayDto> = {}): AccuracyDayDto => ({
  operatingDay,
  hours: 24,
  actualHours: 24,
  actuals: 'complete',
  model: { id: 1, at: '', revision: null, replayed: false, score: score(4), peakHourEnding: 'HE18' },
  schedule: { id: 2, at: '', revision: 1, replayed: false, score: score(3), peakHourEnding: 'HE18' },
  adjustmentEffect: -1,
  ...over,
});
const hour = (hourEnding: string, mae: number, bias: number): AccuracyHourDto => ({ hourEnding, days: 1, model: score(1, { mae, bias }), schedule: score(1, { mae: mae / 2, bias: -bias }) });

describe('accuracy data shaping', () => {
  it('defaults to the 14 days before today in the zone and checks ranges', () => {
    expect(defaultRange('America/Denver', DateTime.fromISO('2026-03-20T03:00:00Z'))).toEqual(['2026-03-05', '2026-03-18']);
    expect(rangeProblem(['2026-03-05', null])).toMatch(/first and last/);
    expect(rangeProblem(['2026-03-05', '2026-03-04'])).toMatch(/must not be after/);
    expect(rangeProblem(['2026-01-01', '2026-06-30'])).toMatch(/at most 92 days \(this range has 181\)/);
    expect(rangeProblem(['2026-03-01', '2026-03-01'])).toBeNull();
  });

  it('keeps unscored days as gaps in the daily chart, never zero', () => {
    const data = dailyMapeData([day('2026-03-01'), day('2026-03-02', { actuals: 'none', actualHours: 0, model: null, schedule: null, adjustmentEffect: null })]);
    expect(data).toEqual([[0, 1], [4, null], [3, null]]);
  });

  it('lays hours ending out HE01..HE24 with HE25 apart', () => {
    const { data, he25 } = hourlyData([hour('HE01', 8, 2), hour('HE03', 6, -1), hour('HE25', 9, 4)], 'bias');
    expect(data[0]).toHaveLength(24);
    expect(data[1].slice(0, 3)).toEqual([2, null, -1]);
    expect(data[2][0]).toBe(-2);
    expect(he25?.model.bias).toBe(4);
    expect(hourlyData([hour('HE01', 8, 2)], 'mae').data[2][0]).toBe(4);
  });

  it('says why a day is not scored, and names short and long days', () => {
    expect(dayStatus(day('d', { actuals: 'none' }))).toBe('no actuals');
    expect(dayStatus(day('d', { actuals: 'in-progress' }))).toBe('day still running');
    expect(dayStatus(day('d', { model: null, schedule: null }))).toBe('no model forecast · no published schedule');
    expect(dayStatus(day('d', { hours: 23, actualHours: 22, actuals: 'gaps' }))).toBe('1 of 23 hours missing · 23-hour day');
    expect(dayStatus(day('d'))).toBe('scored');
  });

  it('signs bias and peak error and says which way the forecast leaned', () => {
    expect(signedMw(12.34)).toBe('+12.3 MW');
    expect(signedMw(-4)).toBe('−4.0 MW');
    expect(signedMw(-0.01)).toBe('0.0 MW');
    expect(signedMw(null)).toBe('—');
    expect(biasWords(3)).toBe('over-forecast');
    expect(biasWords(-3)).toBe('under-forecast');
    const rows = summaryRows(score(4.5), score(null, { hours: 0, mae: null, bias: null, peakErrorMw: null, peakErrorPct: null }));
    expect(rows.map((r) => [r.label, r.model, r.schedule])).toEqual([
      ['MAPE', '4.50 %', '—'],
      ['MAE', '10.0 MW', '—'],
      ['Bias (forecast − actual)', '+5.0 MW (over-forecast)', '—'],
      ['Peak-hour error, mean of days', '−3.0 MW (−1.5 %)', '—'],
      ['Hours scored', '24', '0'],
    ]);
  });

  it('puts whether the adjustments helped in a plain sentence', () => {
    expect(adjustmentVerdict({ days: 3, difference: -1.25, daysHelped: 2 })).toBe("The adjustments helped: over 3 days, the published schedule's MAPE was 1.25 points lower than the model forecast's (better on 2 of them).");
    expect(adjustmentVerdict({ days: 1, difference: 0.5, daysHelped: 0 })).toMatch(/^The adjustments did not help: over 1 day,/);
    expect(adjustmentVerdict({ days: 0, difference: null, daysHelped: 0 })).toMatch(/nothing to compare/);
  });
});
