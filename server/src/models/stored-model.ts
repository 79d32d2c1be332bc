/**
 * A fitted model as stored with its version (ModelVersion.parameters) and handed back to the
 * engine to forecast from: the differencing, the orders and the natural parameters.
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
}
