/**
 * A second real demand series, held out from the engine's tuning: Victoria's operational demand
 * in 2014 (fixtures/vic-elec-hourly.R: `vic_elec` of the R package tsibbledata, Australian Energy
 * Market Operator, hourly means, four 12-week windows ending on the last Sunday of each quarter).
 * Its summer has heatwaves and holidays the open England & Wales series (taylor) does not.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseLoadCsv } from './cli/csv-series';
import { fitArma } from './arma/fit';
import { difference } from './differencing';
import { runPipeline } from './pipeline';
import { backtest } from './backtest';

const QUARTERS = [1, 2, 3, 4];
const read = (q: number) => parseLoadCsv(readFileSync(join(__dirname, 'fixtures', `vic-elec-2014q${q}.csv`), 'utf8'));

describe('the Victoria 2014 fixtures', () => {
  it.each(QUARTERS)('quarter %i: 2,016 complete hours, 84 operating days at +10:00 from a Monday', (q) => {
    const s = read(q);
    expect(s.values.length).toBe(2016);
    expect(s.missing).toBe(0);
    expect(s.dayStarts.slice(0, 84)).toEqual(Array.from({ length: 84 }, (_, d) => 24 * d));
    expect(Array.from(s.offsets).every((o) => o === 600)).toBe(true);
    // local midnight +10:00 is 14:00 UTC the day before; the windows start on a Monday
    expect(new Date(s.startMs + 10 * 3_600_000).getUTCDay()).toBe(1);
    // operational demand of the state, MW: between about 3 and 11 GW (AEMO's published range for
    // Victoria, from memory)
    expect(Math.min(...s.values)).toBeGreaterThan(2500);
    expect(Math.max(...s.values)).toBeLessThan(11000);
  });
});

describe('choosing the model on recent evidence (Victoria, summer 2014)', () => {
  // The first origin of the summer quarter's 28-day backtest: Monday 3 March 2014, midnight, from
  // the eight weeks before it (6 January – 2 March, with the heatwaves of mid-January and early
  // February). Over those four weeks of evidence the daily-differenced model has the lowest plain
  // mean MAPE (9.6 % against 10.7–13.9 % for the others and 11.9 % for the same hour last week),
  // won on the hot days, while it forecasts every Monday from the Sunday before it.
  const s = read(1);
  const origin = 8 * 168;
  const history = Array.from(s.values.subarray(0, origin));
  const monday = Array.from(s.values.subarray(origin, origin + 24));
  const mapeOf = (mean: number[]) => (100 / 24) * monday.reduce((a, v, i) => a + Math.abs(mean[i] - v) / v, 0);

  it('ranked by the plain mean, the daily-differenced model is chosen and misses the Monday by more than 15 %', () => {
    const r = runPipeline({ history, horizon: 24, options: { computeSe: false, rankBy: 'equal' } });
    expect(r.model?.diff).toEqual([24]);
    expect(mapeOf(r.forecast.mean)).toBeGreaterThan(15); // measured 18.7 %
  });

  it('ranked with recent days weighted more, a model with the weekly difference is chosen and forecasts the Monday within 5 %', () => {
    const r = runPipeline({ history, horizon: 24, options: { computeSe: false } });
    expect(r.model?.diff).toContain(168);
    const daily = r.candidates.find((c) => c.diff.join() === '24')!;
    const chosen = r.candidates.find((c) => c.diff.join() === r.model!.diff.join())!;
    // the plain mean still favours the daily difference; the weighted one does not
    expect(daily.mape).toBeLessThan(chosen.mape);
    expect(chosen.recentMape).toBeLessThan(daily.recentMape);
    expect(mapeOf(r.forecast.mean)).toBeLessThan(5);
  });
});

describe('an AR(1) near a unit root (Victoria, summer 2014)', () => {
  // Each differencing of the summer quarter leaves a lag-one autocorrelation near 0.98. R 4.2.2's
  // arima on the same differenced series, no mean (`npm run bench -- --input
  // engine/src/fixtures/vic-elec-2014q1.csv`, 5 December 2026): log-likelihoods −12805.971,
  // −12063.602 and −12118.424 ("CSS-ML" and "ML" agree to 0.001).
  const y = read(1).values;
  it.each([
    [[24], -12805.971],
    [[168], -12063.602],
    [[24, 168], -12118.424],
  ])('differenced by %j: R’s maximum in a few dozen evaluations, not a crawl', (diff, rLoglik) => {
    const f = fitArma(difference(y, diff), { p: 1, q: 0 }, { computeSe: false });
    expect(f.loglik).toBeGreaterThan(rLoglik - 0.001);
    expect(f.ar[0]).toBeGreaterThan(0.97);
    // the search took 112–120 evaluations before the one-coefficient step growth (arma/bfgs.ts), 20–21 after
    expect(f.evaluations).toBeLessThan(40);
  });
});

describe('rolling day-ahead backtests against R’s auto.arima (Victoria 2014)', () => {
  // R's side: fixtures/r-auto-arima-backtest.R on each quarter's file (forecast::auto.arima on the
  // (1−B¹⁶⁸)-differenced 8 weeks before each of the last 28 days, issued at the day's midnight),
  // written to fixtures/r-auto-arima-vic-elec-2014qN.json; not for the second quarter, where
  // auto.arima took 4–17 minutes an origin and the run was stopped.
  const rOf = (q: number) => JSON.parse(readFileSync(join(__dirname, 'fixtures', `r-auto-arima-vic-elec-2014q${q}.json`), 'utf8')) as { windows: Array<{ days: number; mape: number }> };
  const mapes = (q: number) => {
    const r = backtest(read(q).values, { days: 28 });
    expect(r.days).toHaveLength(28);
    return (n: number) => r.days.slice(-n).reduce((s, d) => s + d.accuracy.mape, 0) / n;
  };

  // summer (measured 2.500 / 3.771 / 4.879 % against 2.792 / 5.048 / 5.504 %) and spring (4.291 /
  // 3.559 / 3.300 % against 4.381 / 3.951 / 3.539 %)
  it.each([1, 3])('quarter %i: the pipeline’s MAPE over the last 7, 14 and 28 days below auto.arima’s', (q) => {
    const mape = mapes(q);
    for (const w of rOf(q)!.windows) expect(mape(w.days)).toBeLessThan(w.mape);
  });

  // Not met (README, "A second real demand series"): the last quarter, Melbourne Cup day and the
  // run-up to Christmas, 7.918 / 6.594 / 6.072 % against auto.arima's 7.752 / 6.513 / 6.014 %;
  // held within 0.25 points so that a change that widens the gap fails
  it('quarter 4: the pipeline’s MAPE within 0.25 points of auto.arima’s over the last 7, 14 and 28 days', () => {
    const mape = mapes(4);
    for (const w of rOf(4)!.windows) expect(mape(w.days)).toBeLessThan(w.mape + 0.25);
  });
});
