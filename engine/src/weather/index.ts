/** Forecasts that know the weather and the calendar: terms, forecast temperature, the pipeline and its backtest. */
export * from './load-terms';
export * from './load-response';
export * from './vintages';
export * from './forecast-temperature';
export * from './response-uncertainty';
export * from './weather-pipeline';
export * from './weather-backtest';
export * from './synthetic-zone';
