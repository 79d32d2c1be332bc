import type { ModelVersion } from './entities/model-version.entity';

/** What decides whether a re-estimate is the model already stored: its data and its estimates. */
export type FitIdentity = Pick<ModelVersion, 'differencing' | 'p' | 'q' | 'coefficients' | 'sigma2' | 'trainingFrom' | 'trainingTo' | 'trainingHours' | 'excludedHours'>;

/**
 * True when an hourly update re-estimated the in-service model on the same window of data and
 * came out with the same orders, coefficients and innovation variance: nothing has changed, so
 * storing it would only add a copy to the version list. Estimation is deterministic on the same
 * input, and a refit from the stored coefficients that cannot improve on them returns them bit
 * for bit (fitArma's kept start), so on the same data the two are normally equal; SAME_RELATIVE
 * only forgives round-off of the last bits should another path carry the coefficients through the
 * stationarity transform and back (about 1e-15 of a coefficient, 1e-13 of σ² measured). Any new
 * or corrected reading moves the estimates by far more than that.
 */
export const SAME_RELATIVE = 1e-11;

function same(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= SAME_RELATIVE * Math.max(Math.abs(a), Math.abs(b));
}

export function repeatsVersion(current: FitIdentity, next: FitIdentity): boolean {
  const sameWindow =
    current.trainingFrom.getTime() === next.trainingFrom.getTime() &&
    current.trainingTo.getTime() === next.trainingTo.getTime() &&
    current.trainingHours === next.trainingHours &&
    current.excludedHours === next.excludedHours;
  const sameOrders = current.p === next.p && current.q === next.q && current.differencing.join(',') === next.differencing.join(',');
  const sameEstimates =
    same(current.sigma2, next.sigma2) &&
    current.coefficients.length === next.coefficients.length &&
    current.coefficients.every((c, i) => c.name === next.coefficients[i]?.name && same(c.value, next.coefficients[i]?.value ?? NaN));
  return sameWindow && sameOrders && sameEstimates;
}
