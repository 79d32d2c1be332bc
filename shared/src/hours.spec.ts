import { ceilHour, floorHour, HOUR_MS, WEEK_HOURS } from './hours';

describe('hour arithmetic', () => {
  it('has an hour of 60 × 60 × 1000 ms and a week of 7 × 24 hours', () => {
    expect(HOUR_MS).toBe(60 * 60 * 1000);
    expect(WEEK_HOURS).toBe(7 * 24);
  });

  it('rounds down and up to UTC hour starts, leaving an hour start as it is', () => {
    const hour = Date.parse('2026-11-01T08:00:00Z');
    expect(floorHour(Date.parse('2026-11-01T08:59:59.999Z'))).toBe(hour);
    expect(floorHour(hour)).toBe(hour);
    expect(ceilHour(Date.parse('2026-11-01T07:00:00.001Z'))).toBe(hour);
    expect(ceilHour(hour)).toBe(hour);
  });
});
