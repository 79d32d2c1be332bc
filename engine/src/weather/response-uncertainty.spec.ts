/** The temperature forecast's share of a load forecast's uncertainty, against values by construction. */
import { plainCalendar } from './load-terms';
import { LoadResponse } from './load-response';
import { responseSd } from './response-uncertainty';

const terms = { temperature: true, recency: false, calendar: false, heatBelow: 14, coolAbove: 22 };
const names = ['hdd_night', 'cdd_night', 'hdd_morning', 'cdd_morning', 'hdd_afternoon', 'cdd_afternoon', 'hdd_evening', 'cdd_evening'];
// 10 MW per degree of heating in every part of the day, 20 MW per degree of cooling
const response: LoadResponse = { terms, names, beta: Float64Array.from(names, (n) => (n.startsWith('hdd') ? 10 : 20)), se: new Float64Array(8), covariance: { names, values: new Float64Array(64) }, estimated: names.map(() => true), rss: 0, n: 0 };
const cal = plainCalendar(48);

describe('response uncertainty', () => {
  it('delta method: far from the thresholds the sd is the slope times the temperature sd', () => {
    const path = new Float64Array(48).fill(0); // 0 °C: 14 degrees of heating
    for (let t = 30; t < 48; t++) path[t] = 30; // 30 °C: 8 degrees of cooling
    const sd = Float64Array.from({ length: 24 }, (_, j) => 1 + j / 24);
    const out = responseSd(response, path, [], sd, cal, 24);
    expect(out[0]).toBeCloseTo(10 * 1, 12);
    expect(out[10]).toBeCloseTo(20 * (1 + 10 / 24), 12);
  });
  it('at the threshold the central difference halves the slope (one side of the kink)', () => {
    const path = new Float64Array(48).fill(14);
    const out = responseSd(response, path, [], new Float64Array(24).fill(2), cal, 24);
    expect(out[0]).toBeCloseTo((10 * 2) / 2, 12);
  });
  it('with members: the sample sd of the response over the members', () => {
    const members = [5, 7, 9].map((t) => new Float64Array(48).fill(t)); // heating 9, 7, 5 degrees: 90, 70, 50 MW
    const out = responseSd(response, members[1], members, new Float64Array(24), cal, 24);
    expect(out[3]).toBeCloseTo(20, 12); // sd of 90, 70, 50
  });
});
