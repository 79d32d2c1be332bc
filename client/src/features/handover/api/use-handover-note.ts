import type { HandoverNoteWithEventsDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { handoverKeys } from './handover-keys';

/** GET /api/handover/:id: one note with the events of its shift. */
export function useHandoverNote(id: number | null) {
  return useQuery({
    queryKey: handoverKeys.note(id ?? 0),
    queryFn: ({ signal }) => api.get<HandoverNoteWithEventsDto>(`/handover/${id}`, { signal }),
    enabled: id !== null,
  });
}
