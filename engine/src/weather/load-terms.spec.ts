/** The terms' values, checked against values worked out by hand from their definitions. */
import { dayBlocks, dayPart, movingMean, plainCalendar, termColumns, termNames, TermSet } from './load-terms';

const ALL: TermSet = { temperature: true, recency: true, calendar: true, heatBelow: 14, coolAbove: 20 };

describe('load terms', () => {
  it('names every column in order', () => {
    expect(termNames(ALL)).toEqual([
      'hdd_night', 'cdd_night', 'hdd_morning', 'cdd_morning', 'hdd_afternoon', 'cdd_afternoon', 'hdd_evening', 'cdd_evening',
      'hdd_mean24', 'cdd_mean24', 'hdd_lag3', 'cdd_lag3',
      'holiday_night', 'holiday_morning', 'holiday_afternoon', 'holiday_evening', 'bridge', 'day_after',
    ]);
    expect(termNames({ ...ALL, temperature: false, recency: false, calendar: false })).toEqual([]);
  });
  it('two-hour blocks: twelve per day named by their first hour, degree terms and holiday dummies in the hour’s block only', () => {
    const B2: TermSet = { ...ALL, recency: false, blockHours: 2 };
    const labels = ['h00', 'h02', 'h04', 'h06', 'h08', 'h10', 'h12', 'h14', 'h16', 'h18', 'h20', 'h22'];
    expect(termNames(B2)).toEqual([...labels.flatMap((b) => [`hdd_${b}`, `cdd_${b}`]), ...labels.map((b) => `holiday_${b}`), 'bridge', 'day_after']);
    const blocks = dayBlocks(B2);
    expect([0, 1, 2, 3, 13, 22, 23].map(blocks.of)).toEqual([0, 0, 1, 1, 6, 11, 11]);
    expect(() => dayBlocks({ blockHours: 5 })).toThrow(/divide 24/);
    const temp = new Float64Array(48).fill(17);
    temp[3] = 10; // block h02, 4 degrees of heating
    temp[13] = 25; // block h12, 5 degrees of cooling
    const holiday = new Uint8Array(48);
    for (let t = 24; t < 48; t++) holiday[t] = 1; // the second day is a holiday (no weekday given: it counts)
    const cal = { ...plainCalendar(48), holiday };
    const cols = termColumns(B2, temp, cal, 0, 48);
    expect(cols).toHaveLength(12 * 2 + 12 + 2);
    expect(cols[2 * 1][3]).toBe(4); // hdd_h02
    expect(cols[2 * 0][3]).toBe(0); // hdd_h00 outside its block
    expect(cols[2 * 6 + 1][13]).toBe(5); // cdd_h12
    expect(cols[2 * 7 + 1][13]).toBe(0); // cdd_h14
    expect(cols[24 + 5][24 + 11]).toBe(1); // holiday_h10 at 11:00 of the holiday
    expect(cols[24 + 5][24 + 12]).toBe(0);
    expect(cols[24 + 6][24 + 12]).toBe(1); // holiday_h12
    expect(cols[24 + 6][12]).toBe(0); // not a holiday
  });
  it('parts of the day: 0–5 night, 6–11 morning, 12–17 afternoon, 18–23 evening', () => {
    expect([0, 5, 6, 11, 12, 17, 18, 23].map(dayPart)).toEqual([0, 0, 1, 1, 2, 2, 3, 3]);
  });
  it('degree terms: heating 14 − T below 14 °C, cooling T − 20 above 20 °C, in the hour’s part of the day only', () => {
    const temp = new Float64Array(48).fill(17);
    temp[3] = 10; // night, 4 degrees of heating
    temp[14] = 25; // afternoon, 5 degrees of cooling
    temp[20] = NaN; // missing: the hour's own part is NaN, the others 0
    const cols = termColumns({ ...ALL, recency: false, calendar: false }, temp, plainCalendar(48), 0, 48);
    const [hddNight, cddNight, hddMorning, , , cddAfternoon, hddEvening] = cols;
    expect(hddNight[3]).toBe(4);
    expect(cddNight[3]).toBe(0);
    expect(hddMorning[3]).toBe(0);
    expect(cddAfternoon[14]).toBe(5);
    expect(hddNight[14]).toBe(0);
    expect(hddEvening[20]).toBeNaN();
    expect(hddNight[20]).toBe(0);
    expect(cols.reduce((s, c) => s + c[10], 0)).toBe(0); // 17 °C: between the thresholds
  });
  it('recency: degree terms of the mean of the 24 hours before and of the hour three before', () => {
    const temp = new Float64Array(60);
    for (let t = 0; t < 60; t++) temp[t] = t < 24 ? 8 : 26; // a day at 8 °C then 26 °C
    expect(movingMean(temp, 24)).toBe(8);
    expect(movingMean(temp, 36)).toBe((12 * 8 + 12 * 26) / 24); // 17
    expect(movingMean(temp, 5)).toBe(8); // the five hours that exist
    expect(movingMean(temp, 0)).toBe(8); // the hour itself
    const gappy = Float64Array.from(temp);
    for (let t = 12; t < 36; t++) gappy[t] = NaN;
    expect(movingMean(gappy, 36)).toBeNaN(); // none of the 24 hours before known
    const cols = termColumns({ ...ALL, temperature: false, calendar: false }, temp, plainCalendar(60), 24, 60);
    const [hm, cm, hl, cl] = cols;
    expect(hm[0]).toBe(6); // mean 8 °C: 14 − 8
    expect(cm[0]).toBe(0);
    expect(hl[0]).toBe(6); // hour 21 was 8 °C
    expect(hl[3]).toBe(0); // hour 24 was 26 °C
    expect(cl[3]).toBe(6); // 26 − 20
    expect(cm[24]).toBe(6); // hours 24..47 all 26 °C
  });
  it('calendar: holiday by part of the day, bridge day, the day after a holiday', () => {
    const cal = plainCalendar(96);
    const holiday = new Uint8Array(96);
    const bridge = new Uint8Array(96);
    for (let h = 24; h < 48; h++) holiday[h] = 1; // day 1 a holiday
    for (let h = 72; h < 96; h++) bridge[h] = 1; // day 3 a bridge day
    const cols = termColumns({ ...ALL, temperature: false, recency: false }, new Float64Array(96), { ...cal, holiday, bridge }, 0, 96);
    const [night, morning, afternoon, evening, br, after] = cols;
    expect(night[24 + 2]).toBe(1);
    expect(morning[24 + 2]).toBe(0);
    expect(morning[24 + 8]).toBe(1);
    expect(afternoon[24 + 13]).toBe(1);
    expect(evening[24 + 20]).toBe(1);
    expect(night[2]).toBe(0);
    expect(after.slice(48, 72).every((v) => v === 1)).toBe(true);
    expect(after[47]).toBe(0);
    expect(after[72]).toBe(0);
    expect(br[80]).toBe(1);
    expect(br[50]).toBe(0);
  });
  it('a holiday on a Saturday or Sunday counts as the weekend day it is, and has no day after', () => {
    const holiday = new Uint8Array(96);
    for (let h = 24; h < 48; h++) holiday[h] = 1;
    const weekday = Uint8Array.from({ length: 96 }, (_, t) => [5, 6, 0, 1][Math.floor(t / 24)]); // Friday, Saturday (the holiday), Sunday, Monday
    const cols = termColumns({ ...ALL, temperature: false, recency: false }, new Float64Array(96), { ...plainCalendar(96), holiday, weekday }, 0, 96);
    expect(cols.every((c) => c.every((v) => v === 0))).toBe(true);
    const friday = Uint8Array.from({ length: 96 }, (_, t) => [4, 5, 6, 0][Math.floor(t / 24)]); // Thursday, Friday (the holiday), Saturday, Sunday
    const c2 = termColumns({ ...ALL, temperature: false, recency: false }, new Float64Array(96), { ...plainCalendar(96), holiday, weekday: friday }, 0, 96);
    expect(c2[1][24 + 8]).toBe(1); // holiday morning on the Friday
    expect(c2[5].every((v) => v === 0)).toBe(true); // the Saturday after is no working day
  });
});
