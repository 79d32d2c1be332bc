import type { ZoneDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { zonesKey } from './zones-key';

/** GET /api/zones: every signed-in role may read the zones. */
export function useZones() {
  return useQuery({
    queryKey: zonesKey,
    queryFn: ({ signal }) => api.get<ZoneDto[]>('/zones', { signal }),
    staleTime: 5 * 60_000,
  });
}
