import type { OperatingDay } from '@morrowline/shared';
import { layCommitted } from './committed-hours';

const H = 3_600_000;
// Two short invented "days" of three hours each, starting at t = 0 and t = 3 h.
const day = (start: number, date: string): OperatingDay => ({ date, start, end: start + 3 * H, labels: ['HE01', 'HE02', 'HE03'] });

describe('layCommitted', () => {
  it('takes the published schedule where it has a value and the day-ahead forecast elsewhere', () => {
    const out = layCommitted(0, 6, [
      { day: day(0, 'd1'), schedule: { id: 1, at: 0, revision: 2, values: [110, null, 130] }, dayAhead: { id: 7, at: 0, revision: null, values: [100, 101, 102] } },
      { day: day(3 * H, 'd2'), schedule: null, dayAhead: { id: 8, at: 0, revision: null, values: [90, 91, 92] } },
    ]);
    expect(out.committed).toEqual([110, 101, 130, 90, 91, 92]);
    expect(out.basis).toEqual(['schedule', 'day-ahead', 'schedule', 'day-ahead', 'day-ahead', 'day-ahead']);
    expect(out.schedule).toEqual([110, null, 130, null, null, null]);
    expect(out.dayAhead).toEqual([100, 101, 102, 90, 91, 92]);
  });

  it('leaves an hour with neither empty, and lays only the hours inside the range', () => {
    const out = layCommitted(H, 4, [
      { day: day(0, 'd1'), schedule: null, dayAhead: null },
      { day: day(3 * H, 'd2'), schedule: null, dayAhead: { id: 8, at: 0, revision: null, values: [90, 91, 92] } },
    ]);
    expect(out.committed).toEqual([null, null, 90, 91]);
    expect(out.basis).toEqual([null, null, 'day-ahead', 'day-ahead']);
  });
});
