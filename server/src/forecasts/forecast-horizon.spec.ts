import { DateTime } from 'luxon';
import { forecastHorizon } from './forecast-horizon';

const HOUR_MS = 3_600_000;

describe('forecast horizon', () => {
  it('runs to the end of the next operating day in the zone time zone', () => {
    const now = DateTime.fromISO('2026-06-10T14:20', { zone: 'America/Denver' }).toMillis();
    const last = DateTime.fromISO('2026-06-10T13:00', { zone: 'America/Denver' }).toMillis();
    // 14:00 … 23:00 today (10 h) and 24 h tomorrow
    expect(forecastHorizon(last, 'America/Denver', now)).toBe(34);
  });

  it('gives the 25-hour operating day when the clocks go back', () => {
    const now = DateTime.fromISO('2026-10-31T22:10', { zone: 'America/Denver' }).toMillis();
    const last = now - (now % HOUR_MS) - HOUR_MS;
    // hour 22:00 and 23:00 on the 31st, then the 25 hours of 1 November
    expect(forecastHorizon(last, 'America/Denver', now)).toBe(27);
  });
});
