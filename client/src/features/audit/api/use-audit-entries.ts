import type { AuditEntryDto, Page } from '@morrowline/shared';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export interface AuditQuery {
  limit: number;
  offset: number;
  /** Exact action name, e.g. "user.role"; empty for all. */
  action: string;
  /** Exact subject type, e.g. "user", "zone"; empty for all. */
  subjectType: string;
}

/** GET /api/audit (supervisor, admin), newest first, a page at a time. */
export function useAuditEntries(query: AuditQuery) {
  return useQuery({
    queryKey: ['audit', query],
    queryFn: ({ signal }) =>
      api.get<Page<AuditEntryDto>>('/audit', {
        signal,
        query: { limit: query.limit, offset: query.offset, action: query.action, subjectType: query.subjectType },
      }),
    // Keep the old page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });
}
