import type { AlertDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { openAlertsKey } from './live-keys';

/** GET /api/alerts?state=open; alerts raised or acknowledged later arrive over the live channel. */
export function useOpenAlerts() {
  return useQuery({
    queryKey: openAlertsKey,
    queryFn: ({ signal }) => api.get<AlertDto[]>('/alerts', { signal, query: { state: 'open' } }),
    staleTime: 5 * 60_000,
  });
}
