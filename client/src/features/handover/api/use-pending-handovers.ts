import type { HandoverNoteDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { handoverKeys } from './handover-keys';

/** How often the desk asks whether a handover is still waiting (the banner on every screen). */
export const PENDING_POLL_MS = 30_000;

/** GET /api/handover/pending: notes nobody has acknowledged yet, newest first. */
export function usePendingHandovers(enabled = true) {
  return useQuery({
    enabled,
    queryKey: handoverKeys.pending,
    queryFn: ({ signal }) => api.get<HandoverNoteDto[]>('/handover/pending', { signal }),
    refetchInterval: PENDING_POLL_MS,
    staleTime: 10_000,
  });
}
