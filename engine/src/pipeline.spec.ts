/**
 * The automatic pipeline and the backtest. Data: the real demand fixture (fixtures/taylor-hourly.json,
 * R package forecast's `taylor`, England & Wales, hourly means) and simulated load with
 * stochastic daily and weekly patterns.
 */
import taylor from './fixtures/taylor-hourly.json';
import rAutoArima from './fixtures/r-auto-arima-backtest.json';
import { runPipeline } from './pipeline';
import { backtest } from './backtest';
import { seasonalNaive } from './seasonal-naive';

const load = taylor.load as number[];
const eight = load.slice(load.length - 8 * 168 - 24, load.length - 24);

describe('automatic pipeline', () => {
  it('chooses a model on eight weeks, forecasts 40 hours, never NaN or negative', () => {
    const r = runPipeline({ history: eight, horizon: 40 });
    expect(r.forecast.mean).toHaveLength(40);
    for (const k of ['mean', 'lower80', 'upper80', 'lower95', 'upper95'] as const) {
      expect(r.forecast[k].every((v) => Number.isFinite(v) && v >= 0)).toBe(true);
    }
    expect(r.candidates.map((c) => c.label)).toEqual(['(1−B^24)', '(1−B^168)', '(1−B^24)(1−B^168)', '(1−B)(1−B^168)']);
    expect(r.model).toBeDefined();
    expect(r.model!.ljungBox.map((l) => l.lag)).toEqual([24, 48]);
    for (let i = 0; i < 40; i++) {
      expect(r.forecast.lower95[i]).toBeLessThanOrEqual(r.forecast.lower80[i]);
      expect(r.forecast.upper80[i]).toBeLessThanOrEqual(r.forecast.upper95[i]);
    }
    // four weeks of day-ahead errors calibrate the bands; on this series the replay over them finds
    // the model's own 95 % band covering about 96 % (not above 97 %), so it stays the floor
    expect(r.selectionDays).toBe(28);
    expect(r.bandScale.hours).toBe(28 * 24);
    expect(r.bandScale.k95).toBeGreaterThanOrEqual(1);
    const z95 = (r.forecast.upper95[0] - r.forecast.mean[0]) / r.forecast.se[0];
    expect(z95).toBeCloseTo(1.959963985 * r.bandScale.k95, 6); // qnorm(.975) in R
  });

  it('an outage in the last week does not come back through the weekly lag', () => {
    const hist = eight.slice();
    const n = hist.length;
    const excluded: number[] = [];
    // a 6-hour outage one week before the hours being forecast
    for (let i = n - 168; i < n - 162; i++) {
      hist[i] = 0.2 * hist[i];
      excluded.push(i);
    }
    const withExcl = runPipeline({ history: hist, horizon: 24, excluded, options: { fixed: { diff: [168], p: 2, q: 1 } } });
    const naiveRaw = seasonalNaive(hist, 24).mean;
    for (let j = 0; j < 6; j++) {
      expect(naiveRaw[j]).toBeLessThan(0.3 * eight[n - 168 + j]); // the dip would leak into naive
      expect(withExcl.forecast.mean[j]).toBeGreaterThan(0.8 * eight[n - 168 + j]);
    }
    expect(withExcl.model!.filledHours).toBe(6);
  });

  it('falls back to seasonal naive with a reason when history is too short', () => {
    const r = runPipeline({ history: load.slice(0, 200), horizon: 24 });
    expect(r.method).toBe('seasonal-naive');
    expect(r.fallbackReason).toMatch(/hours of usable history/);
    expect(r.forecast.mean).toEqual(load.slice(200 - 168, 200 - 144));
  });

  it('all-missing history still gives finite, non-negative numbers', () => {
    const r = runPipeline({ history: new Array(2000).fill(NaN), horizon: 24 });
    expect(r.method).toBe('seasonal-naive');
    expect(r.forecast.mean.every((v) => v === 0)).toBe(true);
  });
});

