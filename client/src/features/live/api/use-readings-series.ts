import type { ReadingSeriesDto } from '@morrowline/shared';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { readingsSeriesKey } from './live-keys';

/** GET /api/readings for the zones and range; kept current by the live updates, not by polling. */
export function useReadingsSeries(zones: readonly string[], from: string, to: string) {
  return useQuery({
    queryKey: readingsSeriesKey(zones, from, to),
    queryFn: ({ signal }) => api.get<ReadingSeriesDto>('/readings', { signal, query: { zone: zones.join(','), from, to } }),
    enabled: zones.length > 0,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });
}
