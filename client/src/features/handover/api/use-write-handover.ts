import type { CreateHandoverRequest, HandoverNoteDto } from '@morrowline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { handoverKey } from './handover-keys';

/** POST /api/handover (operator, supervisor): hand the desk over. */
export function useWriteHandover() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: CreateHandoverRequest) => api.post<HandoverNoteDto>('/handover', request),
    // Pending list, draft (carried items), history: all change with a new note.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: handoverKey }),
  });
}
