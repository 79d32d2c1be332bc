/**
 * Forecasts of an estimated model from many origins of one history, for rolling-origin scoring,
 * from a single Kalman filter pass instead of one pass per origin.
 *
 * The filter runs once over the whole history; its one-step predictions are causal (the
 * prediction of hour t uses hours before t only), so the innovations v_t = w_t − ŵ_{t|t−1} up to
 * an origin are those a filter stopped at the origin would have produced. From an origin the
 * differenced series is forecast by the ARMA difference equation with those innovations
 * (Box & Jenkins 1970, §5.1: ŵ_{o+j} = μ + Σ a_k (w̃_{o+j−k} − μ) + Σ_{k>j} b_k v_{o+j−k}, w̃ the
 * observed or already forecast value), which is what the filter's state gives once it has reached
 * its steady state (Harvey 1989, §3.2), and turned back into load through the differencing. The
 * standard errors of a steady filter do not depend on the origin: they are computed once, exactly,
 * at the last origin (./forecast).
 * The bands are left empty: scoring needs the mean and the standard error only.
 * Checked against one filter per origin in origin-forecasts.spec.ts.
 */
import { expandAr, expandMa } from './arma/polynomials';
import { difference, differenceOrder, extendForecast } from './differencing';
import { applyArima, ArimaFit, forecastArima, IntervalForecast } from './forecast';

/**
 * `(origin, h) => forecast` for origins into `y` (an index: the forecast starts at hour `origin`
 * from y[0..origin)); origins at most `lastOrigin`, h at most `maxH`.
 */
export function originForecaster(base: ArimaFit, y: Float64Array, lastOrigin: number, maxH: number): (origin: number, h: number) => IntervalForecast {
  const diff = base.diff;
  const D = differenceOrder(diff);
  const a = base.arma;
  const full = applyArima(base, y);
  const wf = difference(full.filled, diff);
  const pred = full.arma.predictions;
  const mu = a.mean;
  const ar = expandAr(a.ar, a.sar, a.spec.period);
  const ma = expandMa(a.ma, a.sma, a.spec.period);
  const v = new Float64Array(wf.length);
  for (let t = 0; t < wf.length; t++) v[t] = Number.isFinite(wf[t]) && Number.isFinite(pred[t]) ? wf[t] - pred[t] : 0;
  const se = forecastArima(applyArima(base, y.subarray(0, lastOrigin)), maxH).se;
  return (origin: number, h: number): IntervalForecast => {
    const o = origin - D; // first forecast index into w
    const wHat = new Float64Array(h);
    for (let j = 0; j < h; j++) {
      let s = mu;
      for (let k = 1; k <= ar.length; k++) {
        const t = o + j - k;
        if (t < 0) break;
        s += ar[k - 1] * ((t >= o ? wHat[t - o] : wf[t]) - mu);
      }
      for (let k = j + 1; k <= ma.length; k++) {
        const t = o + j - k;
        if (t < 0) break;
        s += ma[k - 1] * v[t];
      }
      wHat[j] = s;
    }
    const mean = diff.length ? Array.from(extendForecast(full.filled.subarray(0, origin), wHat, diff)) : Array.from(wHat);
    const out: IntervalForecast = { mean, se: se.slice(0, h), lower80: [], upper80: [], lower95: [], upper95: [] };
    return out;
  };
}
