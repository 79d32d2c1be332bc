/**
 * The over-differencing check. Expected values come from factorising the polynomials by hand:
 * (1 − B)(1 − 0.5B) = 1 − 1.5B + 0.5B² has a root at B = 1; 1 + 0.5B + 0.06B² = (1 + 0.2B)(1 + 0.3B)
 * has its roots at −5 and −3.33, well outside the unit circle.
 */
import { hasMaUnitRoot, MA_UNIT_ROOT_MARGIN, overDifferenced } from './over-differencing';

describe('MA unit root: the sign of a difference too many', () => {
  it('finds the root of an MA(1) at the unit circle and within the margin', () => {
    expect(hasMaUnitRoot([-1])).toBe(true);
    expect(hasMaUnitRoot([-0.999])).toBe(true);
    expect(hasMaUnitRoot([1 - MA_UNIT_ROOT_MARGIN / 2])).toBe(true); // root at B = −1.005
    expect(hasMaUnitRoot([-0.9])).toBe(false); // root at 1.11
    expect(hasMaUnitRoot([-1.2])).toBe(true); // not invertible at all
  });
  it('finds a unit root inside a higher-order MA polynomial', () => {
    expect(hasMaUnitRoot([-1.5, 0.5])).toBe(true);
    expect(hasMaUnitRoot([0.5, 0.06])).toBe(false);
    expect(hasMaUnitRoot([])).toBe(false);
  });
  it('checks the seasonal MA part too', () => {
    expect(overDifferenced({ ma: new Float64Array([0.3]), sma: new Float64Array([-0.995]) })).toBe(true);
    expect(overDifferenced({ ma: new Float64Array([0.3]), sma: new Float64Array([-0.5]) })).toBe(false);
    expect(overDifferenced({ ma: new Float64Array(0), sma: new Float64Array(0) })).toBe(false);
  });
});
