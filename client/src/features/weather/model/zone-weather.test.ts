import { describe, expect, it } from 'vitest';
import type { WeatherStatusDto, ZoneWeatherSeriesDto } from '@morrowline/shared';
import { alignedTemperatures, formatTemperature, latestObserved, zoneWeatherState } from './zone-weather';

const weather: ZoneWeatherSeriesDto = {
  from: '2026-11-02T10:00:00.000Z',
  to: '2026-11-02T13:00:00.000Z',
  asOf: '2026-11-02T12:30:00.000Z',
  hours: ['2026-11-02T10:00:00.000Z', '2026-11-02T11:00:00.000Z', '2026-11-02T12:00:00.000Z'],
  zones: [{ zone: 'HARROW', observedC: [1.5, 2, null], forecastC: [1, 2.5, 3], forecastIssuedAt: [null, '2026-11-02T04:30:00.000Z', '2026-11-02T04:30:00.000Z'], latestIssuedAt: '2026-11-02T04:30:00.000Z' }],
};

describe('the zone weather beside the load', () => {
  it('puts the temperatures on the load chart\'s hours, empty where the weather has none', () => {
    const aligned = alignedTemperatures(weather, 'HARROW', ['2026-11-02T09:00:00Z', '2026-11-02T11:00:00Z', '2026-11-02T12:00:00Z']);
    expect(aligned.observedC).toEqual([null, 2, null]);
    expect(aligned.forecastC).toEqual([null, 2.5, 3]);
    expect(aligned.issuedAt[1]).toBe('2026-11-02T04:30:00.000Z');
    expect(alignedTemperatures(weather, 'MILLRACE', ['2026-11-02T11:00:00Z']).observedC).toEqual([null]);
  });

  it('takes each zone\'s latest observed value for its card', () => {
    expect(latestObserved(weather)).toEqual(new Map([['HARROW', 2]]));
    expect(latestObserved(undefined).size).toBe(0);
  });

  it('calls a zone\'s weather stale when one of its stations has gone quiet', () => {
    const status: WeatherStatusDto[] = [
      { station: 'VALLEYFLOOR', zones: ['HARROW', 'MILLRACE'], lastObservedHour: null, lastIssuedAt: null, observedStale: false, forecastStale: true, forecastStaleAfterHours: 18 },
      { station: 'COPPERBENCH', zones: ['HARROW'], lastObservedHour: null, lastIssuedAt: null, observedStale: false, forecastStale: false, forecastStaleAfterHours: 18 },
    ];
    expect(zoneWeatherState(status, 'HARROW').stale).toEqual([{ station: 'VALLEYFLOOR', observed: false, forecast: true }]);
    expect(zoneWeatherState(status, 'QUARRY')).toEqual({ stale: [], noStations: true });
    expect(formatTemperature(-0.04)).toBe('0.0 °C');
    expect(formatTemperature(-3.25)).toBe('-3.2 °C');
    expect(formatTemperature(null)).toBe('—');
  });
});
