import type { WeatherVintagesDto, WeatherWhatIfDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { schedulesKey } from './schedule-keys';

export type WhatIfAsk = { shift: string } | { vintage: string };

/** GET /api/schedules/:day/:zone/weather-what-if?shift=|vintage= — computed on the server, nothing stored. */
export function useWeatherWhatIf(day: string, zone: string, ask: WhatIfAsk | null) {
  return useQuery({
    queryKey: [...schedulesKey, 'weather-what-if', day, zone, ask],
    queryFn: ({ signal }) => api.get<WeatherWhatIfDto>(`/schedules/${day}/${zone}/weather-what-if`, { signal, query: ask as Record<string, string> }),
    enabled: ask !== null,
    retry: false,
  });
}

/** GET /api/schedules/:day/:zone/weather-vintages — the vintages known for the day, newest first, the forecast's own marked. */
export function useWeatherVintages(day: string, zone: string, enabled: boolean) {
  return useQuery({
    queryKey: [...schedulesKey, 'weather-vintages', day, zone],
    queryFn: ({ signal }) => api.get<WeatherVintagesDto>(`/schedules/${day}/${zone}/weather-vintages`, { signal }),
    enabled,
    retry: false,
  });
}
