/**
 * Weekly seasonal-naive forecast, the baseline of every load backtest: the load of the same hour
 * one week earlier (Hyndman & Athanasopoulos 2021, §5.2). Where that hour is missing, the same
 * hour two, three … weeks earlier is used, then the same hour of earlier days, then the mean.
 * Intervals assume the weekly differences are white noise: the standard error of k weeks ahead is
 * √k times the standard deviation of y_t − y_{t−168} over the history.
 */
import { IntervalForecast, Z80, Z95 } from './forecast';
import { meanFinite } from './series/series';

export const WEEK = 168;
export const DAY = 24;

export function seasonalNaive(history: ArrayLike<number>, h: number, period = WEEK): IntervalForecast {
  const n = history.length;
  const ext = new Float64Array(n + h);
  for (let i = 0; i < n; i++) ext[i] = Number.isFinite(history[i]) ? history[i] : NaN;
  const fallback = meanFinite(history);
  const out: IntervalForecast = { mean: [], se: [], lower80: [], upper80: [], lower95: [], upper95: [] };
  let ss = 0;
  let cnt = 0;
  for (let t = period; t < n; t++) {
    const d = ext[t] - ext[t - period];
    if (d === d) {
      ss += d * d;
      cnt++;
    }
  }
  const sd = cnt > 1 ? Math.sqrt(ss / cnt) : 0;
  for (let j = 0; j < h; j++) {
    const t = n + j;
    let v = NaN;
    for (let u = t - period; u >= 0 && !(v === v); u -= period) if (u < n) v = ext[u];
    if (!(v === v)) for (let u = t - DAY; u >= 0 && !(v === v); u -= DAY) if (u < n) v = ext[u];
    if (!(v === v)) v = Number.isFinite(fallback) ? fallback : 0;
    const k = Math.floor(j / period) + 1;
    const se = sd * Math.sqrt(k);
    out.mean.push(v);
    out.se.push(se);
    out.lower80.push(v - Z80 * se);
    out.upper80.push(v + Z80 * se);
    out.lower95.push(v - Z95 * se);
    out.upper95.push(v + Z95 * se);
  }
  return out;
}
