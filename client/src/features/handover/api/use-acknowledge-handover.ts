import type { AcknowledgeHandoverRequest, HandoverNoteDto } from '@morrowline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { handoverKey, handoverKeys } from './handover-keys';

export interface AcknowledgeVariables {
  id: number;
  reply: string;
}

/** POST /api/handover/:id/acknowledge (operator, supervisor; not the note's author). */
export function useAcknowledgeHandover() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, reply }: AcknowledgeVariables) => {
      const body: AcknowledgeHandoverRequest = reply.trim() ? { reply: reply.trim() } : {};
      return api.post<HandoverNoteDto>(`/handover/${id}/acknowledge`, body);
    },
    onSuccess: (note) => {
      // The banner goes at once; the rest is confirmed by a fresh fetch.
      queryClient.setQueryData<HandoverNoteDto[]>(handoverKeys.pending, (pending) => pending?.filter((n) => n.id !== note.id));
      return queryClient.invalidateQueries({ queryKey: handoverKey });
    },
  });
}
