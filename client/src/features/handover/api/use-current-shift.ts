import type { CurrentShiftDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { handoverKeys } from './handover-keys';

/** GET /api/handover/shift: the current and previous shift, and who signed in during this one. */
export function useCurrentShift() {
  return useQuery({
    queryKey: handoverKeys.shift,
    queryFn: ({ signal }) => api.get<CurrentShiftDto>('/handover/shift', { signal }),
    refetchInterval: 60_000,
  });
}
