import type { DeskClockDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from './api-client';

/**
 * The desk's time zone (GET /api/clock), for moments that belong to no load zone: the audit
 * trail, sign-ins. Undefined until it has loaded; it does not change while the server runs.
 */
export function useDeskTimeZone(): string | undefined {
  const { data } = useQuery({
    queryKey: ['clock'],
    queryFn: ({ signal }) => api.get<DeskClockDto>('/clock', { signal }),
    staleTime: Infinity,
    retry: false,
  });
  return data?.deskTimeZone;
}
