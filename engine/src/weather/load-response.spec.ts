/**
 * The response estimate on a zone whose load answers the temperature by construction
 * (./synthetic-zone: 12 MW per °C below 14 °C, 15 MW per °C above 22 °C).
 */
import { chooseThresholds, estimateResponse, independentColumns, responseValues } from './load-response';
import { plainCalendar } from './load-terms';
import { SYNTHETIC_COOL_PER_C, SYNTHETIC_HEAT_PER_C, syntheticZone } from './synthetic-zone';

describe('load response', () => {
  const z = syntheticZone(8 * 168, 7, { meanC: 17 });
  const cal = plainCalendar(z.load.length);
  it('recovers the per-degree responses of the construction within a few standard errors', () => {
    const r = estimateResponse(z.load, z.temperature, cal, { temperature: true, recency: false, calendar: false, heatBelow: 14, coolAbove: 22 });
    for (const part of ['night', 'morning', 'afternoon', 'evening']) {
      const i = r.names.indexOf(`hdd_${part}`);
      // heating degrees lower the load's distance below the threshold: +12 MW per degree below 14 °C
      expect(Math.abs(r.beta[i] - SYNTHETIC_HEAT_PER_C)).toBeLessThan(Math.max(4 * r.se[i], 1));
    }
    const j = r.names.indexOf('cdd_afternoon');
    expect(r.estimated[j]).toBe(true);
    expect(Math.abs(r.beta[j] - SYNTHETIC_COOL_PER_C)).toBeLessThan(Math.max(4 * r.se[j], 1.5));
  });
  it('gives the least-squares covariance of the estimated coefficients: s²(X′X)⁻¹, its diagonal the squared standard errors', () => {
    const r = estimateResponse(z.load, z.temperature, cal, { temperature: true, recency: false, calendar: false, heatBelow: 14, coolAbove: 22 });
    const { names, values } = r.covariance;
    expect(names).toEqual(r.names.filter((_, i) => r.estimated[i]));
    const m = names.length;
    expect(values.length).toBe(m * m);
    names.forEach((name, i) => {
      expect(values[i * m + i]).toBeCloseTo(r.se[r.names.indexOf(name)] ** 2, 9);
      for (let j = 0; j < m; j++) expect(values[i * m + j]).toBeCloseTo(values[j * m + i], 12);
    });
    // a covariance matrix: every correlation within [−1, 1] (Cauchy–Schwarz)
    for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) expect(Math.abs(values[i * m + j])).toBeLessThanOrEqual(Math.sqrt(values[i * m + i] * values[j * m + j]) * (1 + 1e-12));
  });
  it('chooses the thresholds of the construction from the grid by profile likelihood', () => {
    const r = chooseThresholds(z.load, z.temperature, cal, { temperature: true, recency: false, calendar: false, heatBelow: 0, coolAbove: 0 });
    expect(r.terms.heatBelow).toBe(14);
    expect(r.terms.coolAbove).toBe(22);
  });
  it('a column with no weekly change (no holiday in the history) is not estimated and counts 0', () => {
    const r = estimateResponse(z.load, z.temperature, cal, { temperature: false, recency: false, calendar: true, heatBelow: 14, coolAbove: 22 });
    expect(r.estimated.every((e) => !e)).toBe(true);
    expect(Array.from(responseValues(r, z.temperature, cal, 0, 48)).every((v) => v === 0)).toBe(true);
  });
  it('a column that repeats another on every hour used is left out, and the others are still estimated', () => {
    const holiday = new Uint8Array(z.load.length);
    const bridge = new Uint8Array(z.load.length);
    for (let t = 20 * 24; t < 21 * 24; t++) holiday[t] = 1;
    for (let t = 21 * 24; t < 22 * 24; t++) bridge[t] = 1; // without a weekday every day is a working day
    const c2 = { ...cal, holiday, bridge };
    const r = estimateResponse(z.load, z.temperature, c2, { temperature: true, recency: false, calendar: true, heatBelow: 14, coolAbove: 22 });
    expect(r.estimated[r.names.indexOf('bridge')]).toBe(true);
    expect(r.estimated[r.names.indexOf('day_after')]).toBe(false); // the day after is the bridge day: no column of its own
    const i = r.names.indexOf('hdd_morning');
    expect(Math.abs(r.beta[i] - SYNTHETIC_HEAT_PER_C)).toBeLessThan(Math.max(4 * r.se[i], 1));
  });
  it('keeps, in order, the columns that are not combinations of earlier ones', () => {
    // columns a, b, a + b, 0, c on four rows
    const rows = [
      [1, 0, 1, 0, 2],
      [0, 1, 1, 0, 0],
      [1, 1, 2, 0, 1],
      [2, 0, 2, 0, 5],
    ];
    const k = 5;
    const xtx = new Float64Array(k * k);
    for (const r of rows) for (let i = 0; i < k; i++) for (let j = 0; j <= i; j++) xtx[i * k + j] += r[i] * r[j];
    expect(independentColumns(xtx, k)).toEqual([0, 1, 4]);
  });
  it('the response is x′β: 10 °C at night with 12 MW/°C heating is 48 MW', () => {
    const r = estimateResponse(z.load, z.temperature, cal, { temperature: true, recency: false, calendar: false, heatBelow: 14, coolAbove: 22 });
    const fixed = { ...r, beta: r.beta.map((_, i) => (r.names[i].startsWith('hdd') ? 12 : 0)) };
    const temp = new Float64Array(24).fill(10);
    expect(responseValues(fixed, temp, plainCalendar(24), 0, 24)[2]).toBeCloseTo(48, 12);
  });
});
