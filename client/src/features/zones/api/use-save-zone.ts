import type { CreateZoneRequest, UpdateZoneRequest, ZoneDto } from '@morrowline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { zonesKey } from './zones-key';

/** POST /api/zones (admin). */
export function useCreateZone() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: CreateZoneRequest) => api.post<ZoneDto>('/zones', request),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: zonesKey }),
  });
}

/** PATCH /api/zones/:id (admin). The code is fixed once a zone exists: readings refer to it. */
export function useUpdateZone() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, changes }: { id: number; changes: UpdateZoneRequest }) =>
      api.patch<ZoneDto>(`/zones/${id}`, changes),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: zonesKey }),
  });
}
