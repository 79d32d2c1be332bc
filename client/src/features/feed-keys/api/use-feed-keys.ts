import type { CreatedFeedKey, CreateFeedKeyRequest, FeedKeyDto } from '@morrowline/shared';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

const feedKeysKey = ['feed-keys'] as const;

/** GET /api/feeds/keys (admin): every key, revoked ones included. */
export function useFeedKeys() {
  return useQuery({
    queryKey: feedKeysKey,
    queryFn: ({ signal }) => api.get<FeedKeyDto[]>('/feeds/keys', { signal }),
  });
}

/** POST /api/feeds/keys (admin): answers the secret this once. */
export function useCreateFeedKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: CreateFeedKeyRequest) => api.post<CreatedFeedKey>('/feeds/keys', request),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: feedKeysKey }),
  });
}

/** POST /api/feeds/keys/:id/revoke (admin), with the reason for the audit trail. */
export function useRevokeFeedKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, reason }: { id: number; reason: string }) => api.post<FeedKeyDto>(`/feeds/keys/${id}/revoke`, { reason }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: feedKeysKey }),
  });
}
