/** The temperature a forecast is issued on, as known at its issue time; values worked out by hand. */
import { COMBINED_VINTAGES, combineVintages, forecastTemperature, leadErrors, observedTemperature, recentErrorUpdate } from './forecast-temperature';
import { syntheticZone } from './synthetic-zone';
import { knownVintages, TemperatureVintage, vintagesFromRows } from './vintages';

const HOUR = 3_600_000;

describe('vintages', () => {
  it('group rows by issue time and member, on the load timeline', () => {
    const start = Date.UTC(2026, 0, 5, 7);
    const rows = [
      { issuedMs: start + 4.5 * HOUR, hourMs: start + 5 * HOUR, tempC: 1, member: 'a' },
      { issuedMs: start + 4.5 * HOUR, hourMs: start + 6 * HOUR, tempC: 2, member: 'a' },
      { issuedMs: start + 4.5 * HOUR, hourMs: start + 5 * HOUR, tempC: 3, member: 'b' },
      { issuedMs: start + 1.5 * HOUR, hourMs: start + 2 * HOUR, tempC: 9 },
    ];
    const v = vintagesFromRows(rows, start);
    expect(v.map((x) => x.issued)).toEqual([1.5, 4.5]);
    expect(v[1].first).toBe(5);
    expect(v[1].members.map((m) => Array.from(m))).toEqual([
      [1, 2],
      [3, NaN],
    ]);
    expect(knownVintages(v, 4).map((x) => x.issued)).toEqual([1.5]);
    expect(knownVintages(v, 4.5).map((x) => x.issued)).toEqual([1.5, 4.5]);
  });
});

