import { knownAt, vintageKey, type VintageValue } from './vintages';

const H = 3_600_000;
const t0 = Date.parse('2026-11-02T00:00:00Z');

describe('temperature forecasts as known at a time', () => {
  // Two vintages of station 1: issued at 04:30 and 16:30, both covering 18:00 to 20:00.
  const morning: VintageValue[] = [18, 19, 20].map((h) => ({ stationId: 1, hourStart: t0 + h * H, issuedAt: t0 + 4.5 * H, tempC: 5 + h / 10 }));
  const evening: VintageValue[] = [18, 19, 20].map((h) => ({ stationId: 1, hourStart: t0 + h * H, issuedAt: t0 + 16.5 * H, tempC: 3 + h / 10 }));
  const other: VintageValue = { stationId: 2, hourStart: t0 + 18 * H, issuedAt: t0 + 10 * H, tempC: -1 };
  const all = [...evening, other, ...morning];

  it('never answers a vintage issued after the time asked', () => {
    for (let asOf = t0; asOf <= t0 + 24 * H; asOf += H / 4) {
      for (const v of knownAt(all, asOf).values()) expect(v.issuedAt).toBeLessThanOrEqual(asOf);
    }
  });

  it('takes the newest vintage known at the time, per station and hour', () => {
    expect(knownAt(all, t0 + 4 * H).size).toBe(0);
    expect(knownAt(all, t0 + 12 * H).get(vintageKey(1, t0 + 19 * H))?.tempC).toBeCloseTo(6.9, 10);
    // Issued exactly at the time asked: known.
    expect(knownAt(all, t0 + 16.5 * H).get(vintageKey(1, t0 + 19 * H))?.tempC).toBeCloseTo(4.9, 10);
    expect(knownAt(all, t0 + 16.5 * H).get(vintageKey(2, t0 + 18 * H))?.tempC).toBe(-1);
  });
});
