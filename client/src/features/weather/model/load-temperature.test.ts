import { describe, expect, it } from 'vitest';
import type { ReadingSeriesDto, ZoneWeatherSeriesDto } from '@morrowline/shared';
import { loadTemperaturePoints } from './load-temperature';

describe('load against temperature', () => {
  it('pairs each hour that has both values and groups it by local hour', () => {
    // 13:00Z and 14:00Z are 06:00 and 07:00 MST (morning); 12:00Z is 05:00 MST (night).
    const hours = ['2026-11-02T12:00:00.000Z', '2026-11-02T13:00:00.000Z', '2026-11-02T14:00:00.000Z'];
    const readings = { from: hours[0], to: '2026-11-02T15:00:00.000Z', hours, zones: [{ zone: 'HARROW', mw: [100, null, 120], quality: [], lastHour: null, lastReceivedAt: null }] } as ReadingSeriesDto;
    const weather = { from: hours[0], to: readings.to, asOf: readings.to, hours, zones: [{ zone: 'HARROW', observedC: [-2, 1, 3], forecastC: [], forecastIssuedAt: [], latestIssuedAt: null }] } as ZoneWeatherSeriesDto;
    expect(loadTemperaturePoints(readings, weather, 'HARROW', 'America/Denver')).toEqual([
      { tempC: -2, mw: 100, group: 'night' },
      { tempC: 3, mw: 120, group: 'morning' },
    ]);
    expect(loadTemperaturePoints(readings, undefined, 'HARROW', 'America/Denver')).toEqual([]);
  });
});
