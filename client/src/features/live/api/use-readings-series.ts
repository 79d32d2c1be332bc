import type { ReadingSeriesDto } from '@morrowline/shared';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { readingsSeriesKey } from './live-keys';

/**
 * GET /api/readings for every active zone over the range; kept current by the live updates, not
 * by polling. `zones` (the desk's list) only keys the query: the server answers the zones active
 * now, and the page shows those both sides know.
 */
export function useReadingsSeries(zones: readonly string[], from: string, to: string) {
  return useQuery({
    queryKey: readingsSeriesKey(zones, from, to),
    queryFn: ({ signal }) => api.get<ReadingSeriesDto>('/readings', { signal, query: { from, to } }),
    enabled: zones.length > 0,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });
}
