import type { AlertDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { alertNotice } from './alert-notice';

const base: AlertDto = {
  id: 7, zone: 'LANTERN', start: '2026-05-01T00:00:00.000Z', end: '2026-05-01T02:00:00.000Z', peakDeviationPct: 9.5, comparedWith: 'day-ahead', committedMw: 164.4, thresholdPct: 5,
  consecutiveHours: 2, state: 'open', raisedAt: '2026-05-01T02:00:03.000Z', acknowledgedAt: null, acknowledgedBy: null, acknowledgedByName: null, comment: null,
};
const names: Record<string, string> = { LANTERN: 'Lanternside', MILLRACE: 'Millrace', QUARRY: 'Quarry', TIDEWAY: 'Tideway' };
const name = (code: string) => names[code] ?? code;

describe('the deviation-alert notice', () => {
  it('reads one alert as before', () => {
    expect(alertNotice([{ alert: base, widened: false }], name)).toEqual({
      title: 'Deviation alert: Lanternside',
      message: expect.stringMatching(/^Load above the day-ahead forecast by up to 9\.5 ?% for 2 h \(threshold 5 ?%\)\.$/),
    });
    expect(alertNotice([{ alert: base, widened: true }], name).title).toBe('Deviation alert widened: Lanternside');
  });

  it('carries the four alerts of a fresh demo in one notice: counted, the newest three spelt out, the rest counted', () => {
    const codes = ['LANTERN', 'MILLRACE', 'QUARRY', 'TIDEWAY'];
    const entries = codes.map((zone, i) => ({ alert: { ...base, id: i + 1, zone, peakDeviationPct: i === 1 ? -7 : 8 }, widened: false }));
    const n = alertNotice(entries, name);
    expect(n.title).toBe('4 deviation alerts in 4 zones');
    expect(n.message.startsWith('Tideway: load above')).toBe(true);
    expect(n.message).toContain('Millrace: load below');
    expect(n.message).not.toContain('Lanternside');
    expect(n.message.endsWith('And 1 more in the alert list.')).toBe(true);
  });
});
