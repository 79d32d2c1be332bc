import type {
  AdjustmentResultDto,
  CreateScheduleAdjustmentRequest,
  ScheduleRevisionDto,
  WeatherWhatIfAdjustRequest,
} from '@morrowline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { schedulesKey } from './schedule-keys';

/** Every change refreshes the whole screen: state, values, history and other zones' rows all move together. */
function useScheduleMutation<V, R>(send: (variables: V) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: schedulesKey }),
  });
}

/** POST /:day/:zone/draft — idempotent: answers the working revision if there is one. */
export const useStartDraft = (day: string) =>
  useScheduleMutation((zone: string) => api.post<ScheduleRevisionDto>(`/schedules/${day}/${zone}/draft`));

/** POST /:day/adjustments — one adjustment on one zone or several; all or none. */
export const useAddAdjustment = (day: string) =>
  useScheduleMutation((request: CreateScheduleAdjustmentRequest) => api.post<AdjustmentResultDto>(`/schedules/${day}/adjustments`, request));

/**
 * Several adjustments one after another (POST /:day/adjustments each, every one audited and
 * undoable on its own), the screen refreshed once at the end; stops at the first refusal.
 */
export const useAddAdjustments = (day: string) =>
  useScheduleMutation(async (requests: readonly CreateScheduleAdjustmentRequest[]) => {
    const results: AdjustmentResultDto[] = [];
    for (const request of requests) results.push(await api.post<AdjustmentResultDto>(`/schedules/${day}/adjustments`, request));
    return results;
  });

/** POST /:day/:zone/weather-what-if/adjustments — the what-if as one add per hour, all or none, worked out on the server. */
export const useWhatIfAdjustments = (day: string) =>
  useScheduleMutation(({ zone, request }: { zone: string; request: WeatherWhatIfAdjustRequest }) =>
    api.post<AdjustmentResultDto>(`/schedules/${day}/${zone}/weather-what-if/adjustments`, request),
  );

/** DELETE /adjustment-batches/:id — the adjustments added together from a what-if, undone together. */
export const useUndoAdjustmentBatch = () =>
  useScheduleMutation((batchId: number) => api.delete<ScheduleRevisionDto>(`/schedules/adjustment-batches/${batchId}`));

/** DELETE /adjustments/:id — undo, until the revision is submitted. */
export const useUndoAdjustment = () =>
  useScheduleMutation((id: number) => api.delete<ScheduleRevisionDto>(`/schedules/adjustments/${id}`));

export const useSubmitRevision = () =>
  useScheduleMutation(({ id, comment }: { id: number; comment?: string }) =>
    api.post<ScheduleRevisionDto>(`/schedules/revisions/${id}/submit`, comment ? { comment } : {}),
  );

/** Approval and publication are one step (supervisor, not the submitter). */
export const useApproveRevision = () =>
  useScheduleMutation((id: number) => api.post<ScheduleRevisionDto>(`/schedules/revisions/${id}/approve`));

export const useReturnRevision = () =>
  useScheduleMutation(({ id, comment }: { id: number; comment: string }) =>
    api.post<ScheduleRevisionDto>(`/schedules/revisions/${id}/return`, { comment }),
  );

/** POST /:day/:zone/corrections — a new draft revision from the published values, with a reason. */
export const useStartCorrection = (day: string) =>
  useScheduleMutation(({ zone, reason }: { zone: string; reason: string }) =>
    api.post<ScheduleRevisionDto>(`/schedules/${day}/${zone}/corrections`, { reason }),
  );

/** POST /revisions/:id/back-to-model — every adjustment in force undone, the hours the model's again. */
export const useBackToModel = () =>
  useScheduleMutation((id: number) => api.post<ScheduleRevisionDto>(`/schedules/revisions/${id}/back-to-model`));

/** POST /revisions/:id/restart — the latest forecast run's values, the adjustments in force applied again. */
export const useRestartFromLatest = () =>
  useScheduleMutation((id: number) => api.post<ScheduleRevisionDto>(`/schedules/revisions/${id}/restart`));