describe('forecast temperature', () => {
  const observed = Float64Array.from({ length: 40 }, (_, i) => i); // hour i was i °C
  const older: TemperatureVintage = { issued: 2.5, first: 3, members: [Float64Array.from({ length: 30 }, (_, j) => 3 + j + 1)] }; // 1 °C too warm
  const latest: TemperatureVintage = { issued: 8.5, first: 9, members: [Float64Array.from({ length: 12 }, (_, j) => 9 + j - 2)] }; // 2 °C too cold, 12 hours
  const later: TemperatureVintage = { issued: 10.5, first: 11, members: [new Float64Array(30).fill(99)] };
  it('observed before the issue time, the latest known vintage after it, an older one where the latest ends, never a later one', () => {
    const f = forecastTemperature(observed, [older, latest, later], 10, 20);
    expect(Array.from(f.path.subarray(0, 10))).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
    expect(f.path[10]).toBe(8); // latest: 10 − 2
    expect(f.path[20]).toBe(18);
    expect(f.path[21]).toBe(22); // latest ends at 20; older: 21 + 1
    expect(f.vintageIssued).toBe(8.5);
    expect(Array.from(f.path).includes(99)).toBe(false);
  });
  it('persistence (the temperature 24 hours earlier) where no vintage covers an hour', () => {
    const f = forecastTemperature(observed, [], 30, 10);
    expect(f.path[30]).toBe(6);
    expect(f.path[35]).toBe(11);
    expect(f.vintageIssued).toBeNaN();
  });
  it('measures the error of known vintages by 12-hour lead bin on observed hours only', () => {
    const obs = new Float64Array(200).fill(10);
    const vs: TemperatureVintage[] = [];
    for (let k = 0; k < 6; k++) vs.push({ issued: k * 12 + 0.5, first: k * 12 + 1, members: [Float64Array.from({ length: 48 }, (_, j) => (j < 11 ? 11 : 13))] });
    const e = leadErrors(obs, vs, 100);
    expect(e[0]).toBeCloseTo(Math.sqrt((11 * 1 + 1 * 9) / 12), 12); // leads 0.5..11.5 (j = 0..11): eleven at 1 °C, one at 3 °C
    expect(e[1]).toBeCloseTo(3, 12);
    expect(e[5]).toBeNaN(); // no lead that long
  });
  it('corrects the latest vintage by its error so far, with the slope of past vintages at the same age', () => {
    // every vintage misses by a constant c_k over all its hours, so the error 1..h hours after the
    // last observed one equals the error over the last three: slope 1, residual 0
    const obs = new Float64Array(400).fill(5);
    const vs: TemperatureVintage[] = [];
    for (let k = 0; k < 25; k++) {
      const c = ((k * 7) % 5) - 2;
      vs.push({ issued: k * 12 + 0.5, first: k * 12 + 1, members: [new Float64Array(60).fill(5 - c)] });
    }
    const at = 24 * 12 + 6; // 5.5 hours after the last vintage
    const u = recentErrorUpdate(obs, knownVintages(vs, at), vs[24], at, 10)!;
    const c24 = ((24 * 7) % 5) - 2;
    for (let j = 0; j < 10; j++) {
      expect(u.shift[j]).toBeCloseTo(c24, 10);
      expect(u.sd[j]).toBeCloseTo(0, 10);
    }
  });
  it('vintages that all miss by the same constant are each corrected by their error so far: the combination is the observed temperature', () => {
    const obs = new Float64Array(400).fill(5);
    const vs: TemperatureVintage[] = [];
    for (let k = 0; k < 25; k++) vs.push({ issued: k * 12 + 0.5, first: k * 12 + 1, members: [new Float64Array(120).fill(5 - 1.5)] });
    const at = 24 * 12 + 6;
    const c = combineVintages(obs, knownVintages(vs, at), at, 10);
    for (let j = 0; j < 10; j++) {
      expect(c.value[j]).toBeCloseTo(5, 10); // every vintage: 3.5 + slope 1 × its error so far (1.5)
      expect(c.vintages[j]).toBe(COMBINED_VINTAGES);
    }
    const f = forecastTemperature(obs, vs, at, 10);
    expect(f.path[at]).toBeCloseTo(5, 10);
  });
  it('a vintage with nothing observed yet enters with the measured error at its lead; two such vintages are weighted by 1/σ²', () => {
    // past vintages miss by +1 °C at leads 0–11 and by +2 °C at leads 12–23 (never observed long
    // enough for a slope: each covers 24 hours only, and the two newest were issued after the last observed hour)
    const obs = new Float64Array(300).fill(0);
    const vs: TemperatureVintage[] = [];
    for (let k = 0; k < 19; k++) vs.push({ issued: k * 12 + 0.5, first: k * 12 + 1, members: [Float64Array.from({ length: 24 }, (_, j) => (j < 12 ? 1 : 2))] });
    const at = 250;
    vs.push({ issued: 238.5, first: 250, members: [new Float64Array(24).fill(10)] }); // lead of hour 250: 11.5 (bin 0, σ ≈ 1)
    vs.push({ issued: 249.5, first: 250, members: [new Float64Array(24).fill(20)] }); // lead 0.5 (bin 0)
    const known = knownVintages(vs, at);
    const e = leadErrors(obs, known, at);
    const c = combineVintages(obs, known, at, 1);
    // only the two newest cover hour 250 (the others ended by 240); both at lead bin 0 (σ = 1 °C), so equal weights
    expect(e[0]).toBeCloseTo(1, 12);
    expect(c.vintages[0]).toBe(2);
    expect(c.value[0]).toBeCloseTo(15, 10);
    expect(c.sd[0]).toBeCloseTo(1 / Math.SQRT2, 10);
  });
  it('independent errors growing with the lead: the combination is more certain than the latest vintage alone, and its value is the inverse-variance mean of the corrected vintages', () => {
    const z = syntheticZone(8 * 168, 11);
    const at = 8 * 168 - 14;
    const known = knownVintages(z.vintages, at);
    const c = combineVintages(z.temperature, known, at, 38);
    const single = leadErrors(z.temperature, z.vintages, at);
    const latest = known[known.length - 1];
    for (const j of [0, 20, 37]) {
      expect(c.vintages[j]).toBe(COMBINED_VINTAGES);
      expect(c.sd[j]).toBeLessThan(single[Math.floor((at + j - latest.issued) / 12)]);
    }
    const j = 15;
    const i = at + j;
    let sw = 0;
    let swx = 0;
    for (const v of known.slice(-COMBINED_VINTAGES)) {
      const u = recentErrorUpdate(z.temperature, known, v, at, 38)!;
      const s = Math.max(0.03, u.sd[j]);
      sw += 1 / s ** 2;
      swx += (v.members[0][i - v.first] + u.shift[j]) / s ** 2;
    }
    expect(c.value[j]).toBeCloseTo(swx / sw, 10);
    expect(c.sd[j]).toBeCloseTo(1 / Math.sqrt(sw), 10);
    const f = forecastTemperature(z.temperature, z.vintages, at, 38);
    expect(f.path[i]).toBeCloseTo(swx / sw, 10);
    expect(f.sd[j]).toBeCloseTo(1 / Math.sqrt(sw), 10);
  });
  it('perfect weather is the observed temperature with no uncertainty', () => {
    const f = observedTemperature(observed, 10, 5);
    expect(Array.from(f.path.subarray(10))).toEqual([10, 11, 12, 13, 14]);
    expect(Array.from(f.sd)).toEqual([0, 0, 0, 0, 0]);
  });
});
