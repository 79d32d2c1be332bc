/**
 * The shape of a forecast with its bands, shared by the ARIMA forecasts (forecast.ts) and the
 * regression with ARMA errors (regression/): below the top level so that both may use it.
 */
export interface IntervalForecast {
  mean: number[];
  se: number[];
  lower80: number[];
  upper80: number[];
  lower95: number[];
  upper95: number[];
}
