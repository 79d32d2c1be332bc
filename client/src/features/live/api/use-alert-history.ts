import type { AlertDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { alertHistoryKey } from './live-keys';

/** How many acknowledged alerts the history shows. */
export const ALERT_HISTORY_SIZE = 20;

/** GET /api/alerts?state=acknowledged: the latest acknowledged alerts, newest acknowledgement first. */
export function useAlertHistory() {
  return useQuery({
    queryKey: alertHistoryKey,
    queryFn: ({ signal }) => api.get<AlertDto[]>('/alerts', { signal, query: { state: 'acknowledged', limit: String(ALERT_HISTORY_SIZE) } }),
    staleTime: 5 * 60_000,
  });
}
