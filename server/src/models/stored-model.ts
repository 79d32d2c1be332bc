import type { ModelWeatherDto } from '@morrowline/shared';
import type { WeatherChoice } from '@morrowline/engine';

/**
 * A fitted model as stored with its version (ModelVersion.parameters) and handed back to the
 * engine to forecast from: the differencing, the orders and the natural parameters, the seasonal
 * block when the model has one, and the scales its bands were calibrated with. Versions stored
 * before the seasonal block and the calibration lack those fields: no block, Gaussian bands.
 */
export interface StoredModel {
  diff: number[];
  p: number;
  q: number;
  /** natural parameters: ar1.., ma1.. and σ² */
  ar: number[];
  ma: number[];
  sigma2: number;
  mean: number;
  /** seasonal block (P, Q) at `period`, with its natural parameters sar1.., sma1.. */
  P?: number;
  Q?: number;
  period?: number;
  sar?: number[];
  sma?: number[];
  /** multipliers of the Gaussian 80 % and 95 % half-widths (engine band-calibration) */
  bandScale?: { k80: number; k95: number };
}

/**
 * A version's weather and calendar terms (ModelVersion.weather): what the desk shows, and the
 * chosen terms with their error model (`choice`) that the hourly update keeps. `choice` is null
 * when the terms lost to the model without them.
 */
export type StoredWeather = ModelWeatherDto & {
  choice: WeatherChoice | null;
  /** the error model's innovation variance and the bands' calibration, to forecast with the coefficients held (absent on the first versions with weather) */
  sigma2?: number;
  bandScale?: { k80: number; k95: number };
  /** true: the version's backtest MAPE is its weather backtest on forecast weather (absent on versions scored without weather) */
  scoredOnForecastWeather?: boolean;
};
