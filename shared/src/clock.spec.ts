import { formatLocalClock, formatLocalDayClock, formatLocalTime, formatUtcTime, timeZoneAbbreviation } from './clock';

/**
 * Expected values worked out by hand from the IANA time zone database (tzdata, `northamerica`):
 * America/Denver is UTC−7 (MST) until 02:00 local on the second Sunday of March (8 March 2026),
 * then UTC−6 (MDT) until 02:00 MDT on the first Sunday of November (1 November 2026), when it
 * falls back to 01:00 MST. Europe/London (tzdata `europe`): GMT, BST (UTC+1) from 01:00 UTC on
 * the last Sunday of March (29 March 2026) to 01:00 UTC on the last Sunday of October (25 October 2026).
 */
const DENVER = 'America/Denver';

describe('the one clock rule', () => {
  it('writes a winter moment in Mountain Standard Time with its abbreviation', () => {
    expect(formatLocalTime('2026-12-02T15:18:42.341Z', DENVER)).toBe('2026-12-02 08:18 MST');
  });

  it('writes a summer moment in Mountain Daylight Time', () => {
    expect(formatLocalTime('2026-07-01T15:18:00Z', DENVER)).toBe('2026-07-01 09:18 MDT');
  });

  it('accepts epoch ms, a Date and ISO text with an offset as the same moment', () => {
    const ms = Date.UTC(2026, 11, 2, 15, 18);
    expect(formatLocalTime(ms, DENVER)).toBe('2026-12-02 08:18 MST');
    expect(formatLocalTime(new Date(ms), DENVER)).toBe('2026-12-02 08:18 MST');
    // the outage dialog's old text: an offset that is not the reader's must still be converted
    expect(formatLocalTime('2026-11-25T00:00:00-07:00', DENVER)).toBe('2026-11-25 00:00 MST');
    expect(formatLocalTime('2026-11-25T00:00:00-05:00', DENVER)).toBe('2026-11-24 22:00 MST');
  });

  it('skips the missing hour on the spring day: 01:59 MST is followed by 03:00 MDT', () => {
    expect(formatLocalTime('2026-03-08T08:59:00Z', DENVER)).toBe('2026-03-08 01:59 MST');
    expect(formatLocalTime('2026-03-08T09:00:00Z', DENVER)).toBe('2026-03-08 03:00 MDT');
  });

  it('tells the two 01:30s of the autumn day apart by their abbreviation', () => {
    expect(formatLocalTime('2026-11-01T07:30:00Z', DENVER)).toBe('2026-11-01 01:30 MDT');
    expect(formatLocalTime('2026-11-01T08:30:00Z', DENVER)).toBe('2026-11-01 01:30 MST');
  });

  it('follows the zone it is given, not the machine running it', () => {
    // where no abbreviation is known the offset stands in for it (summer time in London)
    expect(formatLocalTime('2026-03-29T00:30:00Z', 'Europe/London')).toBe('2026-03-29 00:30 GMT');
    expect(formatLocalTime('2026-03-29T01:30:00Z', 'Europe/London')).toBe('2026-03-29 02:30 GMT+1');
    expect(formatLocalTime('2026-10-25T00:30:00Z', 'Europe/London')).toBe('2026-10-25 01:30 GMT+1');
    expect(formatLocalTime('2026-10-25T01:30:00Z', 'Europe/London')).toBe('2026-10-25 01:30 GMT');
    expect(formatLocalTime('2026-12-02T15:18:00Z', 'America/Chicago')).toBe('2026-12-02 09:18 CST');
  });

  it('gives the abbreviation alone', () => {
    expect(timeZoneAbbreviation('2026-01-15T12:00:00Z', DENVER)).toBe('MST');
    expect(timeZoneAbbreviation('2026-06-15T12:00:00Z', DENVER)).toBe('MDT');
  });

  it('has short forms that keep the abbreviation', () => {
    expect(formatLocalClock('2026-12-02T15:18:42Z', DENVER)).toBe('08:18 MST');
    expect(formatLocalDayClock('2026-12-02T15:18:42Z', DENVER)).toBe('Wed 2 Dec 08:18 MST');
  });

  it('writes UTC only with the label', () => {
    expect(formatUtcTime('2026-12-02T08:18:00-07:00')).toBe('2026-12-02 15:18 UTC');
    expect(formatUtcTime(Date.UTC(2026, 2, 8, 9, 0))).toBe('2026-03-08 09:00 UTC');
  });

  it('writes a dash for no moment or for text that is not a moment', () => {
    expect(formatLocalTime(null, DENVER)).toBe('—');
    expect(formatLocalTime(undefined, DENVER)).toBe('—');
    expect(formatLocalTime('not a time', DENVER)).toBe('—');
    expect(formatUtcTime('')).toBe('—');
  });
});
