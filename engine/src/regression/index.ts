/** Regression with ARMA errors: the estimator, its forecasts and their types. */
export * from './types';
export { fitRegression, applyRegression } from './fit-regression';
