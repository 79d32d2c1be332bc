/**
 * How much of a forecast's uncertainty is the temperature forecast's: the standard deviation of
 * the response x_t'β (./load-response) when the temperature path is uncertain.
 *
 * With ensemble members: the standard deviation of x_t'β over the members' paths (the response
 * evaluated on each member; Hyndman & Athanasopoulos, Forecasting: Principles and Practice, 3rd
 * ed. 2021, §7.6: forecasts with predictors that are themselves forecast inherit their
 * uncertainty; the members are a sample of it).
 *
 * Without members: the delta method (Casella & Berger 2002, §5.5.4), Var g(T) ≈ (∇g)'Σ_T(∇g), with
 * the error of one forecast taken as perfectly correlated over the few hours one hour's terms
 * read (a temperature forecast misses by whole fronts, its errors decay slowly over the hours;
 * common practice), so Σ_T = σσ' and sd = |∇g'σ|. The gradient of the degree terms is a step at
 * the threshold, so it is taken as a central difference over ±σ (the path shifted by ±σ_s at
 * every forecast hour s): sd_t ≈ |g_t(T + σ) − g_t(T − σ)| / 2, exact for a response linear over
 * T ± σ and smooth across a threshold.
 *
 * The variance is added to the error model's own forecast variance as an independent error (the
 * temperature forecast's miss is independent of the load's own innovations).
 */
import { CalendarHours } from './load-terms';
import { LoadResponse, responseValues } from './load-response';

/** sd of x'β at hours [from, from + sd.length), given the path, its members and the sd of each forecast hour. */
export function responseSd(r: LoadResponse, path: Float64Array, members: readonly Float64Array[], sd: ArrayLike<number>, cal: CalendarHours, from: number): Float64Array {
  const h = sd.length;
  const to = from + h;
  const out = new Float64Array(h);
  if (!r.names.length) return out;
  if (members.length > 1) {
    const values = members.map((m) => responseValues(r, m, cal, from, to));
    for (let j = 0; j < h; j++) {
      let s = 0;
      for (const v of values) s += v[j];
      const mean = s / values.length;
      let ss = 0;
      for (const v of values) ss += (v[j] - mean) * (v[j] - mean);
      out[j] = Math.sqrt(ss / (values.length - 1));
    }
    return out;
  }
  const up = Float64Array.from(path);
  const down = Float64Array.from(path);
  for (let j = 0; j < h; j++) {
    up[from + j] += sd[j];
    down[from + j] -= sd[j];
  }
  const gu = responseValues(r, up, cal, from, to);
  const gd = responseValues(r, down, cal, from, to);
  for (let j = 0; j < h; j++) out[j] = Number.isFinite(gu[j] - gd[j]) ? Math.abs(gu[j] - gd[j]) / 2 : 0;
  return out;
}
