/** The weather and calendar pieces of the forecasts that know them: terms, response, vintages, forecast temperature (the pipeline and its backtest are ../weather-pipeline.ts, ../weather-backtest.ts). */
export * from './load-terms';
export * from './load-response';
export * from './vintages';
export * from './forecast-temperature';
export * from './response-uncertainty';
export * from './synthetic-zone';
