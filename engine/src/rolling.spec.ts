/** Rolling statistics and the stationarity verdict (data: the real demand fixture, R forecast's `taylor`). */
import taylor from './fixtures/taylor-hourly.json';
import { rollingStats } from './rolling';
import { stationarityReport } from './stationarity';
import { meanFinite, varianceFinite } from './series/series';

describe('rolling mean and variance', () => {
  it('matches a direct computation on every window, with missing hours skipped', () => {
    const x = (taylor.load as number[]).slice(0, 400);
    x[50] = NaN;
    const r = rollingStats(x, 24);
    for (const i of [23, 60, 73, 399]) {
      const w = x.slice(i - 23, i + 1);
      expect(r.mean[i]).toBeCloseTo(meanFinite(w), 6);
      expect(r.variance[i] / varianceFinite(w)).toBeCloseTo(1, 8);
    }
    expect(Number.isNaN(r.mean[22])).toBe(true);
  });
});

describe('stationarity report', () => {
  it('finds the daily pattern in real demand and a differencing that removes it', () => {
    const rep = stationarityReport((taylor.load as number[]).slice(0, 8 * 168));
    expect(rep.checks.map((c) => c.label)).toEqual(['none', '(1−B^24)', '(1−B^168)', '(1−B^24)(1−B^168)']);
    expect(rep.findings.some((f) => f.includes('daily pattern'))).toBe(true);
    expect(rep.checks[0].acf24).toBeGreaterThan(0.5);
    expect(rep.verdict.length).toBeGreaterThan(20);
  });
});
