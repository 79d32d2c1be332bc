import type { ModelCompareDto, ModelVersionDto, PromoteModelRequest, RefitJobDto, StartRefitRequest } from '@morrowline/shared';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { mergeJobs, RECENT_JOBS } from '../model/refit-jobs';
import { modelCompareKey, modelsPrefix, modelVersionsKey, refitJobsKey } from './refit-keys';

/** GET /api/models/refits — the latest jobs of every zone; the live channel keeps them moving. */
export function useRefitJobs() {
  return useQuery({
    queryKey: refitJobsKey,
    queryFn: ({ signal }) => api.get<RefitJobDto[]>('/models/refits', { signal, query: { limit: RECENT_JOBS } }),
  });
}

/** POST /api/models/refits (202): one job per zone, or the zone's job already queued or running. */
export function useStartRefit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: StartRefitRequest) => api.post<RefitJobDto[]>('/models/refits', request),
    onSuccess: (jobs) => {
      queryClient.setQueryData<RefitJobDto[]>(refitJobsKey, (list) => jobs.reduce(mergeJobs, list ?? []));
    },
  });
}

/** GET /api/models?zone= — a zone's model versions, newest first. */
export function useModelVersions(zone: string | null) {
  return useQuery({
    queryKey: modelVersionsKey(zone ?? ''),
    queryFn: ({ signal }) => api.get<ModelVersionDto[]>('/models', { signal, query: { zone: zone ?? '' } }),
    enabled: zone !== null,
  });
}

/** GET /api/models/:id/compare — the version beside the one in service, scored on the same days. */
export function useModelCompare(id: number | null) {
  return useQuery({
    queryKey: modelCompareKey(id ?? 0),
    queryFn: ({ signal }) => api.get<ModelCompareDto>(`/models/${id}/compare`, { signal }),
    enabled: id !== null,
    staleTime: 5 * 60_000,
  });
}

/** POST /api/models/:id/promote — into service (a retired version: the rollback), with a reason. */
export function usePromoteModel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, request }: { id: number; request: PromoteModelRequest }) => api.post<ModelVersionDto>(`/models/${id}/promote`, request),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: modelsPrefix }),
  });
}
