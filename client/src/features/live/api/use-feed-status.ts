import type { FeedStatusDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { feedStatusKey } from './live-keys';

export const FEED_STATUS_POLL_MS = 60_000;

/** GET /api/readings/status every minute: a silent feed sends no event to say it is silent. */
export function useFeedStatus() {
  return useQuery({
    queryKey: feedStatusKey,
    queryFn: ({ signal }) => api.get<FeedStatusDto[]>('/readings/status', { signal }),
    refetchInterval: FEED_STATUS_POLL_MS,
  });
}
