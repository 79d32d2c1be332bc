import type { HandoverNoteDto, Page } from '@morrowline/shared';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { DateTime } from 'luxon';
import { api } from '../../../lib/api-client';
import { handoverKeys, type HandoverSearch } from './handover-keys';

/** Local calendar days to the server's instants: `to` includes the whole of its day. */
export function searchToQuery(search: HandoverSearch) {
  const from = search.from ? DateTime.fromISO(search.from) : null;
  const to = search.to ? DateTime.fromISO(search.to).plus({ days: 1 }) : null;
  return {
    q: search.q?.trim() || undefined,
    zone: search.zone || undefined,
    from: from?.isValid ? from.toUTC().toISO() : undefined,
    to: to?.isValid ? to.toUTC().toISO() : undefined,
    limit: search.limit,
    offset: search.offset,
  };
}

/** GET /api/handover?q=&zone=&from=&to=: past notes, newest first. */
export function useHandoverSearch(search: HandoverSearch) {
  return useQuery({
    queryKey: handoverKeys.search(search),
    queryFn: ({ signal }) => api.get<Page<HandoverNoteDto>>('/handover', { signal, query: searchToQuery(search) }),
    placeholderData: keepPreviousData,
  });
}
