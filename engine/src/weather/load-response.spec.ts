/**
 * The response estimate on a zone whose load answers the temperature by construction
 * (./synthetic-zone: 12 MW per °C below 14 °C, 15 MW per °C above 22 °C).
 */
import { chooseThresholds, estimateResponse, responseValues } from './load-response';
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
  it('the response is x′β: 10 °C at night with 12 MW/°C heating is 48 MW', () => {
    const r = estimateResponse(z.load, z.temperature, cal, { temperature: true, recency: false, calendar: false, heatBelow: 14, coolAbove: 22 });
    const fixed = { ...r, beta: r.beta.map((_, i) => (r.names[i].startsWith('hdd') ? 12 : 0)) };
    const temp = new Float64Array(24).fill(10);
    expect(responseValues(fixed, temp, plainCalendar(24), 0, 24)[2]).toBeCloseTo(48, 12);
  });
});
