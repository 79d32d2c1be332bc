import type { WeatherStatusDto, ZoneWeatherSeriesDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** Observed temperature arrives hourly and forecasts twice a day: a poll every five minutes keeps up. */
export const WEATHER_POLL_MS = 5 * 60_000;
export const WEATHER_STATUS_POLL_MS = 60_000;

export const weatherKeys = {
  zones: (zones: readonly string[], from: string, to: string, asOf: string | null) => ['weather', 'zones', { zones: zones.join(','), from, to, asOf }] as const,
  status: ['weather', 'status'] as const,
};

/**
 * GET /api/weather/zones: per zone and hour, observed temperature and the temperature forecast as
 * known at `asOf` (null: now, polled; a time: that moment's forecast, which never changes).
 */
export function useZoneWeather(zones: readonly string[], from: string, to: string, asOf: string | null = null) {
  return useQuery({
    queryKey: weatherKeys.zones(zones, from, to, asOf),
    queryFn: ({ signal }) => api.get<ZoneWeatherSeriesDto>('/weather/zones', { signal, query: { zone: zones.join(','), from, to, ...(asOf ? { asOf } : {}) } }),
    enabled: zones.length > 0 && from !== '' && to !== '',
    refetchInterval: asOf ? false : WEATHER_POLL_MS,
  });
}

/** GET /api/weather/status every minute: a silent weather feed sends nothing to say so. */
export function useWeatherStatus() {
  return useQuery({
    queryKey: weatherKeys.status,
    queryFn: ({ signal }) => api.get<WeatherStatusDto[]>('/weather/status', { signal }),
    refetchInterval: WEATHER_STATUS_POLL_MS,
  });
}