describe('backtest', () => {
  it('seasonal naive scored against itself as baseline gives zero improvement', () => {
    const r = backtest(load, { days: 5, method: 'seasonal-naive' });
    expect(r.days).toHaveLength(5);
    expect(r.mape).toBeCloseTo(r.baseline.mape, 12);
    expect(r.improvement).toBeCloseTo(0, 12);
  });
  it('a fixed model on the real demand data beats weekly seasonal naive by 15 % or more', () => {
    const r = backtest(load, { days: 14, method: { diff: [24, 168], p: 1, q: 1 } });
    expect(r.days).toHaveLength(14);
    expect(r.improvement).toBeGreaterThan(0.15);
    expect(r.coverage95).toBeGreaterThan(0.8);
    expect(r.days.every((d) => d.hours === 24 && d.forecast.mean.length === 24)).toBe(true);
  });
  it('chooses among the best three orders by AICc the one that forecast the test days best', () => {
    // On (1−B)(1−B^168) of the demand series AICc ranks first ARMA(3,1)×(1,1)_24, whose AR root
    // near 1 is nearly cancelled by its MA root (the weekly-differenced model in disguise); over
    // the four test weeks ARMA(3,0)×(1,1)_24, 49 AICc behind it, forecast the day ahead better
    // (measured 0.947 % against 0.982 %)
    const run = (dayAheadChoice: number) => runPipeline({ history: eight, horizon: 24, options: { computeSe: false, candidates: [[1, 168]], dayAheadChoice } }).candidates[0];
    const byCriterion = run(1);
    const byDayAhead = run(3);
    expect([byCriterion.p, byCriterion.q, byCriterion.P, byCriterion.Q]).toEqual([3, 1, 1, 1]);
    expect([byDayAhead.p, byDayAhead.q, byDayAhead.P, byDayAhead.Q]).toEqual([3, 0, 1, 1]);
    expect(byDayAhead.aicc).toBeGreaterThan(byCriterion.aicc);
    expect(byDayAhead.mape).toBeLessThan(byCriterion.mape);
  });
  it('calibrated bands on the real demand series: 80 % and 95 % cover what they claim over the last four weeks', () => {
    // rolling day-ahead, issued at midnight from 8 weeks; measured 78.7 % and 94.0 % over 28 days
    // (7 days: 70.8 % and 92.9 %, 14 days: 72.0 % and 92.6 %: README "Bands")
    const r = backtest(load, { days: 28 });
    expect(r.days).toHaveLength(28);
    expect(r.coverage80).toBeGreaterThanOrEqual(0.77);
    expect(r.coverage80).toBeLessThanOrEqual(0.83);
    expect(r.coverage95).toBeGreaterThanOrEqual(0.93);
    expect(r.coverage95).toBeLessThanOrEqual(0.97);
    // the 95 % band over the last one and two weeks of the same backtest: one and two hours short
    // of 93 % since (1−B)(1−B^168) is chosen (README, "Bands", not met); held at 92 % here so that
    // a change that widens the miss fails
    for (const n of [7, 14]) {
      const last = r.days.slice(-n);
      const hours = last.reduce((s, d) => s + d.accuracy.n, 0);
      const inside95 = last.reduce((s, d) => s + d.accuracy.coverage95 * d.accuracy.n, 0) / hours;
      expect(inside95).toBeGreaterThanOrEqual(0.92);
      expect(inside95).toBeLessThanOrEqual(0.97);
    }
    // the double differencing (1−B^24)(1−B^168), which these four weeks reject, is never chosen;
    // the weekly difference with a first difference, what R's auto.arima also takes on these weeks
    // (d = 1 on the weekly-differenced series at every origin: fixtures/r-auto-arima-backtest.json)
    expect(r.days.every((d) => d.choice?.diff.join() === '1,168')).toBe(true);
    // and its MAPE below R's auto.arima over the same 7, 14 and 28 days (1.275 %, 1.203 %,
    // 1.008 %, that file; measured 1.204 %, 1.105 %, 0.957 %)
    const mape = (n: number) => r.days.slice(-n).reduce((s, d) => s + d.accuracy.mape, 0) / n;
    for (const w of rAutoArima.windows) expect(mape(w.days)).toBeLessThan(w.mape);
  });
  it('issue hour 9 the day before gives horizons 16..39', () => {
    const r = backtest(load, { days: 2, method: 'seasonal-naive', issueHour: 9 });
    const d = r.days[1];
    expect(d.dayStart - d.origin).toBe(15);
  });
  it('takes an issue time per day: the same days as issue hour 9 when they say 09:00, their own where they differ', () => {
    const starts = Array.from({ length: Math.floor(load.length / 24) + 1 }, (_, i) => i * 24);
    const at9 = backtest(load, { days: 3, method: 'seasonal-naive', issueHour: 9 });
    const given = backtest(load, { days: 3, method: 'seasonal-naive', dayStarts: starts, origins: starts.map((s) => s - 15) });
    expect(given.days.map((d) => d.origin)).toEqual(at9.days.map((d) => d.origin));
    expect(given.days.map((d) => d.accuracy.mape)).toEqual(at9.days.map((d) => d.accuracy.mape));
    // a gate closure an hour later on one day (a clock change the night before): that day only moves
    const moved = starts.map((s, i) => s - 15 + (i === starts.length - 2 ? 1 : 0));
    const r = backtest(load, { days: 3, method: 'seasonal-naive', dayStarts: starts, origins: moved });
    expect(r.days.map((d) => d.dayStart - d.origin)).toEqual([15, 15, 14]);
    // an issue time after the day has begun is held at its start
    const late = backtest(load, { days: 1, method: 'seasonal-naive', dayStarts: starts, origins: starts.map((s) => s + 5) });
    expect(late.days[0].origin).toBe(late.days[0].dayStart);
    expect(() => backtest(load, { days: 1, dayStarts: starts, origins: [0] })).toThrow(/1 issue times for \d+ day starts/);
  });
});
