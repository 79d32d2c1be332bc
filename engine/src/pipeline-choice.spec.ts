/**
 * The pipeline's choice of differencing and orders on series whose right answer is known by
 * construction: hourly series built by integrating a stationary ARMA through a known
 * differencing (Box & Jenkins 1970: a series is ARIMA in the differencing that makes it
 * stationary; differencing further gives a non-invertible MA, the over-differencing that
 * forecasts worse). Eight weeks of history, as the desk fits, with a weekly load pattern.
 */
import { difference } from './differencing';
import { runPipeline, SEASONAL_BLOCK_24 } from './pipeline';
import { selectOrder } from './select';

const WEEK = 168;

function gaussian(seed: number): () => number {
  let s = seed >>> 0 || 1;
  const u = () => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    return (s + 0.5) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
}

/** x_t = Σ a_k x_{t−k} + e_t + Σ b_k e_{t−k}, lag polynomials given as sparse {lag: coefficient}. */
function arma(n: number, ar: Record<number, number>, ma: Record<number, number>, sd: number, seed: number): number[] {
  const g = gaussian(seed);
  const burn = 2000;
  const e: number[] = [];
  const x: number[] = [];
  for (let t = 0; t < n + burn; t++) {
    e.push(sd * g());
    let v = e[t];
    for (const [k, a] of Object.entries(ar)) if (t - +k >= 0) v += a * x[t - +k];
    for (const [k, b] of Object.entries(ma)) if (t - +k >= 0) v += b * e[t - +k];
    x.push(v);
  }
  return x.slice(burn);
}

/** Invert Π(1 − B^s) over w, starting from one week of a daily and weekly load shape. */
function integrate(w: number[], lags: number[]): number[] {
  const D = lags.reduce((a, b) => a + b, 0);
  const shape = (t: number) => 30000 + 6000 * Math.sin((2 * Math.PI * (t % 24)) / 24 - 1.8) - ((t % WEEK) >= 120 ? 4000 : 0);
  let y = Array.from({ length: w.length + D }, (_, t) => (t < D ? shape(t) : 0));
  // y_t = w_{t−D} − Σ_{k≥1} c_k y_{t−k}, with c the coefficients of Π(1 − B^s)
  const c = new Map<number, number>([[0, 1]]);
  for (const s of lags) {
    const next = new Map<number, number>();
    for (const [k, v] of c) {
      next.set(k, (next.get(k) ?? 0) + v);
      next.set(k + s, (next.get(k + s) ?? 0) - v);
    }
    c.clear();
    for (const [k, v] of next) if (v !== 0) c.set(k, v);
  }
  for (let t = D; t < y.length; t++) {
    let v = w[t - D];
    for (const [k, ck] of c) if (k > 0) v -= ck * y[t - k];
    y[t] = v;
  }
  y = y.slice(y.length - 8 * WEEK);
  return y;
}

describe('differencing and order choice on series of known construction', () => {
  it('weekly-differenced with a daily seasonal ARMA: (1−B^168) with the (1,1) block at 24, the double differencing rejected', () => {
    // (1 − 0.7B)(1 − 0.6B^24) w_t = (1 − 0.4B^24) e_t
    const w = arma(8 * WEEK, { 1: 0.7, 24: 0.6, 25: -0.42 }, { 24: -0.4 }, 150, 11);
    const y = integrate(w, [168]);
    const r = runPipeline({ history: y, horizon: 24, options: { computeSe: false } });
    expect(r.selectionDays).toBe(28);
    expect(r.model?.diff).toEqual([168]);
    expect([r.model?.P, r.model?.Q, r.model?.period]).toEqual([1, 1, 24]);
    // (1−B)(1−B^168) was in the running: its orders with an MA root on the unit circle (θ₁ = −1.000,
    // the difference too many) were left out (./over-differencing), and what remained forecast worse
    expect(r.candidates.find((c) => c.diff.join() === '1,168')?.mape).toBeGreaterThan(r.candidates.find((c) => c.diff.join() === '168')!.mape);
    const double = r.candidates.find((c) => c.diff.length === 2)!;
    const weekly = r.candidates.find((c) => c.diff.length === 1 && c.diff[0] === 168)!;
    expect(double.mape).toBeGreaterThan(weekly.mape);
  });

  it('a series that needs both differences gets both', () => {
    // (1 − B^24)(1 − B^168) y_t = (1 + 0.3B) e_t
    const w = arma(8 * WEEK, {}, { 1: 0.3 }, 60, 23);
    const y = integrate(w, [24, 168]);
    const r = runPipeline({ history: y, horizon: 24, options: { computeSe: false } });
    expect(r.model?.diff).toEqual([24, 168]);
  });

  it('a daily-integrated series without a weekly pattern keeps the daily difference alone', () => {
    // (1 − B^24) y_t = w_t, (1 − 0.8B) w_t = (1 + 0.3B) e_t; the start-up week's weekday shape
    // repeats daily from there on, so the weekly difference only adds an MA unit root
    const w = arma(8 * WEEK, { 1: 0.8 }, { 1: 0.3 }, 150, 37);
    const y = integrate(w, [24]);
    const r = runPipeline({ history: y, horizon: 24, options: { computeSe: false } });
    expect(r.model?.diff).toEqual([24]);
  });

  it('the differencing picked is the one with the lowest four-week backtest MAPE, whatever the AICc says', () => {
    const w = arma(8 * WEEK, { 1: 0.7, 24: 0.6, 25: -0.42 }, { 24: -0.4 }, 150, 5);
    const y = integrate(w, [168]);
    const r = runPipeline({ history: y, horizon: 24, options: { computeSe: false, requireBeatBaseline: false } });
    const ok = r.candidates.filter((c) => Number.isFinite(c.mape));
    const lowest = ok.reduce((a, b) => (b.mape < a.mape ? b : a));
    expect(r.model?.diff).toEqual(lowest.diff);
  });

  it('between the plain and the seasonal ARMA of one differenced series, AICc decides', () => {
    const w = arma(8 * WEEK, { 1: 0.7, 24: 0.6, 25: -0.42 }, { 24: -0.4 }, 150, 11);
    const x = difference(integrate(w, [168]), [168]);
    const plain = selectOrder(x, { computeSe: false, screen: 4 });
    const seasonal = selectOrder(x, { computeSe: false, screen: 4, maxQ: 1, ...SEASONAL_BLOCK_24 });
    // same data, so the likelihoods are comparable: the true seasonal structure wins decisively
    expect(seasonal.best.aicc).toBeLessThan(plain.best.aicc - 10); // ΔAICc > 10: no support left for the other (Burnham & Anderson 2002, §2.6)
  });

  it('a series with a deterministic cycle still gets a model: orders with an MA unit root stay when nothing else does', () => {
    // a daily sine plus a 13-hour sawtooth, no noise: every differencing leaves a deterministic
    // cycle, whose MA estimates pile up on the unit circle (the history the refit queue tests store)
    const y = Array.from({ length: 8 * WEEK }, (_, i) => Math.round((300 + 80 * Math.sin((2 * Math.PI * ((i % 24) - 9)) / 24) + ((i * 7919) % 13) - 6) * 10) / 10);
    const r = runPipeline({ history: y, horizon: 24, options: { computeSe: false } });
    expect(r.candidates.every((c) => c.error === undefined)).toBe(true);
    expect(r.method).toBe('arima');
  });
});
