/**
 * Accuracy measures of a forecast against actuals (Hyndman & Koehler 2006): MAPE (%), MAE,
 * RMSE, bias (mean of forecast − actual, MW, positive = over-forecast), the peak-hour error
 * (forecast minus actual at the hour of the actual peak, MW) and the share of actuals inside the
 * 80 % and 95 % intervals. Missing actuals are skipped; zero actuals are left out of MAPE only.
 */
export interface Accuracy {
  n: number;
  mape: number;
  mae: number;
  rmse: number;
  bias: number;
  peakError: number;
  peakErrorPct: number;
  coverage80: number;
  coverage95: number;
}

export interface ForecastBands {
  mean: ArrayLike<number>;
  lower80?: ArrayLike<number>;
  upper80?: ArrayLike<number>;
  lower95?: ArrayLike<number>;
  upper95?: ArrayLike<number>;
}

export function accuracy(actual: ArrayLike<number>, f: ForecastBands): Accuracy {
  let n = 0;
  let nPct = 0;
  let ape = 0;
  let ae = 0;
  let se = 0;
  let bias = 0;
  let in80 = 0;
  let in95 = 0;
  let peakIdx = -1;
  for (let i = 0; i < actual.length; i++) {
    const a = actual[i];
    const m = f.mean[i];
    if (!Number.isFinite(a) || !Number.isFinite(m)) continue;
    const e = m - a;
    n++;
    ae += Math.abs(e);
    se += e * e;
    bias += e;
    if (a !== 0) {
      ape += Math.abs(e / a);
      nPct++;
    }
    if (f.lower80 && f.upper80 && a >= f.lower80[i] && a <= f.upper80[i]) in80++;
    if (f.lower95 && f.upper95 && a >= f.lower95[i] && a <= f.upper95[i]) in95++;
    if (peakIdx < 0 || a > actual[peakIdx]) peakIdx = i;
  }
  const peakError = peakIdx >= 0 ? f.mean[peakIdx] - actual[peakIdx] : NaN;
  return {
    n,
    mape: nPct ? (100 * ape) / nPct : NaN,
    mae: n ? ae / n : NaN,
    rmse: n ? Math.sqrt(se / n) : NaN,
    bias: n ? bias / n : NaN,
    peakError,
    peakErrorPct: peakIdx >= 0 && actual[peakIdx] !== 0 ? (100 * peakError) / actual[peakIdx] : NaN,
    coverage80: f.lower80 && n ? in80 / n : NaN,
    coverage95: f.lower95 && n ? in95 / n : NaN,
  };
}
