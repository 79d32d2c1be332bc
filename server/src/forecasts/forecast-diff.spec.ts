import { diffRuns } from './forecast-diff';

const H = 3_600_000;
const t0 = Date.UTC(2026, 11, 3, 7);

describe('the difference between two forecast runs', () => {
  it('lines the runs up by hour, rounds to 0.1 MW and names the hour that moved most', () => {
    const older = { firstHour: t0, mean: [100, 110.04, 120, 130] };
    const newer = { firstHour: t0 + H, mean: [111.06, 98, 131.2, 140] };
    const d = diffRuns(older, newer);
    expect(d.hours).toEqual([
      { hour: new Date(t0).toISOString(), fromMw: 100, toMw: null, changeMw: null },
      { hour: new Date(t0 + H).toISOString(), fromMw: 110, toMw: 111.1, changeMw: 1.1 },
      { hour: new Date(t0 + 2 * H).toISOString(), fromMw: 120, toMw: 98, changeMw: -22 },
      { hour: new Date(t0 + 3 * H).toISOString(), fromMw: 130, toMw: 131.2, changeMw: 1.2 },
      { hour: new Date(t0 + 4 * H).toISOString(), fromMw: null, toMw: 140, changeMw: null },
    ]);
    expect(d.largestChangeMw).toBe(-22);
    expect(d.largestChangeHour).toBe(new Date(t0 + 2 * H).toISOString());
  });

  it('keeps to the hours asked for', () => {
    const d = diffRuns({ firstHour: t0, mean: [1, 2, 3] }, { firstHour: t0, mean: [1, 2, 5] }, t0 + H, t0 + 3 * H);
    expect(d.hours.map((h) => h.changeMw)).toEqual([0, 2]);
  });
});
