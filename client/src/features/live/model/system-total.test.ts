import { describe, expect, it } from 'vitest';
import { systemTotal } from './system-total';

describe('systemTotal', () => {
  it('adds the zones where every zone reported', () => {
    expect(systemTotal([[100, 110], [50, 60], [10, 20]], 2)).toEqual({ mw: [160, 190], incomplete: [false, false] });
  });

  it('leaves an hour with a missing zone empty and marks it incomplete instead of adding what came in', () => {
    const total = systemTotal([[100, 110, 120], [50, null, 70], [10, 20, null]], 3);
    expect(total.mw).toEqual([160, null, null]);
    expect(total.incomplete).toEqual([false, true, true]);
  });

  it('does not call an hour with no readings at all incomplete (it is simply not here yet)', () => {
    const total = systemTotal([[100, null], [50, null]], 2);
    expect(total.mw).toEqual([150, null]);
    expect(total.incomplete).toEqual([false, false]);
  });

  it('counts a zone whose array is shorter as missing', () => {
    expect(systemTotal([[1, 2], [3]], 2)).toEqual({ mw: [4, null], incomplete: [false, true] });
  });
});
