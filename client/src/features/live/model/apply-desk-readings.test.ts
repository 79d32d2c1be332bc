import type { DeskReadings, FeedStatusDto, ReadingSeriesDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { applyDeskReadings, applyDeskReadingsToStatus } from './apply-desk-readings';

const series: ReadingSeriesDto = {
  from: '2026-05-01T00:00:00.000Z',
  to: '2026-05-01T03:00:00.000Z',
  hours: ['2026-05-01T00:00:00.000Z', '2026-05-01T01:00:00.000Z', '2026-05-01T02:00:00.000Z'],
  zones: [
    { zone: 'MILLRACE', mw: [200, null, null], quality: ['good', null, null], lastHour: '2026-05-01T00:00:00.000Z', lastReceivedAt: '2026-05-01T01:00:05.000Z' },
    { zone: 'HARROW', mw: [150, 151, null], quality: ['good', 'good', null], lastHour: '2026-05-01T01:00:00.000Z', lastReceivedAt: '2026-05-01T02:00:05.000Z' },
  ],
};

describe('applyDeskReadings', () => {
  it('writes new values into their hours and moves the zone on, leaving other zones as they were', () => {
    const event: DeskReadings = {
      zones: [{ zone: 'MILLRACE', hours: ['2026-05-01T01:00:00Z', '2026-05-01T02:00:00Z'], mw: [205.5, 210] }],
      receivedAt: '2026-05-01T03:00:01.000Z',
    };
    const next = applyDeskReadings(series, event);
    expect(next.zones[0].mw).toEqual([200, 205.5, 210]);
    expect(next.zones[0].lastHour).toBe('2026-05-01T02:00:00.000Z');
    expect(next.zones[0].lastReceivedAt).toBe('2026-05-01T03:00:01.000Z');
    expect(next.zones[1]).toBe(series.zones[1]);
    expect(series.zones[0].mw).toEqual([200, null, null]); // the cached object is not mutated
  });

  it('replaces a revised value and ignores hours outside the cached range', () => {
    const event: DeskReadings = {
      zones: [{ zone: 'HARROW', hours: ['2026-05-01T01:00:00.000Z', '2026-05-02T00:00:00.000Z'], mw: [149, 999] }],
      receivedAt: '2026-05-02T01:00:00.000Z',
    };
    const next = applyDeskReadings(series, event);
    expect(next.zones[1].mw).toEqual([150, 149, null]);
    expect(next.zones[1].lastHour).toBe('2026-05-02T00:00:00.000Z');
  });

  it('answers the same object for an event about zones not in the series', () => {
    const event: DeskReadings = { zones: [{ zone: 'QUARRY', hours: ['2026-05-01T01:00:00Z'], mw: [80] }], receivedAt: '2026-05-01T02:00:00Z' };
    expect(applyDeskReadings(series, event)).toBe(series);
  });
});

describe('applyDeskReadingsToStatus', () => {
  it('marks a stale feed as keeping up once its readings arrive', () => {
    const status: FeedStatusDto[] = [
      { zone: 'MILLRACE', lastHour: '2026-05-01T00:00:00.000Z', lastReceivedAt: null, hoursBehind: 5, stale: true },
      { zone: 'HARROW', lastHour: null, lastReceivedAt: null, hoursBehind: null, stale: true },
    ];
    const event: DeskReadings = { zones: [{ zone: 'MILLRACE', hours: ['2026-05-01T05:00:00Z'], mw: [200] }], receivedAt: '2026-05-01T06:00:02Z' };
    const next = applyDeskReadingsToStatus(status, event, Date.parse('2026-05-01T06:10:00Z'));
    expect(next[0]).toEqual({ zone: 'MILLRACE', lastHour: '2026-05-01T05:00:00.000Z', lastReceivedAt: '2026-05-01T06:00:02Z', hoursBehind: 0, stale: false });
    expect(next[1]).toBe(status[1]);
  });
});
