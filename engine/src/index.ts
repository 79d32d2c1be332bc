/** Public API of the forecasting engine (pure TypeScript, no framework, no I/O). */
export * from './series/series';
export * from './differencing';
export * from './series/acf';
export * from './ljung-box';
export * from './metrics';
export * from './seasonal-naive';
export * from './forecast';
export * from './select';
export * from './pipeline';
export * from './backtest';
export { fitArma, applyArma, normalizeSpec } from './arma/fit';
export type { ArmaFit, ArmaSpec, Coefficient, ArmaForecast, FitOptions } from './arma/fit';
export * from './rolling';
export * from './adf';
export * from './kpss';
export * from './mackinnon';
export * from './stationarity';
