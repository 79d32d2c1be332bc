import type { HandoverDraftDto } from '@morrowline/shared';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { handoverKeys } from './handover-keys';

/** GET /api/handover/draft (operator, supervisor): this shift's events and the items still open. */
export function useHandoverDraft({ enabled }: { enabled: boolean }) {
  return useQuery({
    queryKey: handoverKeys.draft,
    queryFn: ({ signal }) => api.get<HandoverDraftDto>('/handover/draft', { signal }),
    enabled,
  });
}
