import type { CloseOutageRequest, CreateOutageRequest, OutageDto, UpdateOutageRequest } from '@morrowline/shared';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { outagesKey, outagesPrefix } from './outages-keys';

/** GET /api/outages?zone= — a zone's outage and bad-data windows (null: none asked). */
export function useOutages(zone: string | null) {
  return useQuery({
    queryKey: outagesKey(zone),
    queryFn: ({ signal }) => api.get<OutageDto[]>('/outages', { signal, query: { zone: zone ?? '' } }),
    enabled: zone !== null,
    staleTime: 60_000,
  });
}

function useInvalidate() {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: outagesPrefix });
}

/** POST /api/outages (operator, supervisor). */
export function useCreateOutage() {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: (request: CreateOutageRequest) => api.post<OutageDto>('/outages', request), onSuccess: invalidate });
}

/** PATCH /api/outages/:id, with the reason for the change. */
export function useUpdateOutage() {
  const invalidate = useInvalidate();
  return useMutation({
    mutationFn: ({ id, changes }: { id: number; changes: UpdateOutageRequest }) => api.patch<OutageDto>(`/outages/${id}`, changes),
    onSuccess: invalidate,
  });
}

/** POST /api/outages/:id/close — ends an open window (at the end of the current hour unless told). */
export function useCloseOutage() {
  const invalidate = useInvalidate();
  return useMutation({
    mutationFn: ({ id, request }: { id: number; request: CloseOutageRequest }) => api.post<OutageDto>(`/outages/${id}/close`, request),
    onSuccess: invalidate,
  });
}
