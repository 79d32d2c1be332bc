import { deviationPct, deviationRuns } from './deviation';

describe('deviation alerts', () => {
  it('measures deviation in percent of forecast', () => {
    expect(deviationPct(110, 100)).toBeCloseTo(10);
    expect(deviationPct(90, 100)).toBeCloseTo(-10);
    expect(deviationPct(null, 100)).toBeNull();
    expect(deviationPct(5, 0)).toBeNull();
  });

  it('finds runs of at least N consecutive hours beyond the threshold', () => {
    const forecast = [100, 100, 100, 100, 100, 100, 100, 100];
    const actual = [100, 106, 100, 107, 94, 110, 100, 106];
    expect(deviationRuns(actual, forecast, 5, 2)).toEqual([{ start: 3, end: 6, peakPct: expect.closeTo(10, 6), peakIndex: 5 }]);
    expect(deviationRuns(actual, forecast, 5, 1).map((r) => [r.start, r.end])).toEqual([[1, 2], [3, 6], [7, 8]]);
    expect(deviationRuns(actual, forecast, 5, 4)).toEqual([]);
  });

  it('does not count exactly the threshold, and a missing hour breaks a run', () => {
    expect(deviationRuns([105, 105], [100, 100], 5, 2)).toEqual([]);
    expect(deviationRuns([110, null, 110], [100, 100, 100], 5, 2)).toEqual([]);
  });
});
